import type { Knex } from 'knex';

/**
 * Wrong passwords typed by a signed-in person when signing or changing their password,
 * counted per person over a sliding window. In MariaDB so every app process shares the count.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('password_check_failures', (t) => {
    t.bigIncrements('id').primary();
    t.integer('user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    // 'signature' or 'password-change': where the password was typed.
    t.string('purpose', 20).notNullable();
    t.datetime('failed_at', { precision: 3 }).notNullable();
    t.index(['user_id', 'failed_at'], 'password_check_failures_lookup');
    t.index(['failed_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('password_check_failures');
}
