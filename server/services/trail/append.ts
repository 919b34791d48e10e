/**
 * The trail. Every change writes one event inside the transaction that makes the change,
 * so a change never lands without its event and a refused request leaves nothing. Each
 * event carries the hash of the one before it (see hash.ts for what is hashed).
 */
import type { Knex } from 'knex';
import { advanceChainHead, insertTrailEvent, lockChainHead, recipeIdOfVersion } from '../../data/trail-events';
import type { Actor } from '../actor';
import { canonicalJson } from '../../../shared/canonical-json';
import { chainedFields } from './stored-row';
import type { TrailEntityType, TrailEventType } from './event-types';
import { trailHash } from './hash';

/** Keys that must never reach the trail, whatever a caller passes in before/after. */
const SECRET_KEYS = /password|hash|secret|token/i;

/**
 * Canonical JSON text (keys sorted), so the stored text is exactly what the chain hashes.
 * The JSON round trip first turns Dates into ISO strings and drops undefined members, as
 * plain JSON.stringify would.
 */
function toJson(value: Record<string, unknown> | null | undefined): string | null {
  if (value == null) return null;
  for (const key of Object.keys(value)) {
    if (SECRET_KEYS.test(key) && key !== 'mustChangePassword') {
      throw new Error(`Refusing to write "${key}" to the trail.`);
    }
  }
  return canonicalJson(JSON.parse(JSON.stringify(value)));
}

export interface TrailEntry {
  type: TrailEventType;
  entityType: TrailEntityType;
  entityId: number | null;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
  /** Overrides the actor's name, e.g. the username typed at a failed sign-in. */
  actorName?: string;
  /**
   * The recipe the event is about, for the trail's recipe filter. Usually left out: it is
   * found from entityType 'recipe' (the id itself), 'recipe_version' (its recipe), or a
   * `versionId` in after/before (photos, comments, signatures on a version).
   */
  recipeId?: number | null;
}

/** At most `max` characters, never splitting a character outside the BMP (VARCHAR counts code points). */
function clip(value: string, max: number): string {
  const chars = Array.from(value);
  return chars.length <= max ? value : chars.slice(0, max).join('');
}

async function recipeOf(trx: Knex, entry: TrailEntry): Promise<number | null> {
  if (entry.recipeId !== undefined) return entry.recipeId;
  if (entry.entityId === null) return null;
  if (entry.entityType === 'recipe') return entry.entityId;
  if (entry.entityType === 'recipe_version') return recipeIdOfVersion(trx, entry.entityId);
  const versionId = entry.after?.['versionId'] ?? entry.before?.['versionId'];
  return typeof versionId === 'number' ? recipeIdOfVersion(trx, versionId) : null;
}

/**
 * Appends one event to the chain, inside the caller's transaction when it has one (so the
 * change and its event commit together), else in a transaction of its own. The chain head
 * stays locked until that transaction ends: appends from every app process queue on it, and
 * each row links to the row committed just before it.
 */
export async function appendTrailEvent(trx: Knex, actor: Actor, entry: TrailEntry, at = new Date()): Promise<void> {
  const append = async (t: Knex.Transaction) => {
    const recipeId = await recipeOf(t, entry);
    const head = await lockChainHead(t);
    const row = {
      id: head.lastEventId + 1,
      occurred_at: at,
      actor_user_id: actor.userId,
      actor_name: clip(entry.actorName ?? actor.name, 100),
      event_type: entry.type,
      entity_type: entry.entityType,
      entity_id: entry.entityId === null ? null : String(entry.entityId),
      recipe_id: recipeId,
      before_json: toJson(entry.before),
      after_json: toJson(entry.after),
      client_address: clip(actor.clientAddress, 64) || null,
      prev_hash: head.lastHash,
    };
    const hash = trailHash(chainedFields({ ...row, hash: '' }));
    await insertTrailEvent(t, { ...row, hash });
    await advanceChainHead(t, { lastEventId: row.id, lastHash: hash });
  };
  if (trx.isTransaction) await append(trx as Knex.Transaction);
  else await trx.transaction(append);
}
