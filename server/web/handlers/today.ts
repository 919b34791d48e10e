import { getToday } from '../../services/operator/today';
import type { RouteHandler } from '../route-definition';

export const today: RouteHandler = async (req, res, { db }) => {
  res.json(await getToday(db, { id: req.user!.id, roles: req.user!.roles }));
};
