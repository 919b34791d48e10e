import { AppError } from '../../app-error';
import { listOutbox } from '../../services/mail/outbox';
import type { RouteHandler } from '../route-definition';

/**
 * The mail outbox, newest first: a development aid (is the mail there, was it sent, why
 * not). A production server answers 404, as if the route did not exist.
 */
export const list: RouteHandler = async (_req, res, { db, devOutbox }) => {
  if (!devOutbox) throw AppError.notFound('No such route.');
  res.json({ items: await listOutbox(db) });
};
