import type { Knex } from 'knex';

/**
 * The lab's date format for every screen ('iso' = 2026-12-05, 'dmy-dot' = 05.12.2026,
 * 'dmy-slash' = 05/12/2026, 'mdy-slash' = 12/05/2026), and a revision that each save of the
 * settings raises, so two admins editing at once cannot overwrite each other unseen. The
 * column defaults fill the existing row.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.enum('date_format', ['iso', 'dmy-dot', 'dmy-slash', 'mdy-slash']).notNullable().defaultTo('iso');
    t.integer('revision').unsigned().notNullable().defaultTo(1);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.dropColumn('revision');
    t.dropColumn('date_format');
  });
}
