import type { Knex } from 'knex';

/**
 * One row per seal of the trail's chain head, claimed before the seal is written: the
 * unique head id lets exactly one of several app processes seal a given head. The seal
 * itself lives outside the database (a seal file and a mail to the auditors); this table
 * only says which heads were sealed and when, for scheduling.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('trail_seals', (t) => {
    t.bigIncrements('id').primary();
    t.bigInteger('head_event_id').unsigned().notNullable().unique('trail_seals_head_unique');
    t.string('head_hash', 64).notNullable();
    t.bigInteger('event_count').unsigned().notNullable();
    // 'interval' (the lab's seal interval) or 'approval' (a version was approved).
    t.string('reason', 20).notNullable();
    t.datetime('sealed_at', { precision: 3 }).notNullable();
    t.index(['sealed_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('trail_seals');
}
