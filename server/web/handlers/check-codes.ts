import type { checkCodeParams } from '../../../shared/schemas/params';
import { checkCode } from '../../services/recipes/check-codes';
import type { RouteHandler } from '../route-definition';

/** GET /api/check/:code — is the printed sheet with this code still the one to use? */
export const check: RouteHandler<{ params: typeof checkCodeParams }> = async (_req, res, { db }, { params }) => {
  res.json(await checkCode(db, params.code));
};
