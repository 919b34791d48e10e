import type { Knex } from 'knex';

/** Brings the schema up to date; returns the names of the migrations that ran. Every caller migrates through here. */
export async function migrate(db: Knex): Promise<string[]> {
  const [, ran] = (await db.migrate.latest()) as [number, string[]];
  return ran;
}
