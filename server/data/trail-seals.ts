/**
 * Seals of the trail's chain head as the database knows them: a claim per sealed head
 * (unique head id), so that of several app processes exactly one writes each seal. The
 * seals that count live outside the database (seal file, mails); these rows only schedule.
 */
import type { Knex } from 'knex';

export interface TrailSealRow {
  id: number;
  head_event_id: number;
  head_hash: string;
  event_count: number;
  reason: string;
  sealed_at: Date;
}

/** Named lock (MariaDB GET_LOCK) held while one seal is claimed and written, across every app process. */
const SEAL_LOCK = 'kerfbook.trail_seal';

/** Waits up to `seconds` for the seal lock on the transaction's connection; false when another writer kept it. */
export async function takeSealLock(trx: Knex.Transaction, seconds: number): Promise<boolean> {
  const [rows] = (await trx.raw('SELECT GET_LOCK(?, ?) AS got', [SEAL_LOCK, seconds])) as [{ got: number | null }[]];
  return Number(rows[0]?.got) === 1;
}

export async function releaseSealLock(trx: Knex.Transaction): Promise<void> {
  await trx.raw('SELECT RELEASE_LOCK(?)', [SEAL_LOCK]);
}

/** Claims the head: true when this call inserted it, false when it was sealed before. */
export async function claimSeal(trx: Knex.Transaction, row: Omit<TrailSealRow, 'id'>): Promise<boolean> {
  const [result] = (await trx.raw('INSERT IGNORE INTO trail_seals (head_event_id, head_hash, event_count, reason, sealed_at) VALUES (?, ?, ?, ?, ?)', [
    row.head_event_id,
    row.head_hash,
    row.event_count,
    row.reason,
    row.sealed_at,
  ])) as [{ affectedRows: number }];
  return result.affectedRows === 1;
}

export async function newestSeal(db: Knex): Promise<TrailSealRow | undefined> {
  return db<TrailSealRow>('trail_seals').orderBy('id', 'desc').first();
}

export async function countTrailEvents(db: Knex): Promise<number> {
  const row = (await db('trail_events').count({ n: '*' }).first()) as { n: number | string } | undefined;
  return Number(row?.n ?? 0);
}

/** The stored hash of each of these events that still exists, by id. */
export async function trailEventHashes(db: Knex, ids: readonly number[]): Promise<Map<number, string>> {
  const found = new Map<number, string>();
  for (let i = 0; i < ids.length; i += 1000) {
    const rows = (await db('trail_events')
      .whereIn('id', ids.slice(i, i + 1000))
      .select('id', 'hash')) as { id: number; hash: string }[];
    for (const r of rows) found.set(Number(r.id), r.hash);
  }
  return found;
}
