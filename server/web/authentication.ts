/**
 * Who is signed in: passport 0.7 with the local strategy. The session keeps only
 * {id, epoch}; each request reloads the person, so deactivation and password changes
 * take effect at once (a stale epoch or an inactive person reads as signed out).
 */
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Request, Response } from 'express';
import type { Knex } from 'knex';
import { AppError } from '../app-error';
import { loadSessionUser, type SessionRef, type SessionUser } from '../services/auth/session-user';
import { signIn } from '../services/auth/sign-in';

export type Authenticator = passport.Authenticator;

export function createAuthenticator(db: Knex): Authenticator {
  // An instance per app, not passport's global one, so several apps (tests) can coexist.
  const auth = new passport.Authenticator();
  auth.use(
    'local',
    new LocalStrategy({ passReqToCallback: true }, (req, username, password, done) => {
      signIn(db, { username, password, clientAddress: req.ip ?? '' }).then(
        (user) => done(null, user),
        (err: unknown) => done(err),
      );
    }),
  );
  auth.serializeUser((user, done) => {
    const ref: SessionRef = { id: user.id, epoch: user.sessionEpoch };
    done(null, ref);
  });
  auth.deserializeUser((ref: SessionRef, done) => {
    loadSessionUser(db, ref).then(
      (user) => done(null, user ?? false),
      (err: unknown) => done(err),
    );
  });
  return auth;
}

/** Runs the local strategy on an already validated body; resolves with the person. */
export function authenticateWithPassword(auth: Authenticator, req: Request, res: Response): Promise<SessionUser> {
  return new Promise((resolve, reject) => {
    auth.authenticate('local', { session: false }, (err: unknown, user: SessionUser | false) => {
      if (err) return reject(err);
      // The strategy only fails without calling back when a field is missing, which the
      // schema has already ruled out; answered like any bad credentials all the same.
      if (!user) return reject(new AppError(401, 'BAD_CREDENTIALS', [{ path: '', message: 'The username or password is not correct.' }]));
      resolve(user);
    })(req, res, reject);
  });
}

/** Starts a new session for the person (passport 0.7 regenerates the session id). */
export function startSession(req: Request, user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, (err: unknown) => (err ? reject(err) : resolve())));
}

export function destroySession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.destroy((err: unknown) => (err ? reject(err) : resolve())));
}
