/** Helpers for the trail tests: read the chain, tamper with it the way only a DBA could. */
import type { Knex } from 'knex';
import { chainedFields } from '../../../server/services/trail/stored-row';
import { trailHash } from '../../../server/services/trail/hash';

export interface ChainRow {
  id: number;
  event_type: string;
  prev_hash: string;
  hash: string;
  recipe_id: number | null;
  [column: string]: unknown;
}

export async function chainRows(db: Knex, afterId = 0): Promise<ChainRow[]> {
  return db('trail_events').where('id', '>', afterId).orderBy('id') as Promise<ChainRow[]>;
}

export async function lastEventId(db: Knex): Promise<number> {
  const row = (await db('trail_events').max({ m: 'id' }).first()) as { m: number | null } | undefined;
  return Number(row?.m ?? 0);
}

/** True when each row's stored hash is its content's hash and its prev_hash the row before's. */
export function linksHold(rows: ChainRow[], prevHash: string): { ok: true } | { ok: false; id: number; why: string } {
  let prev = prevHash;
  for (const row of rows) {
    if (row.prev_hash !== prev) return { ok: false, id: row.id, why: 'link' };
    if (trailHash(chainedFields(row as never)) !== row.hash) return { ok: false, id: row.id, why: 'content' };
    prev = row.hash;
  }
  return { ok: true };
}

/**
 * Runs `change` with one of the trail's append-only triggers dropped, then puts the trigger
 * back exactly as it was (its original CREATE statement, read from MariaDB first) — what
 * someone with the database's admin rights could do.
 */
export async function withoutTrigger<T>(db: Knex, trigger: 'trail_events_refuse_update' | 'trail_events_refuse_delete', change: () => Promise<T>): Promise<T> {
  const [rows] = (await db.raw(`SHOW CREATE TRIGGER ${trigger}`)) as [Record<string, string>[]];
  const statement = rows[0]!['SQL Original Statement']!;
  await db.raw(`DROP TRIGGER ${trigger}`);
  try {
    return await change();
  } finally {
    await db.raw(statement);
  }
}

/** A JSON column's value as text again (mysql2 may hand it over parsed), for writing it back. */
export function jsonText(value: unknown): string | null {
  return value === null || value === undefined ? null : typeof value === 'string' ? value : JSON.stringify(value);
}

/** A row as read, ready to be inserted again exactly as it was. */
export function insertable(row: ChainRow): Record<string, unknown> {
  return { ...row, before_json: jsonText(row['before_json']), after_json: jsonText(row['after_json']) };
}
