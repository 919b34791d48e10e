import type { Knex } from 'knex';

/**
 * What the workflow's mails need: operators assigned to machines, single-use links
 * (invitation, password reset), notification opt-outs, acknowledgements ("read and
 * understood") and the record of review-due reminders already sent.
 */
export async function up(knex: Knex): Promise<void> {
  // Which machines an operator runs: who must acknowledge a new version, and the finder's default.
  await knex.schema.createTable('user_machines', (t) => {
    t.integer('user_id').unsigned().notNullable().references('id').inTable('users');
    t.integer('machine_id').unsigned().notNullable().references('id').inTable('machines');
    t.datetime('assigned_at', { precision: 3 }).notNullable();
    t.primary(['user_id', 'machine_id']);
    t.index(['machine_id']);
  });

  // Single-use links. Only the SHA-256 of the token is stored: a database reader cannot use one.
  await knex.schema.createTable('user_tokens', (t) => {
    t.increments('id').primary();
    t.integer('user_id').unsigned().notNullable().references('id').inTable('users');
    t.enum('purpose', ['invitation', 'password-reset']).notNullable();
    t.specificType('token_sha256', 'char(64)').notNullable().unique('user_tokens_sha256_unique');
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('expires_at', { precision: 3 }).notNullable();
    // Set when the link was used, or when a newer link or a password change made it void.
    t.datetime('used_at', { precision: 3 }).nullable();
    t.integer('created_by').unsigned().nullable().references('id').inTable('users');
    t.index(['user_id', 'purpose']);
  });

  // Mails a person turned off. Absent row = the mail is wanted (every kind is on by default).
  await knex.schema.createTable('notification_opt_outs', (t) => {
    t.integer('user_id').unsigned().notNullable().references('id').inTable('users');
    t.string('kind', 60).notNullable();
    t.primary(['user_id', 'kind']);
  });

  // "Read and understood": one per operator and version.
  await knex.schema.createTable('acknowledgements', (t) => {
    t.increments('id').primary();
    t.integer('version_id').unsigned().notNullable().references('id').inTable('recipe_versions');
    t.integer('user_id').unsigned().notNullable().references('id').inTable('users');
    t.string('user_name', 100).notNullable();
    t.datetime('acknowledged_at', { precision: 3 }).notNullable();
    t.unique(['version_id', 'user_id'], { indexName: 'acknowledgements_version_user_unique' });
    t.index(['user_id']);
  });

  // The daily review-due job: one reminder per version and period, whatever the number of processes.
  await knex.schema.createTable('review_reminders', (t) => {
    t.integer('version_id').unsigned().notNullable().references('id').inTable('recipe_versions');
    // First day of the reminder period (a Monday, UTC).
    t.date('period_start').notNullable();
    t.datetime('sent_at', { precision: 3 }).notNullable();
    t.primary(['version_id', 'period_start']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('review_reminders');
  await knex.schema.dropTable('acknowledgements');
  await knex.schema.dropTable('notification_opt_outs');
  await knex.schema.dropTable('user_tokens');
  await knex.schema.dropTable('user_machines');
}
