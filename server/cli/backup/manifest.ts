/**
 * The small JSON file beside the dump in every backup: what it holds, so that a restore can
 * refuse a file that is not ours, damaged or from a newer schema, and check what it loaded.
 * Facts are read under the same table locks as the dump's snapshot (make-backup.ts).
 */
import type mysql from 'mysql2/promise';
import { z } from 'zod';
import { quoteName } from './mariadb-clients';

export const BACKUP_FORMAT = 'kerfbook-backup';
export const MANIFEST_FILE = 'manifest.json';
export const DUMP_FILE = 'dump.sql';

const count = z.number().int().min(0);

export const manifestSchema = z.object({
  format: z.literal(BACKUP_FORMAT),
  formatVersion: z.literal(1),
  createdAt: z.string(),
  database: z.string(),
  server: z.string(),
  schema: z.object({ latestMigration: z.string().min(1), migrations: count }),
  rowCounts: z.record(z.string(), count),
  triggers: z.array(z.string()),
  /** The chain head; null for a schema older than the chain (20261201230150_chain_audit_events). */
  trail: z.object({ events: count, headEventId: count, headHash: z.string().regex(/^[0-9a-f]{64}$/) }).nullable(),
  /** Photos live in MariaDB (attachments.data, migration create_attachments): no files on disk. */
  attachments: z.object({ storedIn: z.literal('database'), count, bytes: count }),
  dump: z.object({ file: z.literal(DUMP_FILE), bytes: count, sha256: z.string().regex(/^[0-9a-f]{64}$/) }),
});
export type Manifest = z.infer<typeof manifestSchema>;

/** What the manifest says about the database itself (not about the dump file). */
export type DatabaseFacts = Omit<Manifest, 'format' | 'formatVersion' | 'createdAt' | 'dump'>;

type Rows = mysql.RowDataPacket[];

/**
 * The trail's two tables under today's names, then under the names they had before the
 * migration rename_audit_tables_to_trail: an older backup still restores (and is migrated).
 */
const TRAIL_TABLE_NAMES = [
  { events: 'trail_events', head: 'trail_chain_head' },
  { events: 'audit_events', head: 'audit_chain_head' },
];

export async function baseTables(c: mysql.Connection, database: string): Promise<string[]> {
  const [rows] = await c.query<Rows>(
    `SELECT TABLE_NAME AS name FROM information_schema.TABLES WHERE TABLE_SCHEMA = ? AND TABLE_TYPE = 'BASE TABLE' ORDER BY TABLE_NAME`,
    [database],
  );
  return rows.map((r) => String(r['name']));
}

export async function triggerNames(c: mysql.Connection, database: string): Promise<string[]> {
  const [rows] = await c.query<Rows>(`SELECT TRIGGER_NAME AS name FROM information_schema.TRIGGERS WHERE TRIGGER_SCHEMA = ? ORDER BY TRIGGER_NAME`, [database]);
  return rows.map((r) => String(r['name']));
}

/** Row counts, schema, trail head and photo totals of `database`; the connection may hold table locks. */
export async function readFacts(c: mysql.Connection, database: string, tables: string[]): Promise<DatabaseFacts> {
  const db = quoteName(database);
  // Older schemas are backed up too (a backup before an upgrade): only the migration table is required.
  if (!tables.includes('knex_migrations')) throw new Error(`${database} is not a migrated Kerfbook database (no knex_migrations table).`);

  const rowCounts: Record<string, number> = {};
  for (const t of tables) {
    const [rows] = await c.query<Rows>(`SELECT COUNT(*) AS n FROM ${db}.${quoteName(t)}`);
    rowCounts[t] = Number(rows[0]!['n']);
  }
  const [[latest]] = await c.query<Rows>(`SELECT name FROM ${db}.knex_migrations ORDER BY id DESC LIMIT 1`);
  if (!latest) throw new Error(`${database} has no migrations recorded.`);
  let trail: DatabaseFacts['trail'] = null;
  const names = TRAIL_TABLE_NAMES.find((n) => tables.includes(n.head));
  if (names) {
    const [[head]] = await c.query<Rows>(`SELECT last_event_id, last_hash FROM ${db}.${quoteName(names.head)} WHERE id = 1`);
    if (!head) throw new Error(`${database} has no trail chain head.`);
    trail = { events: rowCounts[names.events] ?? 0, headEventId: Number(head['last_event_id']), headHash: String(head['last_hash']) };
  }
  let photos = { n: 0, bytes: 0 };
  if (tables.includes('attachments')) {
    const [[row]] = await c.query<Rows>(`SELECT COUNT(*) AS n, COALESCE(SUM(size_bytes), 0) AS bytes FROM ${db}.attachments`);
    photos = { n: Number(row!['n']), bytes: Number(row!['bytes']) };
  }
  const [[version]] = await c.query<Rows>('SELECT VERSION() AS v');
  return {
    database,
    server: String(version!['v']),
    schema: { latestMigration: String(latest['name']), migrations: rowCounts['knex_migrations'] ?? 0 },
    rowCounts,
    triggers: await triggerNames(c, database),
    trail,
    attachments: { storedIn: 'database', count: photos.n, bytes: photos.bytes },
  };
}
