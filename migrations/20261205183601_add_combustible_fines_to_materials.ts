import type { Knex } from 'knex';

/**
 * Materials: whether the fines and sludge of cutting them can burn (magnesium, titanium,
 * zirconium and their alloys). The material group cannot tell: magnesium shares its group
 * with aluminium and zirconium has none. The recipe's cautions read it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('materials', (t) => {
    t.boolean('combustible_fines').notNullable().defaultTo(false);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('materials', (t) => {
    t.dropColumn('combustible_fines');
  });
}
