import type { Knex } from 'knex';

/** Hours between two regular seals of the trail's chain head; the column default (daily) fills the existing row. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.integer('seal_interval_hours').unsigned().notNullable().defaultTo(24);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.dropColumn('seal_interval_hours');
  });
}
