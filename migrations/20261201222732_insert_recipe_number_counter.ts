import type { Knex } from 'knex';

/** Data: the recipe number counter's single row. Idempotent. */
export async function up(knex: Knex): Promise<void> {
  const existing = await knex('recipe_number_counter').where({ id: 1 }).first();
  if (existing) return;
  await knex('recipe_number_counter').insert({ id: 1, last_number: 0 });
}

export async function down(knex: Knex): Promise<void> {
  await knex('recipe_number_counter').where({ id: 1 }).del();
}
