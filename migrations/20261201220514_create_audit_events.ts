import type { Knex } from 'knex';

/**
 * The trail of every change (append-only). A later migration adds the hash chain
 * columns; nothing here may ever hold a password or a password hash.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_events', (t) => {
    t.bigIncrements('id').primary();
    t.datetime('occurred_at', { precision: 3 }).notNullable();
    // Nullable: failed sign-ins of unknown names have no user. No foreign key, so the
    // trail never blocks anything and keeps its rows whatever happens to users.
    t.integer('actor_user_id').unsigned().nullable();
    // The actor's printed name at that moment (or the name typed at sign-in).
    t.string('actor_name', 100).notNullable();
    t.string('event_type', 60).notNullable();
    t.string('entity_type', 40).notNullable();
    t.string('entity_id', 40).nullable();
    t.json('before_json').nullable();
    t.json('after_json').nullable();
    t.string('client_address', 64).nullable();
    t.index(['occurred_at']);
    t.index(['entity_type', 'entity_id']);
    t.index(['actor_user_id']);
    t.index(['event_type']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_events');
}
