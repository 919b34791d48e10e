import type { Knex } from 'knex';
import type { UserDto } from '../../../shared/api-types';
import { findUserById } from '../../data/users';
import { toUserDto } from '../people/user-dto';

/** The signed-in person as requests see it (`req.user`): the DTO plus the epoch the session began in. */
export interface SessionUser extends UserDto {
  sessionEpoch: number;
}

/** What the session cookie's record keeps: just enough to reload the person on each request. */
export interface SessionRef {
  id: number;
  epoch: number;
}

/**
 * Reloads the person behind a session. Deactivated people and sessions begun before the
 * last epoch bump (password set or changed, deactivation) count as signed out: null.
 */
export async function loadSessionUser(db: Knex, ref: SessionRef): Promise<SessionUser | null> {
  if (!ref || typeof ref.id !== 'number' || typeof ref.epoch !== 'number') return null;
  const user = await findUserById(db, ref.id);
  if (!user || !user.active || user.session_epoch !== ref.epoch) return null;
  return { ...toUserDto(user), sessionEpoch: user.session_epoch };
}
