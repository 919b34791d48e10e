import type { Knex } from 'knex';

/**
 * The lab's stock: materials, wheels, machines and the wheel-selection table (material
 * group and hardness band to a wheel of the stock). Stock is archived, never deleted
 * while a recipe version references it; archived records stay readable. Lengths mm,
 * speeds rpm and m/s, feeds mm/s.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('materials', (t) => {
    t.increments('id').primary();
    t.string('name', 120).notNullable();
    t.string('designation', 60).notNullable().defaultTo('');
    t.string('material_group', 40).notNullable();
    t.string('condition', 120).notNullable().defaultTo('');
    // Typical hardness on its own scale (null when unknown).
    t.double('hardness_value').nullable();
    t.string('hardness_scale', 8).nullable();
    t.boolean('coated').notNullable().defaultTo(false);
    t.boolean('case_hardened').notNullable().defaultTo(false);
    t.double('case_depth_mm').nullable();
    t.boolean('heat_sensitive').notNullable().defaultTo(false);
    t.boolean('hazardous_dust').notNullable().defaultTo(false);
    t.text('notes').notNullable();
    t.boolean('archived').notNullable().defaultTo(false);
    t.datetime('archived_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
    t.index(['archived', 'name']);
    t.index(['material_group']);
  });

  await knex.schema.createTable('wheels', (t) => {
    t.increments('id').primary();
    t.string('name', 120).notNullable();
    t.enum('kind', ['bonded', 'rim']).notNullable();
    // ISO 525-style marking, e.g. A60K5B.
    t.string('specification', 40).notNullable();
    t.double('diameter_mm').notNullable();
    t.double('thickness_mm').notNullable();
    t.double('bore_mm').notNullable();
    // Maximum operating speed as marked on the wheel.
    t.double('max_speed_ms').notNullable();
    t.boolean('dry_allowed').notNullable().defaultTo(false);
    t.text('notes').notNullable();
    t.boolean('archived').notNullable().defaultTo(false);
    t.datetime('archived_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
    t.index(['archived', 'name']);
  });

  await knex.schema.createTable('machines', (t) => {
    t.increments('id').primary();
    t.string('name', 120).notNullable();
    t.enum('machine_class', ['bench-abrasive', 'floor-abrasive', 'precision', 'large-traverse']).notNullable();
    t.double('wheel_diameter_min_mm').notNullable();
    t.double('wheel_diameter_max_mm').notNullable();
    t.double('flange_diameter_mm').notNullable();
    t.double('rpm_min').notNullable();
    t.double('rpm_max').notNullable();
    t.double('feed_min_mm_s').notNullable();
    t.double('feed_max_mm_s').notNullable();
    t.enum('feed_control', ['manual', 'automatic']).notNullable();
    // Short lists of vocabulary ids (shared/vocabulary.ts), read and written whole.
    t.json('cut_motions').notNullable();
    t.json('clamping_methods').notNullable();
    t.text('notes').notNullable();
    t.boolean('archived').notNullable().defaultTo(false);
    t.datetime('archived_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
    t.index(['archived', 'name']);
  });

  await knex.schema.createTable('selection_rows', (t) => {
    t.increments('id').primary();
    t.string('material_group', 40).notNullable();
    // Hardness band on one scale; all three null = any hardness in the group.
    t.double('hardness_min').nullable();
    t.double('hardness_max').nullable();
    t.string('hardness_scale', 8).nullable();
    t.integer('wheel_id').unsigned().notNullable().references('id').inTable('wheels');
    t.string('note', 500).notNullable().defaultTo('');
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
    t.index(['material_group']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('selection_rows');
  await knex.schema.dropTable('machines');
  await knex.schema.dropTable('wheels');
  await knex.schema.dropTable('materials');
}
