import type { Knex } from 'knex';

/**
 * Failed sign-ins per (username, client address), counted over a sliding window. Kept in
 * MariaDB rather than in memory so that every app process sees the same count.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sign_in_failures', (t) => {
    t.bigIncrements('id').primary();
    // The name as typed (trimmed, lower-case), whether or not such a user exists.
    t.string('username', 40).notNullable().collate('utf8mb4_bin');
    t.string('client_address', 64).notNullable();
    t.datetime('failed_at', { precision: 3 }).notNullable();
    t.index(['username', 'client_address', 'failed_at'], 'sign_in_failures_lookup');
    t.index(['failed_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sign_in_failures');
}
