import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { trailQuery } from '../../../shared/schemas/workflow';
import { csvFileName, openTrailCsv } from '../../services/trail/csv';
import { listTrail } from '../../services/trail/query';
import { listPeople } from '../../services/trail/people';
import { verifyChain } from '../../services/trail/verify';
import type { RouteHandler } from '../route-definition';

export const list: RouteHandler<{ query: typeof trailQuery }> = async (_req, res, { db }, { query }) => {
  res.json(await listTrail(db, query));
};

export const csv: RouteHandler<{ query: typeof trailQuery }> = async (req, res, { db }, { query }) => {
  const chunks = await openTrailCsv(db, query);
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${csvFileName()}"`);
  // A trail export is a record of its moment: never serve it from a cache.
  res.setHeader('Cache-Control', 'no-store');
  // pipeline waits for the client to keep up, so a long trail never piles up in memory.
  try {
    await pipeline(Readable.from(chunks), res);
  } catch (err) {
    // The client went away mid-download: nothing left to answer, nothing wrong on our side.
    if (req.destroyed || (err as { code?: string }).code === 'ERR_STREAM_PREMATURE_CLOSE') return;
    throw err;
  }
};

export const verify: RouteHandler = async (_req, res, { db }) => {
  res.json(await verifyChain(db));
};

export const people: RouteHandler = async (_req, res, { db }) => {
  res.json({ items: await listPeople(db) });
};
