import type { versionParams } from '../../../shared/schemas/params';
import * as acknowledgements from '../../services/recipes/acknowledgements';
import { versionScopeOf } from '../../services/operator/visibility';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

/** POST /api/recipes/:id/versions/:n/acknowledge (the body is `{}`; nothing in it is read). */
export const acknowledge: RouteHandler<{ params: typeof versionParams }> = async (req, res, { db }, { params: { id, n } }) => {
  const viewer = { id: req.user!.id, roles: req.user!.roles };
  res.json(await acknowledgements.acknowledgeVersion(db, actorOf(req), viewer, versionScopeOf(req.user?.roles), id, n));
};

/** GET /api/recipes/:id/versions/:n/acknowledgements */
export const list: RouteHandler<{ params: typeof versionParams }> = async (req, res, { db }, { params: { id, n } }) => {
  res.json(await acknowledgements.listAcknowledgements(db, versionScopeOf(req.user?.roles), id, n));
};

/** GET /api/recipes/:id/versions/:n/changes-since-acknowledged */
export const changesSince: RouteHandler<{ params: typeof versionParams }> = async (req, res, { db }, { params: { id, n } }) => {
  const viewer = { id: req.user!.id, roles: req.user!.roles };
  res.json(await acknowledgements.changesSinceAcknowledged(db, viewer, versionScopeOf(req.user?.roles), id, n, req.user?.units ?? 'metric'));
};
