import type { Knex } from 'knex';

/** Failed sign-ins are also counted per client address across usernames (password spraying). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sign_in_failures', (t) => {
    t.index(['client_address', 'failed_at'], 'sign_in_failures_by_address');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sign_in_failures', (t) => {
    t.dropIndex(['client_address', 'failed_at'], 'sign_in_failures_by_address');
  });
}
