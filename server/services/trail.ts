/**
 * Reading the trail (design 7, "Trail"): the filtered list with keyset pagination, the CSV
 * export and the chain verification (design 4: recompute the chain, name the first broken
 * link). Writing stays in audit.ts.
 */
import type { Knex } from 'knex';
import type { AuditEventDto, AuditPage, ChainVerification } from '../../shared/recipe-types';
import type { AuditQuery } from '../../shared/schemas/workflow';
import { AppError } from '../app-error';
import { type AuditFilter, type StoredAuditEventRow, chainBatch, listAuditEventRows, readChainHead } from '../data/audit-events';
import { CSV_BOM, csvLine } from './csv';
import { type ChainedFields, GENESIS_HASH, trailHash } from './trail-hash';

const json = (value: unknown): unknown => (typeof value === 'string' ? JSON.parse(value) : (value ?? null));

/** A stored row as the fields its hash covers. */
export function chainedFields(row: Omit<StoredAuditEventRow, 'hash'> & { hash?: string }): ChainedFields {
  return {
    id: Number(row.id),
    occurredAt: row.occurred_at,
    actorUserId: row.actor_user_id,
    actorName: row.actor_name,
    eventType: row.event_type,
    entityType: row.entity_type,
    entityId: row.entity_id,
    recipeId: row.recipe_id,
    before: json(row.before_json),
    after: json(row.after_json),
    clientAddress: row.client_address,
    prevHash: row.prev_hash,
  };
}

// ---------------------------------------------------------------------------------------
// Verification

/** Rows read per query while walking the chain: memory stays flat however long the trail. */
export const VERIFY_BATCH = 2000;

/**
 * Walks the whole trail in id order inside one consistent snapshot (rows appended while
 * it runs are neither half-seen nor blamed) and answers the first row that does not hold:
 * its content no longer gives its stored hash, its prev_hash is not the previous row's
 * hash, or the chain head (locked by every append) points past the last row.
 */
export async function verifyChain(db: Knex, batchSize = VERIFY_BATCH): Promise<ChainVerification> {
  return db.transaction(
    async (trx) => {
      const head = await readChainHead(trx);
      let checked = 0;
      let prevHash = GENESIS_HASH;
      let prevId: number | null = null;
      const broken = (id: number, reason: string): ChainVerification => ({ ok: false, checked, firstBroken: { id, reason } });

      // The next batch is asked for before this one is hashed, so the database reads while we
      // hash (npm run bench: chain verification ≥ 100,000 events/s). A read still pending when
      // a broken row ends the walk is awaited first: the transaction must not end under it.
      let pending: Promise<StoredAuditEventRow[]> = chainBatch(trx, 0, batchSize);
      const stop = async (result: ChainVerification): Promise<ChainVerification> => {
        await pending.catch(() => undefined);
        return result;
      };
      for (;;) {
        const rows = await pending;
        if (rows.length === 0) break;
        pending = rows.length < batchSize ? Promise.resolve([]) : chainBatch(trx, Number(rows[rows.length - 1]!.id), batchSize);
        for (const row of rows) {
          const id = Number(row.id);
          // Every append moves the head in the same transaction: a row past it was not appended.
          if (id > head.lastEventId) return stop(broken(id, `row ${id} lies after the chain head (row ${head.lastEventId}): added outside the chain`));
          if (trailHash(chainedFields(row)) !== row.hash) return stop(broken(id, 'stored hash does not match its content'));
          if (row.prev_hash !== prevHash) {
            return stop(broken(id, prevId === null ? 'prev_hash does not match the start of the chain' : `prev_hash does not match row ${prevId}'s hash`));
          }
          checked += 1;
          prevHash = row.hash;
          prevId = id;
        }
      }

      const lastId = prevId ?? 0;
      if (lastId < head.lastEventId) return broken(lastId + 1, `rows after ${lastId} are missing (head mismatch)`);
      if (prevHash !== head.lastHash) return broken(lastId, `row ${lastId}'s hash does not match the chain head`);
      return { ok: true, checked, firstBroken: null };
    },
    { readOnly: true },
  );
}

/** One line for people and logs: the CLI prints it, auditors read it. */
export function describeVerification(result: ChainVerification): string {
  return result.ok || !result.firstBroken
    ? `Trail verified: ${result.checked} events, chain intact.`
    : `Trail BROKEN at event #${result.firstBroken.id}: ${result.firstBroken.reason}`;
}

// ---------------------------------------------------------------------------------------
// List and export

/** YYYY-MM-DD as the UTC midnight that starts it, refusing dates that do not exist (2027-02-31). */
function utcDay(value: string, path: string): Date {
  const day = new Date(`${value}T00:00:00.000Z`);
  if (Number.isNaN(day.getTime()) || day.toISOString().slice(0, 10) !== value) {
    throw AppError.validation([{ path, message: `${value} is not a date on the calendar.` }]);
  }
  return day;
}

const DAY_MS = 86_400_000;

/** The query's filters as bounds: `from` and `to` are whole UTC days, both included. */
function filterOf(query: AuditQuery): AuditFilter {
  const from = query.from === undefined ? undefined : utcDay(query.from, 'from');
  const to = query.to === undefined ? undefined : utcDay(query.to, 'to');
  if (from && to && from > to) throw AppError.validation([{ path: 'to', message: 'The last day must not be before the first.' }]);
  const filter: AuditFilter = {};
  if (query.recipeId !== undefined) filter.recipeId = query.recipeId;
  if (query.userId !== undefined) filter.userId = query.userId;
  if (query.type) filter.type = query.type;
  if (from) filter.from = from;
  if (to) filter.toBefore = new Date(to.getTime() + DAY_MS);
  if (query.before !== undefined) filter.beforeId = query.before;
  return filter;
}

export function toAuditEventDto(row: StoredAuditEventRow): AuditEventDto {
  return {
    id: Number(row.id),
    occurredAt: row.occurred_at.toISOString(),
    actorId: row.actor_user_id,
    actorName: row.actor_name,
    type: row.event_type,
    entityType: row.entity_type,
    entityId: row.entity_id,
    before: json(row.before_json),
    after: json(row.after_json),
    clientAddress: row.client_address,
    prevHash: row.prev_hash,
    hash: row.hash,
  };
}

/** A page, newest first; `nextBefore` is set only when an older row exists. */
export async function listTrail(db: Knex, query: AuditQuery): Promise<AuditPage> {
  const rows = await listAuditEventRows(db, filterOf(query), query.limit + 1);
  const items = rows.slice(0, query.limit).map(toAuditEventDto);
  const more = rows.length > query.limit;
  return { items, nextBefore: more && items.length > 0 ? items[items.length - 1]!.id : null };
}

// CSV (RFC 4180): CRLF line ends, fields quoted when they hold a quote, comma or line break.

const CSV_HEADER = ['id', 'occurred_at_utc', 'actor_id', 'actor_name', 'type', 'entity_type', 'entity_id', 'before', 'after', 'client_address', 'prev_hash', 'hash'];

function csvRow(e: AuditEventDto): string {
  const text = (v: unknown) => (v === null || v === undefined ? null : JSON.stringify(v));
  return csvLine([e.id, e.occurredAt, e.actorId, e.actorName, e.type, e.entityType, e.entityId, text(e.before), text(e.after), e.clientAddress, e.prevHash, e.hash]);
}

export const CSV_BATCH = 1000;

/** kerfbook-trail-20270131.csv, dated by the UTC day of the export. */
export function csvFileName(now = new Date()): string {
  return `kerfbook-trail-${now.toISOString().slice(0, 10).replace(/-/g, '')}.csv`;
}

/**
 * Every row matching the filters (the query's `before` and `limit` are ignored: the export
 * is the whole selection), newest first, as CSV text in chunks. The first batch is read
 * before this resolves, so a bad query or a database outage still gets a proper error
 * answer instead of a cut-off file; after that, rows are read a batch at a time.
 */
export async function openTrailCsv(db: Knex, query: AuditQuery, batchSize = CSV_BATCH): Promise<AsyncIterable<string>> {
  const { beforeId: _ignored, ...filter } = filterOf(query);
  const first = await listAuditEventRows(db, filter, batchSize);
  async function* chunks(): AsyncGenerator<string> {
    yield CSV_BOM + csvLine(CSV_HEADER);
    let rows = first;
    while (rows.length > 0) {
      yield rows.map((r) => csvRow(toAuditEventDto(r))).join('');
      if (rows.length < batchSize) return;
      rows = await listAuditEventRows(db, { ...filter, beforeId: Number(rows[rows.length - 1]!.id) }, batchSize);
    }
  }
  return chunks();
}
