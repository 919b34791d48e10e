import type { ApiErrorBody } from '../../../shared/api-error';
import type { RouteHandler } from '../route-definition';

/** Up when the database answers; load balancers poll this. */
export const check: RouteHandler = async (_req, res, { db }) => {
  try {
    await db.raw('select 1');
  } catch {
    const body: ApiErrorBody = { code: 'DATABASE_UNAVAILABLE', errors: [{ path: '', message: 'The database is not reachable.' }] };
    res.status(503).json(body);
    return;
  }
  res.json({ ok: true });
};
