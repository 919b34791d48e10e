import type { Knex } from 'knex';

/**
 * Data: titanium alloys give fines that can burn (combustible metals; NFPA 484 from memory),
 * so every material of the titanium group is flagged. Magnesium and zirconium materials are
 * left to the lab: their groups do not tell them apart. Only sets what is not yet set, so a
 * second run changes nothing.
 */
export async function up(knex: Knex): Promise<void> {
  await knex('materials').where({ material_group: 'titanium', combustible_fines: false }).update({ combustible_fines: true });
}

/** Nothing to undo: a flag set since by the lab cannot be told from one set here; the column's own down removes it. */
export async function down(): Promise<void> {}
