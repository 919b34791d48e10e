import type { Knex } from 'knex';

/** Brings the schema up to date; returns the names of the migrations that ran. */
export async function migrate(db: Knex): Promise<string[]> {
  const [, ran] = (await db.migrate.latest()) as [number, string[]];
  return ran;
}

/**
 * Loads the invented demo scenario, but only into a database without people: a second
 * start, or a lab's real database, keeps what it has.
 */
export async function seedDemoIfEmpty(db: Knex): Promise<boolean> {
  const row = await db('users').count<{ n: number }[]>({ n: '*' }).first();
  if (Number(row?.n ?? 0) > 0) return false;
  await db.seed.run();
  return true;
}
