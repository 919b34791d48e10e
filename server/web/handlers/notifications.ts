import { notificationPreferencesBody } from '../../../shared/schemas/mail';
import { assertNoMandatoryOptOut, getNotificationPreferences, updateNotificationPreferences } from '../../services/mail/preferences';
import type { RouteHandler } from '../route-definition';
import { bodyOf, parse } from './parse';
import { actorOf } from './request-actor';

/** GET /api/session/notifications — the signed-in person's mails, each on or off. */
export const get: RouteHandler = async (req, res, { db }) => {
  res.json(await getNotificationPreferences(db, req.user!.id));
};

/** PATCH /api/session/notifications — turn optional mails on or off. */
export const update: RouteHandler = async (req, res, { db }) => {
  const raw = bodyOf(req.body);
  // Before the schema: its "unknown key" error would not say why this one is refused.
  assertNoMandatoryOptOut(raw);
  const body = parse(notificationPreferencesBody, raw);
  res.json(await updateNotificationPreferences(db, actorOf(req), req.user!.id, body));
};
