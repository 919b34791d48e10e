import type { Knex } from 'knex';

/**
 * Specific cutting energy per material group (J/mm³) and the share of a machine's motor
 * power (%) above which the estimated cutting power gets a warning; values come in the next
 * migration.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.json('specific_energy_json').nullable();
    t.double('power_warning_pct').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_settings', (t) => {
    t.dropColumn('power_warning_pct');
    t.dropColumn('specific_energy_json');
  });
}
