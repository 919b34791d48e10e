/**
 * `npm run seed:large -- [--scale <fraction>] [--replace]`: fills the large data
 * set's own database (largeDatabase: LARGE_DATABASE_URL, or the project's bench MariaDB on
 * 127.0.0.1:33307) — migrated first — with the large data set of seed-large.ts.
 * A database that already holds data is refused unless --replace, which empties it first.
 */
import type { Knex } from 'knex';
import { createDb } from '../../../server/data/db';
import { largeDatabase, type LargeDatabase } from './large-database';
import { DatabaseNotEmptyError, seedLarge } from './seed-large';

const USAGE = 'Usage: npm run seed:large -- [--scale <fraction>] [--replace]';

function parseArgs(argv: string[]): { scale: number; replace: boolean } {
  let scale = 1;
  let replace = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--replace') replace = true;
    else if (arg === '--scale') {
      scale = Number(argv[++i]);
      if (!Number.isFinite(scale) || scale <= 0) throw new Error(`--scale needs a number above 0, e.g. --scale 0.1.\n${USAGE}`);
    } else throw new Error(`Unknown option "${arg}".\n${USAGE}`);
  }
  return { scale, replace };
}

async function main(): Promise<number> {
  let args: { scale: number; replace: boolean };
  try {
    args = parseArgs(process.argv.slice(2));
  } catch (err) {
    console.error((err as Error).message);
    return 2;
  }
  let database: LargeDatabase | null = null;
  let db: Knex | null = null;
  try {
    database = await largeDatabase();
    db = createDb(database.url);
    console.log(`[seed:large] database ${database.url.replace(/:[^:@/]*@/, ':…@')}, scale ${args.scale}`);
    const summary = await seedLarge(db, { scale: args.scale, replace: args.replace, log: (line) => console.log(line) });
    const c = summary.counts;
    console.log('');
    console.log(`Large data set made in ${summary.seconds.toFixed(0)} s:`);
    console.log(
      `  ${c.recipes} recipes, ${c.recipeVersions} versions, ${c.users} people, ${c.trailEvents} trail events, ${c.cutRecords} cut records, ${c.sheetPrints} sheet prints`,
    );
    console.log(`  Every person signs in with the password: ${summary.password}`);
    console.log(
      `  One of each role: ${Object.entries(summary.usernames)
        .map(([role, name]) => `${role} ${name}`)
        .join(', ')}`,
    );
    return 0;
  } catch (err) {
    if (err instanceof DatabaseNotEmptyError) {
      console.error(`[seed:large] ${err.message}`);
      return 1;
    }
    console.error(err);
    return 1;
  } finally {
    if (db) await db.destroy();
    if (database) await database.stop();
  }
}

main().then((code) => process.exit(code));
