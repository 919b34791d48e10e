/**
 * `npm run serve`: reads the environment, connects to MariaDB, listens and runs the
 * background jobs. Runs no migrations.
 */
import { publicAddressWarning, readConfig } from './config';
import { createDb } from './data/db';
import { schemaChangeWarning } from './data/database-accounts';
import { startJobs } from './jobs';
import { serve } from './serve';

let config: ReturnType<typeof readConfig>;
try {
  config = readConfig();
} catch (err) {
  console.error(`Kerfbook could not start:\n${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
}
const db = createDb(config.databaseUrl);

try {
  const server = await serve(config, db);
  const jobs = startJobs({ db, config });
  console.log(`Kerfbook is listening on ${server.url}`);
  const warning = publicAddressWarning(config);
  if (warning) console.warn(`Warning: ${warning}`);
  const accountWarning = await schemaChangeWarning(db).catch(() => null);
  if (accountWarning) console.warn(`Warning: ${accountWarning}`);
  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: stopping…`);
    try {
      jobs.stop();
      await server.close();
      await db.destroy();
      process.exit(0);
    } catch (err) {
      console.error(err);
      process.exit(1);
    }
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
} catch (err) {
  console.error('Kerfbook could not start:', err instanceof Error ? err.message : err);
  await db.destroy();
  process.exit(1);
}
