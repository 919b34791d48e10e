/**
 * Which optional mails a person wants (My account). Every kind is on until turned off; the
 * request to acknowledge a new version on one's machine cannot be turned off. The mail
 * senders read `notification_opt_outs` themselves; this service only shows and writes it.
 */
import type { Knex } from 'knex';
import type { NotificationPreferencesDto } from '../../../shared/api-types';
import { NOTIFICATION_INFO, type NotificationKind } from '../../../shared/notification-kinds';
import type { NotificationPreferencesBody } from '../../../shared/schemas/mail';
import { AppError } from '../../app-error';
import { addOptOut, optedOutKinds, removeOptOut } from '../../data/notification-opt-outs';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';

export const MANDATORY_KIND_MESSAGE =
  'The mail asking you to acknowledge a new version in use on your machine cannot be turned off: operators must hear of every change to their recipes.';

/** Refuses an attempt to turn off a mail that is not optional (the body schema has no key for it). */
export function assertNoMandatoryOptOut(body: unknown): void {
  if (typeof body !== 'object' || body === null) return;
  for (const info of NOTIFICATION_INFO) {
    if (!info.optional && info.kind in body) {
      throw AppError.validation([{ path: info.kind, message: MANDATORY_KIND_MESSAGE }]);
    }
  }
}

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

export async function updateNotificationPreferences(db: Knex, actor: Actor, userId: number, changes: NotificationPreferencesBody): Promise<NotificationPreferencesDto> {
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
