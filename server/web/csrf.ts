/**
 * CSRF protection (double-submit cookie, csrf-csrf 4) tied to the session id. Every
 * state-changing request must echo the token in the `x-csrf-token` header.
 */
import { createHmac } from 'node:crypto';
import { doubleCsrf } from 'csrf-csrf';
import type { Request, RequestHandler, Response } from 'express';
import { CSRF_HEADER } from '../../shared/api-types';
import { AppError } from '../app-error';

/** Not `__Host-…`: that prefix demands a Secure cookie, which plain http on loopback cannot set. */
export const CSRF_COOKIE = 'kerfbook.csrf';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export interface Csrf {
  /** Checks the token on POST, PUT, PATCH and DELETE. */
  protect: RequestHandler;
  /**
   * A token for the current session (and its cookie). `fresh` makes a new one even when
   * the cookie still holds a valid token, e.g. after the session id changed at sign-in.
   */
  issue(req: Request, res: Response, fresh?: boolean): string;
}

export function createCsrf(sessionSecret: string): Csrf {
  // A key of its own, derived from the session secret, so one value configures both.
  const secret = createHmac('sha256', sessionSecret).update('kerfbook csrf').digest('hex');
  const { generateCsrfToken, validateRequest } = doubleCsrf({
    getSecret: () => secret,
    getSessionIdentifier: (req) => req.session.id,
    cookieName: CSRF_COOKIE,
    cookieOptions: { sameSite: 'strict', path: '/', secure: false, httpOnly: true },
    getCsrfTokenFromRequest: (req) => req.headers[CSRF_HEADER] as string | undefined,
  });

  const protect: RequestHandler = (req, _res, next) => {
    if (!STATE_CHANGING.has(req.method) || validateRequest(req)) return next();
    next(
      new AppError(403, 'CSRF_INVALID', [
        { path: '', message: 'The security token of this request is missing or out of date. Reload the page and try again.' },
      ]),
    );
  };

  return {
    protect,
    issue: (req, res, fresh = false) =>
      // Secure only when the request itself came over TLS (directly or via a trusted proxy).
      generateCsrfToken(req, res, { overwrite: fresh, cookieOptions: { secure: req.secure } }),
  };
}
