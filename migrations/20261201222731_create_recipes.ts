import type { Knex } from 'knex';

/**
 * Recipes and their versions. Each version holds
 * its full content as canonical JSON plus columns copied out of it for the library's
 * search, filters and sort. `revision` is the optimistic-concurrency counter of a draft.
 */
export async function up(knex: Knex): Promise<void> {
  // One row (id 1): the last recipe number handed out. Locked inside the transaction that
  // creates a recipe, so two concurrent creates never get the same number.
  await knex.schema.createTable('recipe_number_counter', (t) => {
    t.tinyint('id').unsigned().notNullable().primary();
    t.integer('last_number').unsigned().notNullable();
  });
  await knex.raw('ALTER TABLE recipe_number_counter ADD CONSTRAINT recipe_number_counter_single_row CHECK (id = 1)');

  await knex.schema.createTable('recipes', (t) => {
    t.increments('id').primary();
    // e.g. KB-0042; binary so the unique index is exact.
    t.string('number', 20).notNullable().collate('utf8mb4_bin').unique('recipes_number_unique');
    // The latest version's title, for lists and search.
    t.string('title', 160).notNullable();
    t.integer('latest_version_id').unsigned().nullable();
    t.integer('created_by').unsigned().notNullable().references('id').inTable('users');
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
  });

  await knex.schema.createTable('recipe_versions', (t) => {
    t.increments('id').primary();
    t.integer('recipe_id').unsigned().notNullable().references('id').inTable('recipes');
    t.integer('version').unsigned().notNullable();
    t.enum('status', ['draft', 'in-review', 'returned', 'approved', 'superseded', 'withdrawn']).notNullable();
    t.integer('revision').unsigned().notNullable().defaultTo(0);
    t.string('title', 160).notNullable();
    // Canonical JSON (keys sorted recursively) kept as the exact text that is hashed.
    t.text('content_json', 'longtext').notNullable();
    // SHA-256 of content_json, fixed once submitted; null for drafts.
    t.string('content_hash', 64).nullable();
    // The server's check results for this content at its last save, and the worst severity.
    t.text('checks_json', 'mediumtext').notNullable();
    t.enum('worst_check', ['blocker', 'warning', 'note']).nullable();
    // Copied out of content_json for the library.
    t.string('material_group', 40).notNullable();
    t.integer('material_id').unsigned().nullable().references('id').inTable('materials');
    t.string('shape', 20).notNullable();
    t.double('size_min_mm').notNullable();
    t.double('size_max_mm').notNullable();
    t.double('hardness_min_hv').nullable();
    t.double('hardness_max_hv').nullable();
    t.integer('machine_id').unsigned().notNullable().references('id').inTable('machines');
    t.integer('wheel_id').unsigned().notNullable().references('id').inTable('wheels');
    t.integer('created_by').unsigned().notNullable().references('id').inTable('users');
    t.integer('updated_by').unsigned().notNullable().references('id').inTable('users');
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
    t.unique(['recipe_id', 'version'], { indexName: 'recipe_versions_recipe_version_unique' });
    t.index(['material_group']);
    t.index(['shape']);
    t.index(['status']);
    t.index(['size_min_mm', 'size_max_mm']);
    t.index(['updated_at']);
  });

  await knex.schema.alterTable('recipes', (t) => {
    t.foreign('latest_version_id').references('id').inTable('recipe_versions');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('recipes', (t) => {
    t.dropForeign(['latest_version_id']);
  });
  await knex.schema.dropTable('recipe_versions');
  await knex.schema.dropTable('recipes');
  await knex.schema.dropTable('recipe_number_counter');
}
