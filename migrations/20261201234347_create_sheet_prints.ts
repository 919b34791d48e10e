import type { Knex } from 'knex';

/**
 * Every bench sheet printed, so a sheet found at a saw can be traced: which version, who,
 * when (UTC) and from which client address. Append-only by use; the trail holds the same
 * fact as a `sheet.printed` event.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sheet_prints', (t) => {
    t.increments('id').primary();
    t.integer('version_id').unsigned().notNullable().references('id').inTable('recipe_versions');
    t.integer('user_id').unsigned().notNullable().references('id').inTable('users');
    t.datetime('printed_at', { precision: 3 }).notNullable();
    // As Express sees it (honours `trust proxy`); IPv6 fits in 45 characters.
    t.string('client_address', 45).notNullable().defaultTo('');
    t.index(['version_id', 'printed_at']);
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sheet_prints');
}
