import { setTimeout as sleep } from 'node:timers/promises';
import type { forgotPasswordBody, linkTokenBody, setPasswordBody } from '../../../shared/schemas/mail';
import { FORGOT_FLOOR_MS, inspectLink, requestPasswordReset, setPasswordWithLink } from '../../services/auth/password-links';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

/**
 * POST /api/password/forgot — always 202 with the same text, never sooner than the floor:
 * the work is done first, then the rest of the floor is waited out, so neither the answer
 * nor its time tells whether the address belongs to anyone.
 */
export const forgot: RouteHandler<{ body: typeof forgotPasswordBody }> = async (req, res, { db, mail }, { body }) => {
  const started = Date.now();
  const answer = await requestPasswordReset(db, actorOf(req), mail, body.email);
  const rest = started + FORGOT_FLOOR_MS - Date.now();
  if (rest > 0) await sleep(rest);
  res.status(202).json(answer);
};

/** POST /api/password/link — what a link is for (LinkInfoDto), or why it no longer works. */
export const inspect: RouteHandler<{ body: typeof linkTokenBody }> = async (_req, res, { db }, { body }) => {
  res.json(await inspectLink(db, body.token));
};

/** POST /api/password/set — use the link once to set a password; the person then signs in. */
export const set: RouteHandler<{ body: typeof setPasswordBody }> = async (req, res, { db }, { body }) => {
  res.json(await setPasswordWithLink(db, actorOf(req), body.token, body.newPassword));
};
