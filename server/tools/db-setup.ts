import type { Knex } from 'knex';

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
