import type { Knex } from 'knex';

/** The lab's own settings: one row (id 1). Its default values come in the next migration. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('lab_settings', (t) => {
    // Always 1: the check keeps the table to a single row.
    t.tinyint('id').unsigned().notNullable().primary();
    t.string('lab_name', 120).notNullable();
    t.smallint('review_interval_months').unsigned().notNullable().defaultTo(24);
    t.enum('sheet_paper', ['A4', 'Letter']).notNullable().defaultTo('A4');
    t.enum('default_units', ['metric', 'metric+imperial']).notNullable().defaultTo('metric');
    t.datetime('updated_at', { precision: 3 }).notNullable();
  });
  await knex.raw('ALTER TABLE lab_settings ADD CONSTRAINT lab_settings_single_row CHECK (id = 1)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('lab_settings');
}
