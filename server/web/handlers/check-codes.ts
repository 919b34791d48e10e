import { z } from 'zod';
import { checkCodeParam } from '../../../shared/schemas/operator';
import { checkCode } from '../../services/recipes/check-codes';
import type { RouteHandler } from '../route-definition';
import { parse } from './parse';

const params = z.object({ code: checkCodeParam });

/** GET /api/check/:code — is the printed sheet with this code still the one to use? */
export const check: RouteHandler = async (req, res, { db }) => {
  const { code } = parse(params, req.params);
  res.json(await checkCode(db, code));
};
