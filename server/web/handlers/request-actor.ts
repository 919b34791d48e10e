import type { Request } from 'express';
import type { Actor } from '../../services/actor';

/** The person behind a request, for services and the trail. */
export function actorOf(req: Request): Actor {
  return {
    userId: req.user?.id ?? null,
    name: req.user?.displayName ?? '',
    clientAddress: req.ip ?? '',
    signedFullyInSession: req.user !== undefined && req.session?.fullSigningBy === req.user.id,
  };
}

/**
 * Remembers in the session that its person completed a signing with both components, so the
 * next signing in this continuous session asks for the password only. Signing in again or
 * changing the password starts a new session, which forgets it.
 */
export function rememberFullSigning(req: Request): void {
  if (req.user) req.session.fullSigningBy = req.user.id;
}
