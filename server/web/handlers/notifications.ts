import type { notificationPreferencesBody } from '../../../shared/schemas/mail';
import { getNotificationPreferences, updateNotificationPreferences } from '../../services/mail/preferences';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

/** GET /api/session/notifications — the signed-in person's mails, each on or off. */
export const get: RouteHandler = async (req, res, { db }) => {
  res.json(await getNotificationPreferences(db, req.user!.id));
};

/** PATCH /api/session/notifications — turn optional mails on or off. */
export const update: RouteHandler<{ body: typeof notificationPreferencesBody }> = async (req, res, { db }, { body }) => {
  res.json(await updateNotificationPreferences(db, actorOf(req), req.user!.id, body));
};
