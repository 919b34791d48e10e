import type { Knex } from 'knex';

/** Feed ceilings per material group (mm/s), used by the recipe checks; values come in the next migration. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.json('feed_ceilings_json').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.dropColumn('feed_ceilings_json');
  });
}
