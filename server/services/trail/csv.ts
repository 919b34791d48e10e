/** The trail as a CSV download: every row the filters select, newest first. */
import type { Knex } from 'knex';
import type { TrailEventDto } from '../../../shared/recipe-types';
import type { TrailQuery } from '../../../shared/schemas/workflow';
import { utcDay } from '../../../shared/calendar-dates';
import { listTrailEventRows } from '../../data/trail-events';
import { CSV_BOM, csvLine } from '../csv';
import { filterOf } from './query';
import { toTrailEventDto } from './stored-row';

// CSV (RFC 4180): CRLF line ends, fields quoted when they hold a quote, comma or line break.

const CSV_HEADER = [
  'id',
  'occurred_at_utc',
  'actor_id',
  'actor_name',
  'type',
  'entity_type',
  'entity_id',
  'before',
  'after',
  'client_address',
  'prev_hash',
  'hash',
];

function csvRow(e: TrailEventDto): string {
  const text = (v: unknown) => (v === null || v === undefined ? null : JSON.stringify(v));
  return csvLine([
    e.id,
    e.occurredAt,
    e.actorId,
    e.actorName,
    e.type,
    e.entityType,
    e.entityId,
    text(e.before),
    text(e.after),
    e.clientAddress,
    e.prevHash,
    e.hash,
  ]);
}

export const CSV_BATCH = 1000;

/** kerfbook-trail-20270131.csv, dated by the UTC day of the export. */
export function csvFileName(now = new Date()): string {
  return `kerfbook-trail-${utcDay(now).replace(/-/g, '')}.csv`;
}

/**
 * Every row matching the filters (the query's `before` and `limit` are ignored: the export
 * is the whole selection), newest first, as CSV text in chunks. The first batch is read
 * before this resolves, so a bad query or a database outage still gets a proper error
 * answer instead of a cut-off file; after that, rows are read a batch at a time.
 */
export async function openTrailCsv(db: Knex, query: TrailQuery, batchSize = CSV_BATCH): Promise<AsyncIterable<string>> {
  const { beforeId: _ignored, ...filter } = filterOf(query);
  const first = await listTrailEventRows(db, filter, batchSize);
  async function* chunks(): AsyncGenerator<string> {
    yield CSV_BOM + csvLine(CSV_HEADER);
    let rows = first;
    while (rows.length > 0) {
      yield rows.map((r) => csvRow(toTrailEventDto(r))).join('');
      if (rows.length < batchSize) return;
      rows = await listTrailEventRows(db, { ...filter, beforeId: Number(rows[rows.length - 1]!.id) }, batchSize);
    }
  }
  return chunks();
}
