import type { Knex } from 'knex';

/**
 * Lab settings: feed limits by material group × hardness band × machine class, with a
 * removal ceiling per millimetre of wheel width for traverse passes (one JSON value), and
 * the contact length above which a straight plunge gets the long-contact note. Values come
 * in the next migration, from the per-group ceilings; the migration after drops those.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.json('feed_limits_json').nullable();
    t.double('long_contact_mm').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.dropColumn('long_contact_mm');
    t.dropColumn('feed_limits_json');
  });
}
