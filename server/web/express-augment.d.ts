import type { SessionUser } from '../services/auth/session-user';

declare global {
  namespace Express {
    // passport's req.user is the signed-in person as loaded on each request.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    /** Set when an anonymous client asks for a CSRF token, so the session gets stored. */
    csrfIssuedAt?: number;
    /** The person who completed a signing with username and password in this session. */
    fullSigningBy?: number;
  }
}

export {};
