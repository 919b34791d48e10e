import { createHash } from 'node:crypto';
import type { Knex } from 'knex';

/**
 * The trail becomes a hash chain (21 CFR 11.10(e): secure, computer-generated audit
 * trails): every row stores the hash of the row before it and its own hash, serialised
 * as "kb-trail-1" (below). `recipe_id` lets the trail be filtered by recipe whether an
 * event names the recipe, one of its versions or a photo.
 *
 * Schema and backfill share this file on purpose: the rows already there must be hashed
 * (in id order) before the columns become NOT NULL and the append-only triggers land.
 *
 * `audit_chain_head` (one row) holds the newest row's id and hash. Appends lock it, so
 * concurrent writers from any number of processes chain one after the other, and a
 * deleted last row shows as a head that points past the table's end.
 *
 * With binary logging on, creating triggers needs SUPER or log_bin_trust_function_creators.
 */
const HEX64 = 'CHAR(64) CHARACTER SET ascii COLLATE ascii_bin';
const BATCH = 1000;

interface StoredRow {
  id: number;
  occurred_at: Date;
  actor_user_id: number | null;
  actor_name: string;
  event_type: string;
  entity_type: string;
  entity_id: string | null;
  recipe_id: number | null;
  before_json: unknown;
  after_json: unknown;
  client_address: string | null;
}

const json = (value: unknown): unknown => (typeof value === 'string' ? JSON.parse(value) : (value ?? null));

// "kb-trail-1" as it was when this migration was written, copied here so that the chain
// it builds never follows later changes to the app's code: a JSON array without
// whitespace, object keys sorted recursively (canonical JSON), SHA-256 in lower-case hex.
// Pinned to fixed hashes by test/unit/migrations/chain-trail-hash.spec.ts.

const GENESIS_HASH = '0'.repeat(64);

interface ChainedFields {
  id: number;
  occurredAt: Date;
  actorUserId: number | null;
  actorName: string;
  eventType: string;
  entityType: string;
  entityId: string | null;
  recipeId: number | null;
  before: unknown;
  after: unknown;
  clientAddress: string | null;
  prevHash: string;
}

function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sortKeys);
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) {
      const member = (value as Record<string, unknown>)[key];
      if (member !== undefined) out[key] = sortKeys(member);
    }
    return out;
  }
  if (typeof value === 'number' && !Number.isFinite(value)) throw new Error('Canonical JSON cannot hold NaN or Infinity.');
  return value;
}

export function trailHash(row: ChainedFields): string {
  if (Number.isNaN(row.occurredAt.getTime())) throw new Error(`Trail row ${row.id} has no valid time.`);
  const serialised = JSON.stringify(
    sortKeys([
      'kb-trail-1',
      row.id,
      row.occurredAt.toISOString(),
      row.actorUserId,
      row.actorName,
      row.eventType,
      row.entityType,
      row.entityId,
      row.recipeId,
      row.before ?? null,
      row.after ?? null,
      row.clientAddress,
      row.prevHash,
    ]),
  );
  return createHash('sha256').update(serialised, 'utf8').digest('hex');
}

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('audit_events', (t) => {
    t.integer('recipe_id').unsigned().nullable().after('entity_id');
    t.specificType('prev_hash', HEX64).nullable();
    t.specificType('hash', HEX64).nullable();
    // InnoDB appends the primary key to secondary indexes: this one serves "events of a
    // recipe, newest first" without a sort, like the existing actor and type indexes.
    t.index(['recipe_id'], 'audit_events_recipe_id_index');
  });
  await knex.schema.createTable('audit_chain_head', (t) => {
    t.tinyint('id').unsigned().primary();
    t.bigInteger('last_event_id').unsigned().notNullable();
    t.specificType('last_hash', HEX64).notNullable();
  });

  // Which recipe each existing event is about: the recipe itself, a version's recipe, or the
  // recipe of the version a photo event names in its before/after.
  await knex.raw(`UPDATE audit_events SET recipe_id = CAST(entity_id AS UNSIGNED) WHERE entity_type = 'recipe' AND entity_id IS NOT NULL`);
  await knex.raw(
    `UPDATE audit_events e JOIN recipe_versions v ON v.id = CAST(e.entity_id AS UNSIGNED)
        SET e.recipe_id = v.recipe_id
      WHERE e.entity_type = 'recipe_version' AND e.entity_id IS NOT NULL`,
  );
  await knex.raw(
    `UPDATE audit_events e JOIN recipe_versions v
         ON v.id = CAST(COALESCE(JSON_VALUE(e.after_json, '$.versionId'), JSON_VALUE(e.before_json, '$.versionId')) AS UNSIGNED)
        SET e.recipe_id = v.recipe_id
      WHERE e.recipe_id IS NULL AND e.entity_type NOT IN ('recipe', 'recipe_version')`,
  );

  // Chain the existing rows in id order, a batch at a time.
  let prev = GENESIS_HASH;
  let lastId = 0;
  for (;;) {
    const rows = (await knex('audit_events').where('id', '>', lastId).orderBy('id').limit(BATCH)) as StoredRow[];
    if (rows.length === 0) break;
    for (const r of rows) {
      const hash = trailHash({
        id: Number(r.id),
        occurredAt: r.occurred_at,
        actorUserId: r.actor_user_id,
        actorName: r.actor_name,
        eventType: r.event_type,
        entityType: r.entity_type,
        entityId: r.entity_id,
        recipeId: r.recipe_id,
        before: json(r.before_json),
        after: json(r.after_json),
        clientAddress: r.client_address,
        prevHash: prev,
      });
      await knex('audit_events').where({ id: r.id }).update({ prev_hash: prev, hash });
      prev = hash;
      lastId = Number(r.id);
    }
  }
  await knex('audit_chain_head').insert({ id: 1, last_event_id: lastId, last_hash: prev });

  await knex.raw(`ALTER TABLE audit_events MODIFY prev_hash ${HEX64} NOT NULL, MODIFY hash ${HEX64} NOT NULL`);

  // Append-only in the database itself, whatever client connects. The chain still catches
  // an edit made with the triggers dropped or in the data files.
  await knex.raw(
    `CREATE TRIGGER audit_events_refuse_update BEFORE UPDATE ON audit_events FOR EACH ROW
       SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'The audit trail is append-only: rows cannot be changed.'`,
  );
  await knex.raw(
    `CREATE TRIGGER audit_events_refuse_delete BEFORE DELETE ON audit_events FOR EACH ROW
       SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'The audit trail is append-only: rows cannot be deleted.'`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP TRIGGER IF EXISTS audit_events_refuse_delete');
  await knex.raw('DROP TRIGGER IF EXISTS audit_events_refuse_update');
  await knex.schema.dropTable('audit_chain_head');
  await knex.schema.alterTable('audit_events', (t) => {
    t.dropIndex(['recipe_id'], 'audit_events_recipe_id_index');
    t.dropColumn('hash');
    t.dropColumn('prev_hash');
    t.dropColumn('recipe_id');
  });
}
