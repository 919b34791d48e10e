import type { Knex } from 'knex';

/**
 * The session store's table, in the shape connect-session-knex 5 reads and writes
 * (sid, sess, expired). It lives in MariaDB so several app processes share sessions
 * (any process serves any user); the store is told not to create it itself.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (t) => {
    // Binary: session ids are case-sensitive random strings.
    t.string('sid', 255).notNullable().collate('utf8mb4_bin').primary();
    t.json('sess').notNullable();
    // UTC, written by the store as 'YYYY-MM-DD HH:MM:SS'.
    t.datetime('expired').notNullable().index();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
