import type { Knex } from 'knex';

/**
 * Photos of a recipe version (setup, good and bad cut faces). The bytes live in MariaDB so
 * that any app process can serve them. Uploads are capped at 10 MB, below
 * MariaDB's default max_allowed_packet of 16 MB; the server writes the bytes in pieces
 * (a query carries them hex-escaped, twice their size).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('attachments', (t) => {
    t.increments('id').primary();
    t.integer('version_id').unsigned().notNullable().references('id').inTable('recipe_versions');
    t.enum('role', ['setup', 'good-face', 'bad-face', 'other']).notNullable();
    t.string('caption', 300).notNullable().defaultTo('');
    t.string('file_name', 200).notNullable();
    // Sniffed from the bytes, never taken from the upload's declared type.
    t.string('mime_type', 40).notNullable();
    t.integer('size_bytes').unsigned().notNullable();
    t.string('sha256', 64).notNullable();
    t.integer('width').unsigned().notNullable();
    t.integer('height').unsigned().notNullable();
    t.specificType('data', 'LONGBLOB').notNullable();
    t.specificType('thumbnail', 'MEDIUMBLOB').notNullable();
    t.string('thumbnail_mime_type', 40).notNullable();
    t.string('thumbnail_sha256', 64).notNullable();
    t.integer('created_by').unsigned().notNullable().references('id').inTable('users');
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.index(['version_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('attachments');
}
