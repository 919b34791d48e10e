/** What every signed-in person may do to their own account. */
import type { Knex } from 'knex';
import type { UnitPreference } from '../../../shared/api-types';
import { AppError } from '../../app-error';
import { findUserById, updateUserRow } from '../../data/users';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { replacePassword } from './password-replacement';
import { DEFAULT_MAIL_SETTINGS, type MailSettings } from '../mail/settings';
import { checkPasswordWithLimit } from './password-check-limiter';
import { hashPassword } from './passwords';
import type { SessionUser } from './session-user';
import { toUserDto } from '../people/user-dto';

async function reload(db: Knex, userId: number): Promise<SessionUser> {
  const user = await findUserById(db, userId);
  if (!user) throw AppError.notFound('Your account no longer exists.');
  return { ...toUserDto(user), sessionEpoch: user.session_epoch };
}

/**
 * Replaces one's own password after checking the current one. Ends every other session
 * (epoch bump); the caller starts a fresh session with the returned epoch. A wrong current
 * password counts toward the person's wrong-password limit (password-check-limiter.ts).
 */
export async function changeOwnPassword(
  db: Knex,
  actor: Actor,
  userId: number,
  currentPassword: string,
  newPassword: string,
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): Promise<SessionUser> {
  const user = await findUserById(db, userId);
  if (!user) throw AppError.notFound('Your account no longer exists.');
  const check = {
    user: { id: user.id, username: user.username, displayName: user.display_name, passwordHash: user.password_hash },
    password: currentPassword,
    purpose: 'password-change' as const,
  };
  if (!(await checkPasswordWithLimit(db, actor, check, mail))) {
    throw AppError.validation([{ path: 'currentPassword', message: 'The current password is not correct.' }]);
  }
  const newHash = await hashPassword(newPassword);
  await db.transaction((trx) =>
    replacePassword(trx, actor, { userId, passwordHash: newHash, mustChange: false, mustChangeBefore: Boolean(user.must_change_password) }),
  );
  return reload(db, userId);
}

export async function updatePreferences(db: Knex, actor: Actor, userId: number, units: UnitPreference): Promise<SessionUser> {
  await db.transaction(async (trx) => {
    const user = await findUserById(trx, userId, true);
    if (!user) throw AppError.notFound('Your account no longer exists.');
    if (user.units === units) return;
    const now = new Date();
    await updateUserRow(trx, userId, { units, updated_at: now });
    await appendTrailEvent(
      trx,
      actor,
      { type: TRAIL_EVENTS.preferencesChanged, entityType: 'user', entityId: userId, before: { units: user.units }, after: { units } },
      now,
    );
  });
  return reload(db, userId);
}

export async function recordSignOut(db: Knex, actor: Actor, userId: number): Promise<void> {
  await appendTrailEvent(db, actor, { type: TRAIL_EVENTS.signedOut, entityType: 'user', entityId: userId });
}
