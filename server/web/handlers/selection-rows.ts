import type { idParams } from '../../../shared/schemas/params';
import type { selectionRowBody } from '../../../shared/schemas/stock';
import * as selection from '../../services/stock/selection-rows';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

export const list: RouteHandler = async (_req, res, { db }) => {
  res.json(await selection.listSelectionRows(db));
};

export const create: RouteHandler<{ body: typeof selectionRowBody }> = async (req, res, { db }, { body }) => {
  res.status(201).json(await selection.createSelectionRow(db, actorOf(req), body));
};

export const update: RouteHandler<{ params: typeof idParams; body: typeof selectionRowBody }> = async (req, res, { db }, { params, body }) => {
  res.json(await selection.updateSelectionRow(db, actorOf(req), params.id, body));
};

export const remove: RouteHandler<{ params: typeof idParams }> = async (req, res, { db }, { params }) => {
  await selection.deleteSelectionRow(db, actorOf(req), params.id);
  res.status(204).end();
};
