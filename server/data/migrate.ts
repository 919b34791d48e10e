import type { Knex } from 'knex';
import { MIGRATION_RENAMES } from './migration-renames';

/** Brings the schema up to date; returns the names of the migrations that ran. Every caller migrates through here. */
export async function migrate(db: Knex): Promise<string[]> {
  // First: Knex refuses a table whose rows name files the folder lacks ("corrupt").
  await renameOldMigrations(db);
  const [, ran] = (await db.migrate.latest()) as [number, string[]];
  return ran;
}

/**
 * Gives the rows of a database migrated under the migrations' old names their new names
 * (migration-renames.ts), all in one transaction; returns how many rows changed. Rows
 * already named anew are left as they are; a database without old names is not written
 * to. The lock table (knex_migrations_lock) holds a flag, no names: nothing to do there.
 */
export async function renameOldMigrations(db: Knex): Promise<number> {
  const table = db.client.config.migrations?.tableName ?? 'knex_migrations';
  if (!(await db.schema.hasTable(table))) return 0;
  const oldNames = MIGRATION_RENAMES.map(([from]) => from);
  const [{ n }] = (await db(table).whereIn('name', oldNames).count({ n: '*' })) as [{ n: number | string }];
  if (Number(n) === 0) return 0;

  return db.transaction(async (trx) => {
    // Locked: a second process migrating at the same time waits, then finds nothing left to rename.
    const rows = (await trx(table).select('name').forUpdate()) as { name: string }[];
    const recorded = new Set(rows.map((r) => r.name));
    let renamed = 0;
    for (const [from, to] of MIGRATION_RENAMES) {
      if (!recorded.has(from)) continue;
      if (recorded.has(to)) {
        throw new Error(
          `${table} records the migration ${to} twice, once under its old name ${from}. ` +
            `Check that it ran only once, delete the row named ${from}, then migrate again.`,
        );
      }
      renamed += await trx(table).where({ name: from }).update({ name: to });
    }
    return renamed;
  });
}
