import type { Knex } from 'knex';

/**
 * Cut records: each cut an operator makes, against the exact version used.
 * Anything but a good cut flags the recipe for its author until an author clears the flag
 * (`flag_cleared_at`/`flag_cleared_by`); the record itself is never changed otherwise.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('cut_records', (t) => {
    t.increments('id').primary();
    t.integer('version_id').unsigned().notNullable().references('id').inTable('recipe_versions');
    // Copied from the version so the per-recipe flag counts need no join.
    t.integer('recipe_id').unsigned().notNullable().references('id').inTable('recipes');
    t.string('specimen_id', 60).notNullable();
    // Part, lot or heat number.
    t.string('part_ref', 120).notNullable().defaultTo('');
    t.integer('quantity').unsigned().notNullable().defaultTo(1);
    t.string('outcome', 20).notNullable();
    t.text('notes').notNullable();
    t.integer('operator_id').unsigned().notNullable().references('id').inTable('users');
    // The operator's printed name at the time of the cut, kept if the name changes later.
    t.string('operator_name', 100).notNullable();
    t.datetime('cut_at', { precision: 3 }).notNullable();
    t.datetime('flag_cleared_at', { precision: 3 }).nullable();
    t.integer('flag_cleared_by').unsigned().nullable().references('id').inTable('users');
    t.index(['specimen_id']);
    t.index(['version_id', 'cut_at']);
    t.index(['recipe_id', 'outcome', 'flag_cleared_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('cut_records');
}
