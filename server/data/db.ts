import knex, { type Knex } from 'knex';
import path from 'node:path';

export const MIGRATIONS_DIR = path.resolve(import.meta.dirname, '../../migrations');
export const SEEDS_DIR = path.resolve(import.meta.dirname, '../../seeds');

/**
 * A Knex instance for a MariaDB URL. The acquire timeout is short so that a request made
 * while the database is down fails fast with 503 instead of hanging; the pool then builds
 * new connections by itself once MariaDB answers again.
 */
export function createDb(databaseUrl: string): Knex {
  return knex({
    client: 'mysql2',
    // No `charset` here: it would make new tables utf8mb4_general_ci instead of the
    // database's collation.
    connection: { uri: databaseUrl, timezone: 'Z', dateStrings: false, connectTimeout: 5000 } as Knex.MySql2ConnectionConfig & { uri: string },
    pool: { min: 0, max: 10 },
    acquireConnectionTimeout: 5000,
    migrations: { directory: MIGRATIONS_DIR, loadExtensions: ['.ts'], tableName: 'knex_migrations' },
    seeds: { directory: SEEDS_DIR, loadExtensions: ['.ts'] },
  });
}
