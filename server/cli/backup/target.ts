/**
 * Which database `npm run backup` and `npm run restore` work on: DATABASE_URL when given,
 * otherwise the one `npm start` uses (its own MariaDB in .data/mariadb, port 33306 or
 * KERFBOOK_DB_PORT), started the same way when it is not running and stopped afterwards.
 */
import fs from 'node:fs';
import path from 'node:path';
import { ensureDatabase, ensureDebianPackage, initDataDir, isRunning, localMariadb, start, stop } from '../../tools/local-mariadb';
import { DATA_DIR } from '../../tools/project-files';

export interface Target {
  databaseUrl: string;
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
    return {
      databaseUrl: ensureDatabase(local, 'kerfbook'),
      description: `the local database of npm start (MariaDB on 127.0.0.1:${local.port}${wasRunning ? '' : ', started for this and stopped after'})`,
      prepareScratch: (name) => void ensureDatabase(local, name),
      close,
    };
  } catch (err) {
    await close();
    throw err;
  }
}
