import type { cutRecordBody, cutSearchQuery } from '../../../shared/schemas/operator';
import type { cutParams, versionParams } from '../../../shared/schemas/params';
import * as cuts from '../../services/operator/cuts';
import { versionScopeOf } from '../../services/operator/visibility';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

export const record: RouteHandler<{ params: typeof versionParams; body: typeof cutRecordBody }> = async (
  req,
  res,
  { db, mail },
  { params: { id, n }, body },
) => {
  res.status(201).json(await cuts.recordCut(db, actorOf(req), versionScopeOf(req.user?.roles), id, n, body, new Date(), mail));
};

export const listOfVersion: RouteHandler<{ params: typeof versionParams }> = async (req, res, { db }, { params: { id, n } }) => {
  res.json(await cuts.listVersionCuts(db, versionScopeOf(req.user?.roles), id, n));
};

export const csv: RouteHandler<{ params: typeof versionParams }> = async (req, res, { db }, { params: { id, n } }) => {
  const file = await cuts.versionCutsCsv(db, versionScopeOf(req.user?.roles), id, n);
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(file.text);
};

export const search: RouteHandler<{ query: typeof cutSearchQuery }> = async (_req, res, { db }, { query }) => {
  res.json(await cuts.traceSpecimen(db, query.specimenId));
};

export const clearFlag: RouteHandler<{ params: typeof cutParams }> = async (req, res, { db }, { params }) => {
  res.json(await cuts.clearFlag(db, actorOf(req), params.cutId));
};
