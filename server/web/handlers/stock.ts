/** Handlers for materials, wheels and machines: the same six routes for each stock kind. */
import { stockListQuery } from '../../../shared/schemas/stock';
import * as stock from '../../services/stock/stock';
import { MACHINES, MATERIALS, WHEELS, type StockKind } from '../../services/stock/records';
import type { RouteHandler } from '../route-definition';
import { bodyOf, idOf, parse } from './parse';
import { actorOf } from './request-actor';

interface StockHandlers {
  list: RouteHandler;
  getOne: RouteHandler;
  create: RouteHandler;
  update: RouteHandler;
  archive: RouteHandler;
  unarchive: RouteHandler;
  remove: RouteHandler;
}

function handlersFor<B, R extends { id: number; archived: boolean; updatedAt: string }>(kind: StockKind<B, R>): StockHandlers {
  return {
    list: async (req, res, { db }) => {
      res.json(await stock.listStock(db, kind, parse(stockListQuery, req.query)));
    },
    getOne: async (req, res, { db }) => {
      res.json(await stock.getStock(db, kind, idOf(req.params)));
    },
    create: async (req, res, { db }) => {
      const body = parse(kind.body, bodyOf(req.body));
      res.status(201).json(await stock.createStock(db, actorOf(req), kind, body));
    },
    update: async (req, res, { db }) => {
      const id = idOf(req.params);
      const body = parse(kind.body, bodyOf(req.body));
      res.json(await stock.updateStock(db, actorOf(req), kind, id, body));
    },
    archive: async (req, res, { db }) => {
      res.json(await stock.archiveStock(db, actorOf(req), kind, idOf(req.params)));
    },
    unarchive: async (req, res, { db }) => {
      res.json(await stock.unarchiveStock(db, actorOf(req), kind, idOf(req.params)));
    },
    remove: async (req, res, { db }) => {
      res.json(await stock.deleteStock(db, actorOf(req), kind, idOf(req.params)));
    },
  };
}

export const materials = handlersFor(MATERIALS);
export const wheels = handlersFor(WHEELS);
export const machines = handlersFor(MACHINES);
