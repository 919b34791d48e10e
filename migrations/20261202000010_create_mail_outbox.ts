import type { Knex } from 'knex';

/**
 * Mail outbox, in the database so that any app process can send: a mail is a row written
 * in the transaction of the event that causes it, so it exists exactly when that event
 * committed. A worker in any app process claims due rows (`sending_claimed_by` /
 * `sending_claimed_until`), sends them and marks them sent; a failure records the error
 * and a later `send_after`. A sent row is kept (`sent_at`, `message_id`) and never sent
 * again.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_outbox', (t) => {
    t.increments('id').primary();
    t.string('to_address', 254).notNullable();
    t.string('subject', 255).notNullable();
    t.text('text_body', 'mediumtext').notNullable();
    t.text('html_body', 'mediumtext').nullable();
    // What the mail is about (e.g. a new version to acknowledge); for the outbox list.
    t.string('kind', 60).notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('send_after', { precision: 3 }).notNullable();
    t.integer('attempts').unsigned().notNullable().defaultTo(0);
    t.text('last_error').nullable();
    // The worker that is sending the row, and until when its claim holds.
    t.string('sending_claimed_by', 100).nullable();
    t.datetime('sending_claimed_until', { precision: 3 }).nullable();
    t.datetime('sent_at', { precision: 3 }).nullable();
    t.string('message_id', 255).nullable();
    // The worker's query: unsent rows that are due, oldest first.
    t.index(['sent_at', 'send_after'], 'mail_outbox_due');
    // The outbox list, newest first.
    t.index(['created_at'], 'mail_outbox_created');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mail_outbox');
}
