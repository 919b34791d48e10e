import type { Knex } from 'knex';

/** Every wheel now has its speed in rpm and its restriction marks: both become required. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('wheels', (t) => {
    t.double('max_speed_rpm').notNullable().alter();
    t.json('restrictions').notNullable().alter();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('wheels', (t) => {
    t.double('max_speed_rpm').nullable().alter();
    t.json('restrictions').nullable().alter();
  });
}
