/** Checking who someone is. Wrong name and wrong password answer alike. */
import type { Knex } from 'knex';
import { AppError } from '../../app-error';
import { findUserById, findUserRowByUsername, updateUserRow } from '../../data/users';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { decoyHash, hashPassword, needsRehash, verifyPassword } from './passwords';
import type { SessionUser } from './session-user';
import { clearSignInFailures, recordSignInFailure, releaseSignInAttempt, reserveSignInAttempt } from './sign-in-limiter';
import { toUserDto } from '../people/user-dto';

const BAD_CREDENTIALS_MESSAGE = 'The username or password is not correct.';
const DEACTIVATED_MESSAGE = 'This account has been deactivated. Ask an admin of your lab to reactivate it.';

/** Only names a user could have been created with (shared/schemas/fields.ts) can match. */
const POSSIBLE_USERNAME = /^[a-z0-9._-]{3,40}$/;

export interface SignInAttempt {
  username: string;
  password: string;
  clientAddress: string;
}

export async function signIn(db: Knex, attempt: SignInAttempt): Promise<SessionUser> {
  const name = attempt.username.trim().toLowerCase();
  const actor: Actor = { userId: null, name, clientAddress: attempt.clientAddress };
  const attemptId = await reserveSignInAttempt(db, name, attempt.clientAddress);

  const row = POSSIBLE_USERNAME.test(name) ? await findUserRowByUsername(db, name) : undefined;
  // Verify against a decoy when the name is unknown so both cases take the same time.
  const ok = await verifyPassword(attempt.password, row?.password_hash ?? (await decoyHash()));

  if (!row || !ok) {
    await db.transaction(async (trx) => {
      await recordSignInFailure(trx);
      await appendTrailEvent(trx, actor, {
        type: TRAIL_EVENTS.signInFailed,
        entityType: 'user',
        entityId: row?.id ?? null,
        after: { reason: 'bad credentials' },
      });
    });
    throw new AppError(401, 'BAD_CREDENTIALS', [{ path: '', message: BAD_CREDENTIALS_MESSAGE }]);
  }

  if (!row.active) {
    // Told plainly only to someone who knows the password; it is not counted as guessing.
    await releaseSignInAttempt(db, attemptId);
    await appendTrailEvent(
      db,
      { ...actor, userId: row.id, name: row.display_name },
      { type: TRAIL_EVENTS.signInFailed, entityType: 'user', entityId: row.id, after: { reason: 'deactivated' } },
    );
    throw new AppError(401, 'BAD_CREDENTIALS', [{ path: '', message: DEACTIVATED_MESSAGE }]);
  }

  const newHash = needsRehash(row.password_hash) ? await hashPassword(attempt.password) : null;
  return db.transaction(async (trx) => {
    const now = new Date();
    await updateUserRow(trx, row.id, { last_sign_in_at: now, ...(newHash ? { password_hash: newHash } : {}) });
    await clearSignInFailures(trx, name, attempt.clientAddress);
    await appendTrailEvent(
      trx,
      { ...actor, userId: row.id, name: row.display_name },
      { type: TRAIL_EVENTS.signedIn, entityType: 'user', entityId: row.id },
      now,
    );
    const user = (await findUserById(trx, row.id))!;
    return { ...toUserDto(user), sessionEpoch: user.session_epoch };
  });
}
