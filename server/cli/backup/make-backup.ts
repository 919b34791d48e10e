/**
 * One backup of a Kerfbook database: a consistent `mariadb-dump` plus a manifest (time,
 * schema, row counts, trail chain head, photo totals) packed as one .tar.gz.
 *
 * The dump reads one snapshot (--single-transaction), so the app may keep running. The
 * manifest must describe that same snapshot, or a restore would reject a good backup: its
 * facts are read while every table is READ-locked, and the locks are let go only once the
 * dump has begun writing tables, i.e. after its snapshot started. Writers wait for that
 * moment only (tens of milliseconds), never for the whole dump.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { ROOT } from '../../tools/project-files';
import { packBackup, tempFolder } from './archive';
import { connect, parseDatabaseUrl, quoteName, startDump } from './mariadb-clients';
import { BACKUP_FORMAT, DUMP_FILE, MANIFEST_FILE, baseTables, readFacts, type Manifest } from './manifest';

export const BACKUP_DIR = path.join(ROOT, 'backups');

export interface BackupOptions {
  /** Folder for the file; default `backups/` in the project. */
  dir?: string;
  /** Added to the file name, e.g. `before-restore`. */
  label?: string;
}

export interface BackupResult {
  file: string;
  manifest: Manifest;
}

/** `kerfbook-2026-12-02T03-04-05Z.tar.gz`, with -2, -3… when that name is taken. */
function fileName(dir: string, database: string, at: Date, label?: string): string {
  const stamp = at
    .toISOString()
    .replace(/\.\d+Z$/, 'Z')
    .replace(/:/g, '-');
  const base = `${database}-${stamp}${label ? `-${label}` : ''}`;
  for (let n = 1; ; n++) {
    const file = path.join(dir, `${base}${n > 1 ? `-${n}` : ''}.tar.gz`);
    if (!fs.existsSync(file) && !fs.existsSync(`${file}.partial`)) return file;
  }
}

/** Passes the dump through, hashing it, and says when the first table definition goes by. */
function watchDump(onTables: () => void): { stream: Transform; sha256: () => string; bytes: () => number } {
  const hash = createHash('sha256');
  let bytes = 0;
  let tail = Buffer.alloc(0);
  let seen = false;
  const stream = new Transform({
    transform(chunk: Buffer, _enc, done) {
      hash.update(chunk);
      bytes += chunk.length;
      if (!seen) {
        const window = Buffer.concat([tail, chunk]);
        if (window.includes('CREATE TABLE')) {
          seen = true;
          onTables();
        }
        tail = window.subarray(-16);
      }
      done(null, chunk);
    },
  });
  return { stream, sha256: () => hash.digest('hex'), bytes: () => bytes };
}

export async function makeBackup(databaseUrl: string, options: BackupOptions = {}): Promise<BackupResult> {
  const address = parseDatabaseUrl(databaseUrl);
  const dir = path.resolve(options.dir ?? BACKUP_DIR);
  const folder = tempFolder('backup');
  const c = await connect(address);
  try {
    const tables = await baseTables(c, address.database);
    if (tables.length === 0) throw new Error(`${address.database} has no tables: nothing to back up.`);
    const createdAt = new Date();

    // A writer holding a lock for longer than this makes the backup fail rather than hang.
    await c.query('SET SESSION lock_wait_timeout = 30');
    await c.query(`LOCK TABLES ${tables.map((t) => `${quoteName(t)} READ`).join(', ')}`);
    let unlocked: Promise<unknown> | null = null;
    const unlock = () => (unlocked ??= c.query('UNLOCK TABLES'));
    let facts;
    let watch;
    try {
      facts = await readFacts(c, address.database, tables);
      const dump = startDump(address);
      watch = watchDump(() => void unlock());
      await Promise.all([pipeline(dump.stdout, watch.stream, fs.createWriteStream(path.join(folder, DUMP_FILE))), dump.done]);
    } finally {
      await unlock();
    }

    const manifest: Manifest = {
      format: BACKUP_FORMAT,
      formatVersion: 1,
      createdAt: createdAt.toISOString(),
      ...facts,
      dump: { file: DUMP_FILE, bytes: watch.bytes(), sha256: watch.sha256() },
    };
    fs.writeFileSync(path.join(folder, MANIFEST_FILE), `${JSON.stringify(manifest, null, 2)}\n`);
    const file = fileName(dir, address.database, createdAt, options.label);
    await packBackup(folder, file);
    return { file, manifest };
  } finally {
    await c.end().catch(() => undefined);
    fs.rmSync(folder, { recursive: true, force: true });
  }
}
