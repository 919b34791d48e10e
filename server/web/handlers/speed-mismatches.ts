import { listSpeedMismatches } from '../../services/stock/speed-mismatches';
import type { RouteHandler } from '../route-definition';

export const list: RouteHandler = async (_req, res, { db }) => {
  res.json(await listSpeedMismatches(db));
};
