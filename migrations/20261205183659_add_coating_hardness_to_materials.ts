import type { Knex } from 'knex';

/**
 * Materials: the hardness of a coated material's coating, on its own scale (null when not
 * known or not coated), so the wheel suggestion and the bond check can weigh both layers.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('materials', (t) => {
    t.double('coating_hardness_value').nullable();
    t.string('coating_hardness_scale', 8).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('materials', (t) => {
    t.dropColumn('coating_hardness_scale');
    t.dropColumn('coating_hardness_value');
  });
}
