import { getLabLimits } from '../../services/stock/lab-limits';
import type { RouteHandler } from '../route-definition';

export const limits: RouteHandler = async (_req, res, { db }) => {
  res.json(await getLabLimits(db));
};
