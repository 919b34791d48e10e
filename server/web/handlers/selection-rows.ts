import { selectionRowBody } from '../../../shared/schemas/stock';
import * as selection from '../../services/stock/selection-rows';
import type { RouteHandler } from '../route-definition';
import { bodyOf, idOf, parse } from './parse';
import { actorOf } from './request-actor';

export const list: RouteHandler = async (_req, res, { db }) => {
  res.json(await selection.listSelectionRows(db));
};

export const create: RouteHandler = async (req, res, { db }) => {
  const body = parse(selectionRowBody, bodyOf(req.body));
  res.status(201).json(await selection.createSelectionRow(db, actorOf(req), body));
};

export const update: RouteHandler = async (req, res, { db }) => {
  const id = idOf(req.params);
  const body = parse(selectionRowBody, bodyOf(req.body));
  res.json(await selection.updateSelectionRow(db, actorOf(req), id, body));
};

export const remove: RouteHandler = async (req, res, { db }) => {
  await selection.deleteSelectionRow(db, actorOf(req), idOf(req.params));
  res.status(204).end();
};
