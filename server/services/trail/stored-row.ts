/** A trail row as read back from the database: the fields its hash covers, and its DTO. */
import type { TrailEventDto } from '../../../shared/recipe-types';
import type { StoredTrailEventRow } from '../../data/trail-events';
import type { ChainedFields } from './hash';
import { fallbackWhat } from './subjects';

const json = (value: unknown): unknown => (typeof value === 'string' ? JSON.parse(value) : (value ?? null));

/** A stored row as the fields its hash covers. */
export function chainedFields(row: Omit<StoredTrailEventRow, 'hash'> & { hash?: string }): ChainedFields {
  return {
    id: Number(row.id),
    occurredAt: row.occurred_at,
    actorUserId: row.actor_user_id,
    actorName: row.actor_name,
    eventType: row.event_type,
    entityType: row.entity_type,
    entityId: row.entity_id,
    recipeId: row.recipe_id,
    before: json(row.before_json),
    after: json(row.after_json),
    clientAddress: row.client_address,
    prevHash: row.prev_hash,
  };
}

export function toTrailEventDto(row: StoredTrailEventRow): TrailEventDto {
  return {
    id: Number(row.id),
    occurredAt: row.occurred_at.toISOString(),
    actorId: row.actor_user_id,
    actorName: row.actor_name,
    type: row.event_type,
    entityType: row.entity_type,
    entityId: row.entity_id,
    before: json(row.before_json),
    after: json(row.after_json),
    clientAddress: row.client_address,
    what: fallbackWhat({ entityType: row.entity_type, entityId: row.entity_id }),
    prevHash: row.prev_hash,
    hash: row.hash,
  };
}
