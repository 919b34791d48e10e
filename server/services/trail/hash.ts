/**
 * The trail's hash chain: the one definition of what a row's hash covers. Every append
 * and the verification use `trailHash`, so they can never disagree about the bytes; the
 * chain migration keeps a frozen copy, held to the same hashes by
 * test/unit/migrations/chain-trail-hash.spec.ts.
 *
 * Serialisation "kb-trail-1" — a JSON array, no whitespace, in this order:
 *
 *   ["kb-trail-1", id, occurredAt, actorUserId, actorName, eventType, entityType,
 *    entityId, recipeId, before, after, clientAddress, prevHash]
 *
 * - id, actorUserId, recipeId: JSON numbers, or null;
 * - occurredAt: ISO 8601 UTC with milliseconds, "2027-01-31T08:15:02.120Z";
 * - actorName, eventType, entityType, entityId, clientAddress: JSON strings (entityId and
 *   clientAddress may be null);
 * - before, after: the stored JSON value in canonical form (object keys sorted
 *   recursively, arrays in order), or null;
 * - prevHash: the previous row's hash as 64 lower-case hex digits, GENESIS_HASH for the
 *   first row.
 *
 * hash = lower-case hex SHA-256 of that text encoded as UTF-8.
 *
 * Frozen: rows already chained were hashed this way. A change needs a new version tag and
 * a migration that keeps the old rows verifiable.
 */
import { createHash } from 'node:crypto';
import { canonicalJson } from '../../../shared/canonical-json';

export const TRAIL_HASH_VERSION = 'kb-trail-1';

/** The prev_hash of the first row: no row before it. */
export const GENESIS_HASH = '0'.repeat(64);

/** The fields of a trail row that its hash covers (besides the chain link). */
export interface ChainedFields {
  id: number;
  occurredAt: Date;
  actorUserId: number | null;
  actorName: string;
  eventType: string;
  entityType: string;
  entityId: string | null;
  recipeId: number | null;
  /** Parsed JSON values (or null); serialised canonically here. */
  before: unknown;
  after: unknown;
  clientAddress: string | null;
  prevHash: string;
}

export function trailSerialisation(row: ChainedFields): string {
  if (Number.isNaN(row.occurredAt.getTime())) throw new Error(`Trail row ${row.id} has no valid time.`);
  return canonicalJson([
    TRAIL_HASH_VERSION,
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
  ]);
}

export function trailHash(row: ChainedFields): string {
  return createHash('sha256').update(trailSerialisation(row), 'utf8').digest('hex');
}
