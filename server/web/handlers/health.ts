import type { RouteHandler } from '../route-definition';

/** Up when the database answers; load balancers poll this. */
export const check: RouteHandler = async (_req, res, { db }) => {
  try {
    await db.raw('select 1');
  } catch {
    res.status(503).json({ code: 'DATABASE_UNAVAILABLE', errors: [{ path: '', message: 'The database is not reachable.' }] });
    return;
  }
  res.json({ ok: true });
};
