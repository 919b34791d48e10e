import type { Knex } from 'knex';

/** Lab settings: the per-group feed ceilings are replaced by the feed limits (carried over by the previous migration). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.dropColumn('feed_ceilings_json');
  });
}

/** The column comes back empty; the previous migration's down fills it from the feed limits. */
export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.json('feed_ceilings_json').nullable();
  });
}
