/**
 * Wrong passwords typed by a signed-in person — signing (approve, withdraw) or changing
 * their own password — counted per person over both, whatever the address: someone at an
 * unattended session could otherwise guess its owner's password there without end. At
 * MAX_PASSWORD_CHECK_FAILURES in the window the check is refused (429) even with the right
 * password until the oldest failure leaves the window. Each wrong password is a trail event;
 * reaching the limit is one too, mails the admins and ends every session of the person, so
 * whoever was guessing loses the session (21 CFR 11.300(d): attempts at unauthorized use
 * are detected and reported at once; README "What it does", review and approval).
 */
import type { Knex } from 'knex';
import type { AppError } from '../../app-error';
import {
  clearPasswordCheckFailures,
  deletePasswordCheckFailure,
  deletePasswordCheckFailuresBefore,
  insertPasswordCheckFailure,
  personFailuresSince,
  type PasswordCheckPurpose,
} from '../../data/password-check-failures';
import { bumpSessionEpoch } from '../../data/users';
import type { Actor } from '../actor';
import { enqueueMail } from '../mail/outbox';
import { adminsToAlert, wrongPasswordLimitMail } from '../mail/security-mails';
import { DEFAULT_MAIL_SETTINGS, type MailSettings } from '../mail/settings';
import { appendTrailEvent } from '../trail/append';
import { TRAIL_EVENTS } from '../trail/event-types';
import { verifyPassword } from './passwords';
import { minutesText, tooManyAttempts } from './too-many-attempts';

/** Half the sign-in limit: a signed-in person has already proven who they are once. */
export const MAX_PASSWORD_CHECK_FAILURES = 5;
export const PASSWORD_CHECK_WINDOW_MS = 15 * 60 * 1000;
const WINDOW_MINUTES = PASSWORD_CHECK_WINDOW_MS / 60000;

export interface LimitedPasswordCheck {
  user: { id: number; username: string; displayName: string; passwordHash: string };
  password: string;
  purpose: PasswordCheckPurpose;
  /** For a signature: the version being signed and the meaning, named in the trail. */
  signing?: { versionId: number; meaning: string };
}

function blocked(until: Date, now: Date): AppError {
  return tooManyAttempts(
    until,
    now,
    ({ minutes, at }) => `Too many wrong passwords. Signing and changing your password are blocked; try again in ${minutesText(minutes)} (after ${at} UTC).`,
  );
}

function limitReached(until: Date, now: Date): AppError {
  return tooManyAttempts(
    until,
    now,
    ({ at }) =>
      `${MAX_PASSWORD_CHECK_FAILURES} wrong passwords in ${WINDOW_MINUTES} minutes: signing and changing your password are blocked until ${at} UTC. ` +
      `You have been signed out everywhere and your lab's admins have been told. Sign in again to carry on with other work.`,
  );
}

/**
 * True for the right password (the person's count starts again), false for a wrong one below
 * the limit (recorded and trailed); throws 429 when the limit is reached or already was. The
 * place is a row written first (and committed) and counted second, as the sign-in limit
 * does, so parallel guesses cannot slip through one shared count.
 */
export async function checkPasswordWithLimit(
  db: Knex,
  actor: Actor,
  check: LimitedPasswordCheck,
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
  now = new Date(),
): Promise<boolean> {
  const userId = check.user.id;
  const id = await insertPasswordCheckFailure(db, userId, check.purpose, now);
  const window = await personFailuresSince(db, userId, new Date(now.getTime() - PASSWORD_CHECK_WINDOW_MS), id);
  const until = new Date((window.oldest ?? now).getTime() + PASSWORD_CHECK_WINDOW_MS);
  if (window.count > MAX_PASSWORD_CHECK_FAILURES) {
    // A refused try is not checked, so it is neither another failure nor trailed.
    await deletePasswordCheckFailure(db, id);
    throw blocked(until, now);
  }

  if (await verifyPassword(check.password, check.user.passwordHash)) {
    await clearPasswordCheckFailures(db, userId);
    return true;
  }

  const reached = window.count === MAX_PASSWORD_CHECK_FAILURES;
  await db.transaction(async (trx) => {
    await deletePasswordCheckFailuresBefore(trx, new Date(now.getTime() - 24 * 60 * 60 * 1000));
    if (reached) {
      await bumpSessionEpoch(trx, userId);
      const { username, displayName } = check.user;
      const limit = {
        userId,
        username,
        displayName,
        purpose: check.purpose,
        failures: window.count,
        windowMinutes: WINDOW_MINUTES,
        clientAddress: actor.clientAddress,
        at: now,
        blockedUntil: until,
      };
      for (const admin of await adminsToAlert(trx)) await enqueueMail(trx, wrongPasswordLimitMail(mail, admin, limit), now);
    }
    // Mails first, trail events last: their chain-head lock is the last one taken.
    await appendTrailEvent(
      trx,
      actor,
      check.signing
        ? {
            type: TRAIL_EVENTS.signaturePasswordWrong,
            entityType: 'recipe_version',
            entityId: check.signing.versionId,
            after: { meaning: check.signing.meaning, failures: window.count },
          }
        : { type: TRAIL_EVENTS.currentPasswordWrong, entityType: 'user', entityId: userId, after: { failures: window.count } },
      now,
    );
    if (reached) {
      await appendTrailEvent(
        trx,
        actor,
        {
          type: TRAIL_EVENTS.wrongPasswordLimitReached,
          entityType: 'user',
          entityId: userId,
          after: { purpose: check.purpose, failures: window.count, windowMinutes: WINDOW_MINUTES, blockedUntil: until.toISOString(), sessionsEnded: true },
        },
        now,
      );
    }
  });
  if (reached) throw limitReached(until, now);
  return false;
}
