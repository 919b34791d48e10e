/**
 * Which database `npm run backup` and `npm run restore` work on, as the owner account
 * (the dump reads the triggers, the restore makes them): MIGRATION_DATABASE_URL (or
 * DATABASE_URL alone, when one account does everything) when given,
 * otherwise the one `npm start` uses (its own MariaDB in .data/mariadb, port 33306 or
 * KERFBOOK_DB_PORT), started the same way when it is not running and stopped afterwards.
 */
import fs from 'node:fs';
import path from 'node:path';
import { ensureAccounts, ensureDatabase, ensureDebianPackage, initDataDir, isRunning, localMariadb, start, stop } from '../../tools/local-mariadb';
import { DATA_DIR } from '../../tools/project-files';

export interface Target {
  /** The owner account's. */
  databaseUrl: string;
  /** The app's own account, when it has one: a restore checks it is not connected, and that it reads the restored tables. */
  appDatabaseUrl?: string;
  /** On the local MariaDB: makes both accounts' grants again after a restore (as root). */
  regrant?: () => void;
  /** Shown to the user: which database this is. */
  description: string;
  /** On the local MariaDB: makes a scratch database for the app's account (as root). */
  prepareScratch?: (name: string) => void;
  /** Stops the MariaDB this opened, if it did. */
  close: () => Promise<void>;
}

/** `create`: a restore onto a fresh clone may make the local data folder; a backup may not. */
export async function openTarget(create: boolean): Promise<Target> {
  const env = process.env;
  const url = env['DATABASE_URL'];
  const owner = env['MIGRATION_DATABASE_URL'];
  if (url && owner) {
    return {
      databaseUrl: owner,
      appDatabaseUrl: url,
      description: `MIGRATION_DATABASE_URL (${new URL(owner).pathname.slice(1)})`,
      close: async () => undefined,
    };
  }
  if (url) return { databaseUrl: url, description: `DATABASE_URL (${new URL(url).pathname.slice(1)})`, close: async () => undefined };

  const local = localMariadb(path.join(DATA_DIR, 'mariadb'), Number(env['KERFBOOK_DB_PORT'] ?? 33306));
  if (!create && !fs.existsSync(path.join(local.dir, 'data', 'mysql'))) {
    throw new Error('There is no local Kerfbook database yet (.data/mariadb); run `npm start` once, or set DATABASE_URL.');
  }
  ensureDebianPackage('mariadbd', 'mariadb-server');
  initDataDir(local);
  const wasRunning = isRunning(local);
  await start(local);
  const close = wasRunning ? async () => undefined : () => stop(local);
  try {
    const accounts = ensureAccounts(local, 'kerfbook');
    return {
      databaseUrl: accounts.ownerUrl,
      appDatabaseUrl: accounts.appUrl,
      regrant: () => void ensureAccounts(local, 'kerfbook'),
      description: `the local database of npm start (MariaDB on 127.0.0.1:${local.port}${wasRunning ? '' : ', started for this and stopped after'})`,
      prepareScratch: (name) => void ensureDatabase(local, name),
      close,
    };
  } catch (err) {
    await close();
    throw err;
  }
}
