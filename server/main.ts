/** `npm run serve`: reads the environment, connects to MariaDB and listens. Runs no migrations. */
import { readConfig } from './config';
import { createDb } from './data/db';
import { serve } from './serve';

const config = readConfig();
const db = createDb(config.databaseUrl);

try {
  const server = await serve(config, db);
  console.log(`Kerfbook is listening on ${server.url}`);
  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: stopping…`);
    try {
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
