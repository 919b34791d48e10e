import type { TodayDto } from '../../../shared/recipe-types';
import { getToday } from '../../services/operator/today';
import type { RouteHandler } from '../route-definition';

export const today: RouteHandler = async (req, res, { db, adminNotices }) => {
  const roles = req.user!.roles;
  const dto: TodayDto = { ...(await getToday(db, { id: req.user!.id, roles })), notices: roles.includes('admin') ? [...adminNotices] : [] };
  res.json(dto);
};
