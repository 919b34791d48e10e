/** Handlers for materials, wheels and machines: the same seven routes for each stock kind. */
import type { z } from 'zod';
import type { idParams } from '../../../shared/schemas/params';
import type { stockListQuery } from '../../../shared/schemas/stock';
import * as stock from '../../services/stock/stock';
import { MACHINES, MATERIALS, WHEELS, type StockKind } from '../../services/stock/records';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

interface StockHandlers<B> {
  list: RouteHandler<{ query: typeof stockListQuery }>;
  getOne: RouteHandler<{ params: typeof idParams }>;
  create: RouteHandler<{ body: z.ZodType<B> }>;
  update: RouteHandler<{ params: typeof idParams; body: z.ZodType<B> }>;
  archive: RouteHandler<{ params: typeof idParams }>;
  unarchive: RouteHandler<{ params: typeof idParams }>;
  remove: RouteHandler<{ params: typeof idParams }>;
}

/** The route lines declare each kind's body schema; the router validates it. */
function handlersFor<B, R extends { id: number; archived: boolean; updatedAt: string }>(kind: StockKind<B, R>): StockHandlers<B> {
  return {
    list: async (_req, res, { db }, { query }) => {
      res.json(await stock.listStock(db, kind, query));
    },
    getOne: async (_req, res, { db }, { params }) => {
      res.json(await stock.getStock(db, kind, params.id));
    },
    create: async (req, res, { db }, { body }) => {
      res.status(201).json(await stock.createStock(db, actorOf(req), kind, body));
    },
    update: async (req, res, { db }, { params, body }) => {
      res.json(await stock.updateStock(db, actorOf(req), kind, params.id, body));
    },
    archive: async (req, res, { db }, { params }) => {
      res.json(await stock.archiveStock(db, actorOf(req), kind, params.id));
    },
    unarchive: async (req, res, { db }, { params }) => {
      res.json(await stock.unarchiveStock(db, actorOf(req), kind, params.id));
    },
    remove: async (req, res, { db }, { params }) => {
      res.json(await stock.deleteStock(db, actorOf(req), kind, params.id));
    },
  };
}

export const materials = handlersFor(MATERIALS);
export const wheels = handlersFor(WHEELS);
export const machines = handlersFor(MACHINES);
