import type { CsrfDto, SessionDto, UserDto } from '../../../shared/api-types';
import type { changePasswordBody, preferencesBody, signInBody } from '../../../shared/schemas/session';
import { changeOwnPassword, recordSignOut, updatePreferences as saveUnits } from '../../services/auth/own-account';
import type { SessionUser } from '../../services/auth/session-user';
import { authenticateWithPassword, destroySession, startSession } from '../authentication';
import { CSRF_COOKIE } from '../csrf';
import type { RouteHandler } from '../route-definition';
import { SESSION_COOKIE } from '../session-cookie';
import { actorOf } from './request-actor';

function toDto({ sessionEpoch: _epoch, ...user }: SessionUser): UserDto {
  return user;
}

export const issueCsrfToken: RouteHandler = (req, res, { csrf }) => {
  // Marks the anonymous session so it is stored (saveUninitialized is off); the token
  // is bound to its id.
  req.session.csrfIssuedAt = Date.now();
  const body: CsrfDto = { csrfToken: csrf.issue(req, res) };
  res.json(body);
};

export const current: RouteHandler = (req, res, { csrf, devOutbox }) => {
  const body: SessionDto = { user: toDto(req.user!), csrfToken: csrf.issue(req, res), devOutbox, signatureNeedsUsername: !actorOf(req).signedFullyInSession };
  res.json(body);
};

export const signIn: RouteHandler<{ body: typeof signInBody }> = async (req, res, { csrf, auth, devOutbox }, { body }) => {
  // The password strategy reads the request body: hand it the validated one.
  req.body = body;
  const user = await authenticateWithPassword(auth, req, res);
  await startSession(req, user);
  // New session id → the old token no longer matches: hand out a fresh one.
  const answer: SessionDto = { user: toDto(user), csrfToken: csrf.issue(req, res, true), devOutbox, signatureNeedsUsername: true };
  res.json(answer);
};

export const signOut: RouteHandler = async (req, res, { db }) => {
  await recordSignOut(db, actorOf(req), req.user!.id);
  await destroySession(req);
  res.clearCookie(SESSION_COOKIE, { path: '/' });
  res.clearCookie(CSRF_COOKIE, { path: '/' });
  res.status(204).end();
};

export const changePassword: RouteHandler<{ body: typeof changePasswordBody }> = async (req, res, { db, csrf, devOutbox, mail }, { body }) => {
  const user = await changeOwnPassword(db, actorOf(req), req.user!.id, body.currentPassword, body.newPassword, mail);
  // Every other session just ended (epoch bump); this one carries on under a new id.
  await startSession(req, user);
  const answer: SessionDto = { user: toDto(user), csrfToken: csrf.issue(req, res, true), devOutbox, signatureNeedsUsername: true };
  res.json(answer);
};

export const updatePreferences: RouteHandler<{ body: typeof preferencesBody }> = async (req, res, { db, csrf, devOutbox }, { body }) => {
  const user = await saveUnits(db, actorOf(req), req.user!.id, body.units);
  const answer: SessionDto = { user: toDto(user), csrfToken: csrf.issue(req, res), devOutbox, signatureNeedsUsername: !actorOf(req).signedFullyInSession };
  res.json(answer);
};
