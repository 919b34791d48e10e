/**
 * The demo database the Lighthouse runs read: DATABASE_URL when given, otherwise the
 * project's own MariaDB for this bench (data in `.data/bench-web-mariadb`, port
 * KERFBOOK_BENCH_WEB_DB_PORT, default 33308), apart from `npm start`'s and `npm run bench`'s.
 * Migrated, and the invented demo lab loaded when it has no people yet.
 */
import path from 'node:path';
import { createDb } from '../../../server/data/db';
import { migrate } from '../../../server/data/migrate';
import { seedDemoIfEmpty } from '../../../server/tools/db-setup';
import { ensureDatabase, ensureDebianPackage, initDataDir, isRunning, localMariadb, start, stop } from '../../../server/tools/local-mariadb';
import { DATA_DIR } from '../../../server/tools/project-files';

export interface DemoDatabase {
  url: string;
  /** The recipe a demo approver signed, for the Recipe screen. */
  approvedRecipeId: number;
  /** Stops the MariaDB if this call started it; otherwise does nothing. */
  stop(): Promise<void>;
}

export async function demoDatabase(env: NodeJS.ProcessEnv = process.env): Promise<DemoDatabase> {
  let url = env['DATABASE_URL'];
  let stopDb = async (): Promise<void> => undefined;
  if (url) {
    console.log('[db] using DATABASE_URL.');
  } else {
    ensureDebianPackage('mariadbd', 'mariadb-server');
    const local = localMariadb(path.join(DATA_DIR, 'bench-web-mariadb'), Number(env['KERFBOOK_BENCH_WEB_DB_PORT'] ?? 33308));
    initDataDir(local);
    const wasRunning = isRunning(local);
    await start(local);
    if (!wasRunning) stopDb = () => stop(local);
    url = ensureDatabase(local, 'kerfbook_bench_web');
    console.log(`[db] MariaDB on 127.0.0.1:${local.port}, data in .data/bench-web-mariadb/`);
  }
  const db = createDb(url);
  try {
    await migrate(db);
    if (await seedDemoIfEmpty(db)) console.log('[db] demo data loaded');
    const row = await db('recipe_versions').where({ status: 'approved' }).orderBy('recipe_id').first<{ recipe_id: number } | undefined>('recipe_id');
    if (!row) throw new Error('The database has no approved recipe to open on the Recipe screen; load the demo data into an empty database.');
    return { url, approvedRecipeId: row.recipe_id, stop: stopDb };
  } catch (err) {
    await stopDb();
    throw err;
  } finally {
    await db.destroy();
  }
}
