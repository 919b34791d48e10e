import type { Knex } from 'knex';

/**
 * Data: Kerfbook's defaults for the worn wheel and the kerf (common practice, not from a
 * single source; a lab sets its own). A consumable cut-off wheel is used down to about 70 %
 * of its new diameter; the kerf is the wheel's thickness plus 0.2 mm for run-out and side
 * wear. Only fills what is empty, so a re-run (or a lab that changed them) keeps what is
 * there.
 */
export const DEFAULT_WORN_DIAMETER_SHARE = 0.7;
export const DEFAULT_KERF_ALLOWANCE_MM = 0.2;

export async function up(knex: Knex): Promise<void> {
  await knex('lab_settings').whereNull('worn_diameter_share').update({ worn_diameter_share: DEFAULT_WORN_DIAMETER_SHARE });
  await knex('lab_settings').whereNull('kerf_allowance_mm').update({ kerf_allowance_mm: DEFAULT_KERF_ALLOWANCE_MM });
}

export async function down(knex: Knex): Promise<void> {
  await knex('lab_settings').update({ worn_diameter_share: null, kerf_allowance_mm: null });
}
