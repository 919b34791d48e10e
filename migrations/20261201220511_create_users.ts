import type { Knex } from 'knex';

/** People and their roles (design sections 2 and 3). Users are deactivated, never deleted. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    // Binary collation: the case-insensitive default would let look-alike letters ('ä')
    // match ASCII usernames ('a'); usernames are stored lower-case, so binary is exact.
    t.string('username', 40).notNullable().collate('utf8mb4_bin').unique('users_username_unique');
    t.string('display_name', 100).notNullable();
    t.string('email', 200).notNullable().defaultTo('');
    t.string('password_hash', 255).notNullable();
    t.boolean('must_change_password').notNullable().defaultTo(false);
    t.boolean('active').notNullable().defaultTo(true);
    t.enum('units', ['metric', 'metric+imperial']).notNullable().defaultTo('metric');
    // Bumped whenever every other session of the person must end (deactivation,
    // temporary password, own password change); sessions carry the epoch they began in.
    t.integer('session_epoch').unsigned().notNullable().defaultTo(0);
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
    t.datetime('last_sign_in_at', { precision: 3 }).nullable();
    t.datetime('deactivated_at', { precision: 3 }).nullable();
  });

  await knex.schema.createTable('user_roles', (t) => {
    t.integer('user_id').unsigned().notNullable().references('id').inTable('users');
    t.enum('role', ['author', 'approver', 'operator', 'auditor', 'admin']).notNullable();
    t.primary(['user_id', 'role']);
    t.index(['role']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('user_roles');
  await knex.schema.dropTable('users');
}
