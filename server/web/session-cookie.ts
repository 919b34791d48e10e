import session from 'express-session';
import type { RequestHandler } from 'express';
import type { SessionStore } from './session-store';

export const SESSION_COOKIE = 'kerfbook.sid';

/** Idle timeout: a session ends after this long without a request (rolling). */
export const SESSION_IDLE_MS = 8 * 60 * 60 * 1000;

export function sessionMiddleware(store: SessionStore, secret: string): RequestHandler {
  return session({
    name: SESSION_COOKIE,
    secret,
    store,
    resave: false,
    // Anonymous visitors get no stored session until they ask for a CSRF token.
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      // Secure when the request came over TLS (honours `trust proxy`); plain http on
      // loopback keeps working.
      secure: 'auto',
      path: '/',
      maxAge: SESSION_IDLE_MS,
    },
  });
}
