/**
 * Which optional mails a person wants (My account). Every kind is on until turned off; the
 * request to acknowledge a new version on one's machine cannot be turned off (the body
 * schema refuses it). The mail
 * senders read `notification_opt_outs` themselves; this service only shows and writes it.
 */
import type { Knex } from 'knex';
import type { NotificationPreferencesDto } from '../../../shared/api-types';
import { NOTIFICATION_INFO, type NotificationKind } from '../../../shared/notification-kinds';
import type { NotificationPreferencesBody } from '../../../shared/schemas/mail';
import { addOptOut, optedOutKinds, removeOptOut } from '../../data/notification-opt-outs';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';

export async function getNotificationPreferences(db: Knex, userId: number): Promise<NotificationPreferencesDto> {
  const off = new Set(await optedOutKinds(db, userId));
  return {
    items: NOTIFICATION_INFO.map((info) => ({
      kind: info.kind,
      label: info.label,
      audience: info.audience,
      optional: info.optional,
      enabled: !info.optional || !off.has(info.kind),
    })),
  };
}

export async function updateNotificationPreferences(
  db: Knex,
  actor: Actor,
  userId: number,
  changes: NotificationPreferencesBody,
): Promise<NotificationPreferencesDto> {
  await db.transaction(async (trx) => {
    const off = new Set(await optedOutKinds(trx, userId));
    const before: Record<string, boolean> = {};
    const after: Record<string, boolean> = {};
    for (const [kind, enabled] of Object.entries(changes) as [NotificationKind, boolean | undefined][]) {
      if (enabled === undefined || enabled === !off.has(kind)) continue;
      before[kind] = !enabled;
      after[kind] = enabled;
      if (enabled) await removeOptOut(trx, userId, kind);
      else await addOptOut(trx, userId, kind);
    }
    if (Object.keys(after).length > 0) {
      await appendTrailEvent(trx, actor, { type: TRAIL_EVENTS.notificationPreferencesChanged, entityType: 'user', entityId: userId, before, after });
    }
  });
  return getNotificationPreferences(db, userId);
}
