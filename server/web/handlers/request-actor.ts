import type { Request } from 'express';
import type { Actor } from '../../services/actor';

/** The person behind a request, for services and the trail. */
export function actorOf(req: Request): Actor {
  return {
    userId: req.user?.id ?? null,
    name: req.user?.displayName ?? '',
    clientAddress: req.ip ?? '',
  };
}
