import type { Knex } from 'knex';

/**
 * The trail is one word from route to table: `audit_events` becomes `trail_events` and
 * `audit_chain_head` becomes `trail_chain_head`. Rows, ids, hashes and event types stay
 * byte for byte, so a chain made before still verifies (its hash never covers a table
 * name). RENAME TABLE keeps the indexes and the two append-only triggers, but under their
 * old names: the indexes are renamed, and the triggers are made again with trail names (the
 * same refusal, SQLSTATE 45000). Nothing else names these tables: no foreign key points at
 * them and no other trigger reads them.
 *
 * With binary logging on, creating triggers needs SUPER or log_bin_trust_function_creators.
 */
const INDEXES = ['occurred_at', 'entity_type_entity_id', 'actor_user_id', 'event_type', 'recipe_id'];

async function renameTables(knex: Knex, from: string, to: string): Promise<void> {
  await knex.raw(`RENAME TABLE \`${from}_events\` TO \`${to}_events\`, \`${from}_chain_head\` TO \`${to}_chain_head\``);
  const renames = INDEXES.map((columns) => `RENAME INDEX \`${from}_events_${columns}_index\` TO \`${to}_events_${columns}_index\``);
  await knex.raw(`ALTER TABLE \`${to}_events\` ${renames.join(', ')}`);
}

async function appendOnlyTriggers(knex: Knex, table: string, what: string): Promise<void> {
  await knex.raw(
    `CREATE TRIGGER ${table}_refuse_update BEFORE UPDATE ON ${table} FOR EACH ROW
       SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = '${what} is append-only: rows cannot be changed.'`,
  );
  await knex.raw(
    `CREATE TRIGGER ${table}_refuse_delete BEFORE DELETE ON ${table} FOR EACH ROW
       SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = '${what} is append-only: rows cannot be deleted.'`,
  );
}

export async function up(knex: Knex): Promise<void> {
  await renameTables(knex, 'audit', 'trail');
  // The new triggers first: the table is never without one.
  await appendOnlyTriggers(knex, 'trail_events', 'The trail');
  await knex.raw('DROP TRIGGER IF EXISTS audit_events_refuse_update');
  await knex.raw('DROP TRIGGER IF EXISTS audit_events_refuse_delete');
}

export async function down(knex: Knex): Promise<void> {
  await renameTables(knex, 'trail', 'audit');
  await appendOnlyTriggers(knex, 'audit_events', 'The audit trail');
  await knex.raw('DROP TRIGGER IF EXISTS trail_events_refuse_update');
  await knex.raw('DROP TRIGGER IF EXISTS trail_events_refuse_delete');
}
