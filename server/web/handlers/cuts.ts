import { z } from 'zod';
import { idParam } from '../../../shared/schemas/fields';
import { cutRecordBody, cutSearchQuery } from '../../../shared/schemas/operator';
import * as cuts from '../../services/operator/cuts';
import { versionScopeOf } from '../../services/operator/visibility';
import type { RouteHandler } from '../route-definition';
import { bodyOf, parse } from './parse';
import { actorOf } from './request-actor';

const versionParams = z.object({ id: idParam, n: idParam });
const cutParams = z.object({ cutId: idParam });

export const record: RouteHandler = async (req, res, { db, mail }) => {
  const { id, n } = parse(versionParams, req.params);
  const body = parse(cutRecordBody, bodyOf(req.body));
  res.status(201).json(await cuts.recordCut(db, actorOf(req), versionScopeOf(req.user?.roles), id, n, body, new Date(), mail));
};

export const listOfVersion: RouteHandler = async (req, res, { db }) => {
  const { id, n } = parse(versionParams, req.params);
  res.json(await cuts.listVersionCuts(db, versionScopeOf(req.user?.roles), id, n));
};

export const csv: RouteHandler = async (req, res, { db }) => {
  const { id, n } = parse(versionParams, req.params);
  const file = await cuts.versionCutsCsv(db, versionScopeOf(req.user?.roles), id, n);
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(file.text);
};

export const search: RouteHandler = async (req, res, { db }) => {
  res.json(await cuts.traceSpecimen(db, parse(cutSearchQuery, req.query).specimenId));
};

export const clearFlag: RouteHandler = async (req, res, { db }) => {
  const { cutId } = parse(cutParams, req.params);
  res.json(await cuts.clearFlag(db, actorOf(req), cutId));
};
