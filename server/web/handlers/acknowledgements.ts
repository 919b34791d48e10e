import { z } from 'zod';
import { idParam } from '../../../shared/schemas/fields';
import * as acknowledgements from '../../services/recipes/acknowledgements';
import { versionScopeOf } from '../../services/operator/visibility';
import type { RouteHandler } from '../route-definition';
import { parse } from './parse';
import { actorOf } from './request-actor';

const versionParams = z.object({ id: idParam, n: idParam });

/** POST /api/recipes/:id/versions/:n/acknowledge (the body is `{}`; nothing in it is read). */
export const acknowledge: RouteHandler = async (req, res, { db }) => {
  const { id, n } = parse(versionParams, req.params);
  const viewer = { id: req.user!.id, roles: req.user!.roles };
  res.json(await acknowledgements.acknowledgeVersion(db, actorOf(req), viewer, versionScopeOf(req.user?.roles), id, n));
};

/** GET /api/recipes/:id/versions/:n/acknowledgements */
export const list: RouteHandler = async (req, res, { db }) => {
  const { id, n } = parse(versionParams, req.params);
  res.json(await acknowledgements.listAcknowledgements(db, versionScopeOf(req.user?.roles), id, n));
};
