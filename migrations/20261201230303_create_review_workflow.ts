import type { Knex } from 'knex';

/**
 * Review and approval: the workflow dates on each version, the recipe's current
 * version, electronic signatures, review comments and the people who authored or edited
 * each version (an approver may never approve a version they touched).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('recipe_versions', (t) => {
    t.datetime('submitted_at', { precision: 3 }).nullable();
    // UTC calendar dates: the day an approved version becomes current, and its periodic review.
    t.date('effective_from').nullable();
    t.date('review_due_on').nullable();
    t.datetime('superseded_at', { precision: 3 }).nullable();
    t.datetime('withdrawn_at', { precision: 3 }).nullable();
    t.string('withdrawn_reason', 2000).nullable();
    t.index(['status', 'effective_from'], 'recipe_versions_status_effective_index');
    t.index(['review_due_on'], 'recipe_versions_review_due_index');
  });

  // The approved version in use today; null until one is effective, or after it is withdrawn.
  await knex.schema.alterTable('recipes', (t) => {
    t.integer('current_version_id').unsigned().nullable();
    t.foreign('current_version_id', 'recipes_current_version_foreign').references('id').inTable('recipe_versions');
  });

  // Append-only (triggers in a later migration): a signature is never changed or removed.
  await knex.schema.createTable('signatures', (t) => {
    t.increments('id').primary();
    t.integer('version_id').unsigned().notNullable().references('id').inTable('recipe_versions');
    t.integer('signer_id').unsigned().notNullable().references('id').inTable('users');
    // The printed name at the moment of signing (21 CFR 11.50), kept even if the name changes later.
    t.string('signer_name', 100).notNullable();
    t.enum('meaning', ['approved', 'withdrawn']).notNullable();
    t.string('comment', 2000).notNullable().defaultTo('');
    t.datetime('signed_at', { precision: 3 }).notNullable();
    // SHA-256 of the canonical content the signature is bound to (21 CFR 11.70).
    t.string('content_hash', 64).notNullable();
    // Warning-level check ids the approver acknowledged when signing.
    t.text('acknowledged_warnings_json').notNullable();
    t.index(['version_id']);
  });

  await knex.schema.createTable('review_comments', (t) => {
    t.increments('id').primary();
    t.integer('version_id').unsigned().notNullable().references('id').inTable('recipe_versions');
    t.integer('author_id').unsigned().notNullable().references('id').inTable('users');
    t.string('author_name', 100).notNullable();
    t.text('body').notNullable();
    // Content path the comment is about ("" for the whole version).
    t.string('path', 120).notNullable().defaultTo('');
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.index(['version_id']);
  });

  // Everyone who created or saved a version (or changed its photos), once per person.
  await knex.schema.createTable('recipe_version_editors', (t) => {
    t.integer('version_id').unsigned().notNullable().references('id').inTable('recipe_versions');
    t.integer('user_id').unsigned().notNullable().references('id').inTable('users');
    t.datetime('first_edited_at', { precision: 3 }).notNullable();
    t.datetime('last_edited_at', { precision: 3 }).notNullable();
    t.primary(['version_id', 'user_id']);
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('recipe_version_editors');
  await knex.schema.dropTable('review_comments');
  await knex.schema.dropTable('signatures');
  await knex.schema.alterTable('recipes', (t) => {
    t.dropForeign(['current_version_id'], 'recipes_current_version_foreign');
    t.dropColumn('current_version_id');
  });
  await knex.schema.alterTable('recipe_versions', (t) => {
    t.dropIndex(['status', 'effective_from'], 'recipe_versions_status_effective_index');
    t.dropIndex(['review_due_on'], 'recipe_versions_review_due_index');
    t.dropColumns('submitted_at', 'effective_from', 'review_due_on', 'superseded_at', 'withdrawn_at', 'withdrawn_reason');
  });
}
