import type { Knex } from 'knex';

/**
 * Data: every wheel so far was marked in m/s; its speed in rpm at the new diameter is
 * n = 60 000·v / (π·D) (the rim travels π·D per turn). Restriction marks start empty.
 * Only fills what is empty, so a second run changes nothing.
 */
export async function up(knex: Knex): Promise<void> {
  await knex('wheels')
    .whereNull('max_speed_rpm')
    .update({ max_speed_rpm: knex.raw('60000 * max_speed_ms / (PI() * diameter_mm)') });
  await knex('wheels').whereNull('restrictions').update({ restrictions: '[]' });
}

export async function down(knex: Knex): Promise<void> {
  await knex('wheels').update({ max_speed_rpm: null, restrictions: null });
}
