import type { labSettingsBody } from '../../../shared/schemas/lab-settings';
import { getLabSettings, updateLabSettings } from '../../services/lab-settings/lab-settings';
import { getLabLimits } from '../../services/stock/lab-limits';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

export const limits: RouteHandler = async (_req, res, { db }) => {
  res.json(await getLabLimits(db));
};

export const lab: RouteHandler = async (_req, res, { db }) => {
  res.json(await getLabSettings(db));
};

export const updateLab: RouteHandler<{ body: typeof labSettingsBody }> = async (req, res, { db }, { body }) => {
  res.json(await updateLabSettings(db, actorOf(req), body));
};
