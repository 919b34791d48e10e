/**
 * A cheap fingerprint of everything the app stores: CHECKSUM TABLE of every table (one
 * statement, small test tables) plus the trail's chain head. Two equal fingerprints mean
 * nothing was inserted, changed or deleted in between. `sessions` is left out by default:
 * every request rolls its session's expiry.
 */
import { expect } from 'chai';
import type { Knex } from 'knex';

export type Fingerprint = Record<string, string>;

const NEVER = ['knex_migrations', 'knex_migrations_lock'];

let tableNames: Promise<string[]> | null = null;

async function allTables(db: Knex): Promise<string[]> {
  tableNames ??= db
    .raw("SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name")
    .then(([rows]: [{ name: string }[]]) => rows.map((r) => r.name).filter((n) => !NEVER.includes(n)));
  return tableNames;
}

export async function dbFingerprint(db: Knex, options: { without?: readonly string[] } = {}): Promise<Fingerprint> {
  const without = options.without ?? ['sessions'];
  const tables = (await allTables(db)).filter((t) => !without.includes(t));
  const [rows] = (await db.raw(`CHECKSUM TABLE ${tables.map(() => '??').join(', ')}`, tables)) as [{ Table: string; Checksum: string | number | null }[]];
  const print: Fingerprint = {};
  for (const row of rows) print[row.Table.split('.').pop()!] = String(row.Checksum);
  // The chain head is a table too, but name it outright: the trail must not move.
  const head = await db('trail_chain_head').first('last_event_id', 'last_hash');
  print['trail head'] = `${head?.last_event_id}:${head?.last_hash}`;
  return print;
}

/** The tables whose checksum differs. */
export function changedTables(before: Fingerprint, after: Fingerprint): string[] {
  return Object.keys({ ...before, ...after }).filter((t) => before[t] !== after[t]);
}

export function expectUnchanged(before: Fingerprint, after: Fingerprint, what: string): void {
  expect(changedTables(before, after), `${what} wrote to the database`).to.deep.equal([]);
}
