import type { Knex } from 'knex';

/**
 * Lab settings for the worn wheel and the kerf: the smallest usable diameter of a
 * consumable wheel whose record gives none, as a share of its new diameter, and the
 * allowance added to the wheel's thickness for the kerf loss (mm). Values come in the next
 * migration.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.double('worn_diameter_share').nullable();
    t.double('kerf_allowance_mm').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.dropColumn('kerf_allowance_mm');
    t.dropColumn('worn_diameter_share');
  });
}
