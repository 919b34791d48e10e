/**
 * Replaces a Kerfbook database with a backup, in an order where any failure leaves the
 * database as it was:
 *
 *  1. the file is checked (ours, whole, dump matching its SHA-256, schema not newer than
 *     this code) and nobody else is connected to the database;
 *  2. the dump is loaded into a fresh scratch database `<db>_restore` (the dump creates
 *     each table's triggers after its rows, so the freeze triggers never see the restore);
 *  3. the scratch copy is verified: row counts, triggers and chain head equal the
 *     manifest's; an older schema is migrated; the trail chain verifies (verifyChain);
 *  4. the current contents are saved as a backup (`…-before-restore.tar.gz`);
 *  5. the scratch tables are swapped in (swap-tables.ts) through `<db>_previous`, and the
 *     two scratch databases are dropped;
 *  6. the accounts' grants are made again (on the local MariaDB) and the app's account is
 *     checked to read every restored table.
 *
 * It runs as the owner account (the migrations' one: it drops and makes triggers). When the
 * app has an account of its own, that one is asked too whether it is connected: an account
 * without the PROCESS privilege sees only its own connections.
 */
import fs from 'node:fs';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type mysql from 'mysql2/promise';
import type { ChainVerification } from '../../../shared/recipe-types';
import { MIGRATIONS_DIR, createDb } from '../../data/db';
import { describeVerification, verifyChain } from '../../services/trail/verify';
import { migrate } from '../../data/migrate';
import { currentMigrationName } from '../../data/migration-renames';
import { NotABackupError, openBackup } from './archive';
import { makeBackup } from './make-backup';
import { connect, parseDatabaseUrl, quoteName as q, startLoad, withDatabase, type DbAddress } from './mariadb-clients';
import { baseTables, readFacts, type Manifest } from './manifest';
import { SwapUndoFailedError, swapIn } from './swap-tables';

/** The restore did not happen; the database is as it was. */
export class RestoreRefusedError extends Error {}

export interface RestoreOptions {
  /**
   * Makes a scratch database that the URL's account may use (on the local MariaDB: as root,
   * with ensureDatabase). Without it the account must be allowed to create it itself.
   */
  prepareScratch?: (name: string) => void | Promise<void>;
  /** The app's own account (rows only), when it is not the one of `databaseUrl`. */
  appDatabaseUrl?: string;
  /** Makes both accounts' grants again after the swap (on the local MariaDB: as root). */
  regrant?: () => void | Promise<void>;
  /** Where the backup of the replaced contents goes; default `backups/`. */
  backupDir?: string;
  log?: (line: string) => void;
}

export interface RestoreResult {
  manifest: Manifest;
  /** The backup made of the contents the restore replaced (null when the database was empty). */
  previousContents: string | null;
  migrationsRun: string[];
  verification: ChainVerification;
}

type Rows = mysql.RowDataPacket[];

/** Migration files of this code, in the order Knex runs them (by name). */
function codeMigrations(): string[] {
  return fs
    .readdirSync(MIGRATIONS_DIR)
    .filter((f) => /^\d+_.+\.ts$/.test(f))
    .sort();
}

function refuseNewerSchema(manifest: Manifest): void {
  const known = codeMigrations();
  // A backup made before the migrations were renamed names the newest by its old name.
  if (!known.includes(currentMigrationName(manifest.schema.latestMigration)) || manifest.schema.migrations > known.length) {
    throw new RestoreRefusedError(
      `This backup comes from a newer Kerfbook (schema ${manifest.schema.latestMigration}); this code knows the schema up to ` +
        `${known[known.length - 1]}. Update Kerfbook first, then restore.`,
    );
  }
}

/** Other sessions on the database: a running app would write into the tables being replaced. */
async function refuseIfInUse(c: mysql.Connection, database: string): Promise<void> {
  let rows: Rows = [];
  // A client that has just disconnected can stay listed for a moment: look a few times.
  for (let i = 0; i < 10; i++) {
    [rows] = await c.query<Rows>('SELECT ID AS id, USER AS user, HOST AS host FROM information_schema.PROCESSLIST WHERE DB = ? AND ID <> CONNECTION_ID()', [
      database,
    ]);
    if (rows.length === 0) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  const who = rows.map((r) => `#${r['id']} ${r['user']}@${r['host']}`).join(', ');
  throw new RestoreRefusedError(
    `${rows.length} other connection(s) use ${database} (${who}). Stop the Kerfbook server (npm start, or the service) ` +
      `and anything else connected to it, then restore again.`,
  );
}

/** The same question asked as the app's account too, which sees its own connections (the server's). */
async function refuseIfAppConnected(appDatabaseUrl: string | undefined, database: string): Promise<void> {
  if (!appDatabaseUrl) return;
  const app = await connect(parseDatabaseUrl(appDatabaseUrl)).catch((err: unknown) => {
    throw new RestoreRefusedError(`The app's account (DATABASE_URL) could not connect: ${err instanceof Error ? err.message : String(err)}`);
  });
  try {
    await refuseIfInUse(app, database);
  } finally {
    await app.end().catch(() => undefined);
  }
}

/** After the swap: the app's account reads every table, or the restore says which grant to give. */
async function checkAppAccount(appDatabaseUrl: string, tables: string[]): Promise<void> {
  const address = parseDatabaseUrl(appDatabaseUrl);
  const app = await connect(address);
  try {
    for (const t of tables) {
      await app.query(`SELECT 1 FROM ${q(t)} LIMIT 0`).catch((err: unknown) => {
        throw new Error(
          `The backup is restored, but the app's account ${address.user} cannot read ${t} (${err instanceof Error ? err.message : String(err)}). ` +
            `Give it its grant again: GRANT SELECT, INSERT, UPDATE, DELETE ON ${q(address.database)}.* TO '${address.user}'@'<host>' (README.md, "Database accounts").`,
        );
      });
    }
  } finally {
    await app.end().catch(() => undefined);
  }
}

const DEFINER_COMMENT = /\/\*!50017 DEFINER=(?:`(?:[^`]|``)*`|\S+?)@(?:`(?:[^`]|``)*`|\S+?)\s*\*\/ ?/g;

/**
 * Drops the DEFINER of each trigger on the way into `mariadb`, so the restoring account
 * becomes the definer (naming another account needs SUPER). The dump holds raw bytes
 * (blobs), so it is handled as latin1: one character per byte, written back unchanged.
 */
function stripDefiners(): Transform {
  let carry = '';
  const clean = (text: string) => Buffer.from(text.replace(DEFINER_COMMENT, ''), 'latin1');
  return new Transform({
    transform(chunk: Buffer, _enc, done) {
      const text = carry + chunk.toString('latin1');
      // Hold back a comment still open near the end (or a lone '/'): the next chunk closes it.
      const open = text.lastIndexOf('/*');
      let cut = text.length;
      if (open >= 0 && open > text.length - 300 && text.indexOf('*/', open + 2) < 0) cut = open;
      else if (text.endsWith('/')) cut = text.length - 1;
      carry = text.slice(cut);
      done(null, clean(text.slice(0, cut)));
    },
    flush(done) {
      done(null, clean(carry));
    },
  });
}

/** An empty database of that name that the account can fill; made again if it was there. */
async function freshDatabase(c: mysql.Connection, name: string, prepare: RestoreOptions['prepareScratch']): Promise<void> {
  const make = async () => {
    await c.query(`DROP DATABASE IF EXISTS ${q(name)}`);
    await c.query(`CREATE DATABASE ${q(name)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  };
  try {
    await make();
  } catch (err) {
    if (!prepare) {
      throw new RestoreRefusedError(
        `The restore needs a scratch database ${name}, and this account may not create it ` +
          `(${err instanceof Error ? err.message : String(err)}). Let it: GRANT ALL ON ${q(name)}.* TO the account in DATABASE_URL.`,
      );
    }
    await prepare(name);
    await make();
  }
}

function differences(expected: Manifest, found: Omit<Manifest, 'format' | 'formatVersion' | 'createdAt' | 'dump'>): string[] {
  const out: string[] = [];
  const tables = new Set([...Object.keys(expected.rowCounts), ...Object.keys(found.rowCounts)]);
  for (const t of tables) {
    if (expected.rowCounts[t] !== found.rowCounts[t])
      out.push(`${t}: ${found.rowCounts[t] ?? 'no table'} rows, the manifest says ${expected.rowCounts[t] ?? 'no table'}`);
  }
  if (expected.triggers.join() !== found.triggers.join()) out.push(`triggers ${found.triggers.join(', ')}; the manifest says ${expected.triggers.join(', ')}`);
  const head = (t: Manifest['trail']) => (t ? `#${t.headEventId} ${t.headHash}` : 'none');
  if (head(expected.trail) !== head(found.trail)) out.push(`chain head ${head(found.trail)}; the manifest says ${head(expected.trail)}`);
  if (expected.schema.latestMigration !== found.schema.latestMigration)
    out.push(`schema ${found.schema.latestMigration}; the manifest says ${expected.schema.latestMigration}`);
  return out;
}

async function loadAndVerify(address: DbAddress, c: mysql.Connection, scratchUrl: string, scratch: string, dumpFile: string, manifest: Manifest) {
  const load = startLoad(address, scratch);
  try {
    await Promise.all([pipeline(fs.createReadStream(dumpFile), stripDefiners(), load.stdin), load.done]);
  } catch (err) {
    throw new RestoreRefusedError(`The backup did not load into the scratch database: ${err instanceof Error ? err.message : String(err)}`);
  }
  const found = await readFacts(c, scratch, await baseTables(c, scratch)).catch((err: unknown) => {
    throw new RestoreRefusedError(`The loaded backup is not a Kerfbook database: ${err instanceof Error ? err.message : String(err)}`);
  });
  const diff = differences(manifest, found);
  if (diff.length) throw new RestoreRefusedError(`The loaded backup does not match its manifest: ${diff.join('; ')}.`);

  const db = createDb(scratchUrl);
  try {
    const migrationsRun = await migrate(db);
    const verification = await verifyChain(db);
    if (!verification.ok) throw new RestoreRefusedError(`The backup's trail does not verify: ${describeVerification(verification)}`);
    return { migrationsRun, verification };
  } finally {
    await db.destroy();
  }
}

export async function restoreBackup(databaseUrl: string, file: string, options: RestoreOptions = {}): Promise<RestoreResult> {
  const log = options.log ?? (() => undefined);
  const opened = await openBackup(file).catch((err: unknown) => {
    throw err instanceof NotABackupError ? new RestoreRefusedError(err.message) : err;
  });
  const { manifest } = opened;
  const address = parseDatabaseUrl(databaseUrl);
  const target = address.database;
  const scratch = `${target}_restore`;
  const previous = `${target}_previous`;
  let c: mysql.Connection | null = null;
  let scratchMade = false;
  let keepPrevious = false;
  try {
    refuseNewerSchema(manifest);
    if (previous.length > 64) throw new RestoreRefusedError(`The database name ${target} is too long for the scratch names (${previous}).`);
    c = await connect(address);
    await refuseIfInUse(c, target);
    await refuseIfAppConnected(options.appDatabaseUrl, target);

    const [[left]] = await c.query<Rows>('SELECT COUNT(*) AS n FROM information_schema.TABLES WHERE TABLE_SCHEMA = ?', [previous]);
    if (Number(left!['n']) > 0) {
      throw new RestoreRefusedError(
        `${previous} still holds the tables an earlier restore could not put back. Look at them, drop ${previous}, then restore again.`,
      );
    }

    log(`Loading the backup of ${manifest.createdAt} into the scratch database ${scratch}…`);
    scratchMade = true;
    await freshDatabase(c, scratch, options.prepareScratch);
    await freshDatabase(c, previous, options.prepareScratch);
    const checked = await loadAndVerify(address, c, withDatabase(databaseUrl, scratch), scratch, opened.dumpFile, manifest);
    log(`Verified: row counts, triggers and chain head as in the manifest. ${describeVerification(checked.verification)}`);

    let previousContents: string | null = null;
    if ((await baseTables(c, target)).length > 0) {
      previousContents = (
        await makeBackup(databaseUrl, { ...(options.backupDir ? { dir: options.backupDir } : {}), label: 'before-restore' }).catch((err: unknown) => {
          throw new RestoreRefusedError(`Could not save the current contents first: ${err instanceof Error ? err.message : String(err)}`);
        })
      ).file;
      log(`The contents it replaces are saved in ${previousContents}`);
    }

    // Checked again: the app may have been started while the backup loaded.
    await refuseIfInUse(c, target);
    await refuseIfAppConnected(options.appDatabaseUrl, target);
    await swapIn(c, target, scratch, previous).catch((err: unknown) => {
      if (err instanceof SwapUndoFailedError) {
        keepPrevious = true;
        throw err;
      }
      throw new RestoreRefusedError(`Swapping the restored tables in failed and was undone: ${err instanceof Error ? err.message : String(err)}`);
    });
    await options.regrant?.();
    if (options.appDatabaseUrl) await checkAppAccount(options.appDatabaseUrl, await baseTables(c, target));
    return { manifest, previousContents, ...checked };
  } finally {
    if (c && scratchMade) {
      for (const name of keepPrevious ? [scratch] : [scratch, previous]) await c.query(`DROP DATABASE IF EXISTS ${q(name)}`).catch(() => undefined);
    }
    await c?.end().catch(() => undefined);
    fs.rmSync(opened.folder, { recursive: true, force: true });
  }
}
