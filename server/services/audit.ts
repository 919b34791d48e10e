/**
 * The trail. Every change writes one event inside the transaction that makes the change,
 * so a change never lands without its event and a refused request leaves nothing.
 */
import type { Knex } from 'knex';
import { insertAuditEvent } from '../data/audit-events';
import type { Actor } from './actor';

export const AUDIT_EVENTS = {
  userCreated: 'user.created',
  userRolesChanged: 'user.roles_changed',
  userDetailsChanged: 'user.details_changed',
  userDeactivated: 'user.deactivated',
  userReactivated: 'user.reactivated',
  userTemporaryPasswordSet: 'user.temporary_password_set',
  ownPasswordChanged: 'user.password_changed',
  preferencesChanged: 'user.preferences_changed',
  signedIn: 'session.signed_in',
  signInFailed: 'session.sign_in_failed',
  signedOut: 'session.signed_out',
  materialCreated: 'material.created',
  materialUpdated: 'material.updated',
  materialArchived: 'material.archived',
  materialUnarchived: 'material.unarchived',
  materialDeleted: 'material.deleted',
  wheelCreated: 'wheel.created',
  wheelUpdated: 'wheel.updated',
  wheelArchived: 'wheel.archived',
  wheelUnarchived: 'wheel.unarchived',
  wheelDeleted: 'wheel.deleted',
  machineCreated: 'machine.created',
  machineUpdated: 'machine.updated',
  machineArchived: 'machine.archived',
  machineUnarchived: 'machine.unarchived',
  machineDeleted: 'machine.deleted',
  selectionRowCreated: 'selection_row.created',
  selectionRowUpdated: 'selection_row.updated',
  selectionRowDeleted: 'selection_row.deleted',
  recipeCreated: 'recipe.created',
  draftSaved: 'recipe.draft_saved',
  attachmentAdded: 'attachment.added',
  attachmentDeleted: 'attachment.deleted',
} as const;

export type AuditEventType = (typeof AUDIT_EVENTS)[keyof typeof AUDIT_EVENTS];

/** Keys that must never reach the trail, whatever a caller passes in before/after. */
const SECRET_KEYS = /password|hash|secret|token/i;

function toJson(value: Record<string, unknown> | null | undefined): string | null {
  if (value == null) return null;
  for (const key of Object.keys(value)) {
    if (SECRET_KEYS.test(key) && key !== 'mustChangePassword') {
      throw new Error(`Refusing to write "${key}" to the audit trail.`);
    }
  }
  return JSON.stringify(value);
}

export type AuditEntityType = 'user' | 'material' | 'wheel' | 'machine' | 'selection_row' | 'recipe' | 'recipe_version' | 'attachment';

export interface AuditEntry {
  type: AuditEventType;
  entityType: AuditEntityType;
  entityId: number | null;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
  /** Overrides the actor's name, e.g. the username typed at a failed sign-in. */
  actorName?: string;
}

export async function recordAudit(trx: Knex, actor: Actor, entry: AuditEntry, at = new Date()): Promise<void> {
  await insertAuditEvent(trx, {
    occurred_at: at,
    actor_user_id: actor.userId,
    actor_name: (entry.actorName ?? actor.name).slice(0, 100),
    event_type: entry.type,
    entity_type: entry.entityType,
    entity_id: entry.entityId === null ? null : String(entry.entityId),
    before_json: toJson(entry.before),
    after_json: toJson(entry.after),
    client_address: actor.clientAddress.slice(0, 64) || null,
  });
}
