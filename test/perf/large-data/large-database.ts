/**
 * The large data set's MariaDB, shared by `npm run seed:large` and `npm run bench`: the
 * database LARGE_DATABASE_URL names, or the project's own bench MariaDB on loopback
 * (data in `.data/bench-mariadb`, port KERFBOOK_BENCH_DB_PORT, default 33307), kept apart
 * from the demo database so a 1,000,000-event trail never lands in `npm start`'s data.
 */
import path from 'node:path';
import { DATA_DIR } from '../../../server/tools/project-files';
import { ensureDatabase, ensureDebianPackage, initDataDir, isRunning, localMariadb, start, stop } from '../../../server/tools/local-mariadb';

export interface LargeDatabase {
  url: string;
  /** Stops the MariaDB if this call started it; otherwise does nothing. */
  stop(): Promise<void>;
}

export async function largeDatabase(env: NodeJS.ProcessEnv = process.env): Promise<LargeDatabase> {
  const given = env['LARGE_DATABASE_URL'];
  if (given) return { url: given, stop: async () => undefined };
  ensureDebianPackage('mariadbd', 'mariadb-server');
  const local = localMariadb(path.join(DATA_DIR, 'bench-mariadb'), Number(env['KERFBOOK_BENCH_DB_PORT'] ?? 33307));
  initDataDir(local);
  const wasRunning = isRunning(local);
  await start(local);
  const url = ensureDatabase(local, 'kerfbook_large');
  return { url, stop: async () => (wasRunning ? undefined : stop(local)) };
}
