/**
 * Writes the planned trail in time order as the chain `appendTrailEvent` appends: the same
 * row (canonical JSON text, clipped names, null for an empty client address), the same hash
 * (`trailHash` over `chainedFields`, as in server/services/trail/append.ts) linking each row
 * to the one before, and the chain head moved to the last row at the end.
 */
import type { Knex } from 'knex';
import type { ChainedTrailEventRow } from '../../../server/data/trail-events';
import { advanceChainHead, CHAIN_HEAD_TABLE } from '../../../server/data/trail-events';
import { canonicalJson } from '../../../shared/canonical-json';
import { chainedFields } from '../../../server/services/trail/stored-row';
import { GENESIS_HASH, trailHash } from '../../../server/services/trail/hash';
import { BatchWriter } from './batch-insert';
import type { TrailPlan } from './trail-plan';

/** As append.ts: canonical text after a JSON round trip (Dates to ISO text, undefined dropped). */
function toJson(value: Record<string, unknown> | null | undefined): string | null {
  if (value == null) return null;
  return canonicalJson(JSON.parse(JSON.stringify(value)));
}

/** As append.ts: at most `max` characters, never splitting a character outside the BMP. */
function clip(value: string, max: number): string {
  const chars = Array.from(value);
  return chars.length <= max ? value : chars.slice(0, max).join('');
}

export interface WrittenTrail {
  events: number;
  lastHash: string;
}

/** The trail must be empty (chain head at 0): the plan starts the chain. */
export async function writeTrail(db: Knex, plan: TrailPlan, progress: (written: number) => void): Promise<WrittenTrail> {
  const head = (await db(CHAIN_HEAD_TABLE).where({ id: 1 }).first('last_event_id')) as { last_event_id: number } | undefined;
  if (!head || Number(head.last_event_id) !== 0) throw new Error('The trail is not empty: the large data set starts its own chain.');
  const writer = new BatchWriter(db, 'trail_events', 2000);
  let prevHash = GENESIS_HASH;
  let id = 0;
  const events = plan.inTimeOrder();
  for (const event of events) {
    const entry = event.make();
    id += 1;
    const row: Omit<ChainedTrailEventRow, 'hash'> = {
      id,
      occurred_at: new Date(event.t),
      actor_user_id: event.actor.userId,
      actor_name: clip(event.actor.name, 100),
      event_type: entry.type,
      entity_type: entry.entityType,
      entity_id: entry.entityId === null ? null : String(entry.entityId),
      recipe_id: entry.recipeId,
      before_json: toJson(entry.before),
      after_json: toJson(entry.after),
      client_address: clip(event.actor.clientAddress, 64) || null,
      prev_hash: prevHash,
    };
    const hash = trailHash(chainedFields({ ...row, hash: '' }));
    await writer.add({ ...row, hash });
    prevHash = hash;
    if (id % 100_000 === 0) progress(id);
  }
  await writer.flush();
  await db.transaction((trx) => advanceChainHead(trx, { lastEventId: id, lastHash: prevHash }));
  return { events: id, lastHash: prevHash };
}
