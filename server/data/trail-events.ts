/**
 * Queries on the append-only trail and its chain head. Rows are only ever inserted: the
 * database refuses UPDATE and DELETE on trail_events (its triggers trail_events_refuse_update
 * and trail_events_refuse_delete).
 */
import type { Knex } from 'knex';

/** The one-row table holding the newest row's id and hash: the chain's end. */
export const CHAIN_HEAD_TABLE = 'trail_chain_head';

export interface TrailEventRow {
  occurred_at: Date;
  actor_user_id: number | null;
  actor_name: string;
  event_type: string;
  entity_type: string;
  entity_id: string | null;
  /** Canonical JSON text, or null. */
  before_json: string | null;
  after_json: string | null;
  client_address: string | null;
}

/** A row as the chain stores it. */
export interface ChainedTrailEventRow extends TrailEventRow {
  id: number;
  /** The recipe the event is about (directly or through a version or photo); null otherwise. */
  recipe_id: number | null;
  prev_hash: string;
  hash: string;
}

/** A row as read back: the JSON columns as mysql2 hands them over (text or parsed). */
export interface StoredTrailEventRow extends Omit<ChainedTrailEventRow, 'before_json' | 'after_json'> {
  before_json: unknown;
  after_json: unknown;
}

export interface ChainHead {
  lastEventId: number;
  lastHash: string;
}

/**
 * The chain's end, locked until the calling transaction ends: concurrent appends (from any
 * number of app processes) queue here, so each new row links to the one committed before it.
 */
export async function lockChainHead(trx: Knex.Transaction): Promise<ChainHead> {
  const row = (await trx(CHAIN_HEAD_TABLE).where({ id: 1 }).forUpdate().first('last_event_id', 'last_hash')) as
    { last_event_id: number; last_hash: string } | undefined;
  if (!row) throw new Error('The trail chain head row is missing (run the migrations).');
  return { lastEventId: Number(row.last_event_id), lastHash: row.last_hash };
}

/** The chain's end as a plain (consistent-snapshot) read, for verification. */
export async function readChainHead(db: Knex): Promise<ChainHead> {
  const row = (await db(CHAIN_HEAD_TABLE).where({ id: 1 }).first('last_event_id', 'last_hash')) as { last_event_id: number; last_hash: string } | undefined;
  if (!row) throw new Error('The trail chain head row is missing (run the migrations).');
  return { lastEventId: Number(row.last_event_id), lastHash: row.last_hash };
}

export async function advanceChainHead(trx: Knex.Transaction, head: ChainHead): Promise<void> {
  await trx(CHAIN_HEAD_TABLE).where({ id: 1 }).update({ last_event_id: head.lastEventId, last_hash: head.lastHash });
}

/** Inserts with an explicit id (the head's id + 1, under the head lock), so the hash can cover it. */
export async function insertTrailEvent(trx: Knex.Transaction, row: ChainedTrailEventRow): Promise<void> {
  await trx('trail_events').insert(row);
}

/** The recipe a version belongs to, for events recorded against a version or its photos. */
export async function recipeIdOfVersion(db: Knex, versionId: number): Promise<number | null> {
  const row = (await db('recipe_versions').where({ id: versionId }).first('recipe_id')) as { recipe_id: number } | undefined;
  return row ? row.recipe_id : null;
}

const CHAIN_COLUMNS = [
  'id',
  'occurred_at',
  'actor_user_id',
  'actor_name',
  'event_type',
  'entity_type',
  'entity_id',
  'recipe_id',
  'before_json',
  'after_json',
  'client_address',
  'prev_hash',
  'hash',
] as const;

/** Rows with an id above `afterId`, oldest first: one batch of a walk along the chain. */
export async function chainBatch(db: Knex, afterId: number, limit: number): Promise<StoredTrailEventRow[]> {
  return db('trail_events').where('id', '>', afterId).orderBy('id', 'asc').limit(limit).select(CHAIN_COLUMNS);
}

export interface TrailFilter {
  recipeId?: number;
  userId?: number;
  type?: string;
  /** Event types of one family: any of these codes or code prefixes. */
  family?: { prefixes: readonly string[]; types: readonly string[] };
  /** Code prefixes left out (sign-ins hidden). */
  hidePrefixes?: readonly string[];
  /** Inclusive lower bound (UTC). */
  from?: Date;
  /** Exclusive upper bound (UTC). */
  toBefore?: Date;
  /** Only ids below this one (keyset pagination). */
  beforeId?: number;
}

/** A LIKE pattern for codes starting with `prefix` ("selection_row." has a literal underscore). */
const likePrefix = (prefix: string): string => `${prefix.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * Newest first. Each filter column has an index (InnoDB appends the primary key to every
 * secondary index, so `actor_user_id`, `event_type` and `recipe_id` each serve "this value,
 * id descending" without a sort).
 */
export async function listTrailEventRows(db: Knex, filter: TrailFilter, limit: number): Promise<StoredTrailEventRow[]> {
  const q = db('trail_events').select(CHAIN_COLUMNS).orderBy('id', 'desc').limit(limit);
  if (filter.recipeId !== undefined) q.where('recipe_id', filter.recipeId);
  if (filter.userId !== undefined) q.where('actor_user_id', filter.userId);
  if (filter.type !== undefined) q.where('event_type', filter.type);
  const family = filter.family;
  if (family !== undefined) {
    // Prefix matches are ranges on the event_type index.
    q.where((w) => {
      if (family.types.length > 0) w.orWhereIn('event_type', family.types);
      for (const prefix of family.prefixes) w.orWhere('event_type', 'like', likePrefix(prefix));
    });
  }
  for (const prefix of filter.hidePrefixes ?? []) q.whereNot('event_type', 'like', likePrefix(prefix));
  if (filter.from !== undefined) q.where('occurred_at', '>=', filter.from);
  if (filter.toBefore !== undefined) q.where('occurred_at', '<', filter.toBefore);
  if (filter.beforeId !== undefined) q.where('id', '<', filter.beforeId);
  return q;
}

/** The events of one type recorded against any of these versions, oldest first. */
export async function listVersionEventRows(db: Knex, eventType: string, versionIds: readonly number[]): Promise<StoredTrailEventRow[]> {
  if (versionIds.length === 0) return [];
  return db('trail_events')
    .where({ entity_type: 'recipe_version', event_type: eventType })
    .whereIn('entity_id', versionIds.map(String))
    .orderBy('id', 'asc')
    .select(CHAIN_COLUMNS);
}
