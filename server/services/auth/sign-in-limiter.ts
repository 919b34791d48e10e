/**
 * At most MAX_FAILURES failed sign-ins per (username, client address) in a sliding
 * window, and MAX_ADDRESS_FAILURES per client address over all usernames (one password
 * sprayed over many accounts stays under every per-name limit). The counter lives in
 * MariaDB so that every app process shares it (several processes may serve one lab).
 * Keyed by address so that someone guessing from one address cannot lock a person out
 * everywhere; the address limit is three times the per-name one, so a lab's shared
 * tablets behind one address still sign in after a few typos each.
 */
import type { Knex } from 'knex';
import { minutesText, tooManyAttempts } from './too-many-attempts';
import { clearFailures, deleteFailure, deleteFailuresBefore, failuresSince, insertFailure } from '../../data/sign-in-failures';

export const MAX_FAILURES = 10;
export const MAX_ADDRESS_FAILURES = 30;
export const WINDOW_MS = 15 * 60 * 1000;

/**
 * Takes one of the window's places before any password is checked, or throws 429
 * TOO_MANY_ATTEMPTS. The place is a row written first (and committed) and counted second,
 * so parallel guesses each count the ones written before them: a burst cannot slip
 * through one shared count. The row stays as the failure when the password is wrong; a
 * good sign-in clears it with the others, and releaseSignInAttempt drops it otherwise.
 */
export async function reserveSignInAttempt(db: Knex, username: string, clientAddress: string, now = new Date()): Promise<number> {
  const id = await insertFailure(db, username, clientAddress, now);
  const since = new Date(now.getTime() - WINDOW_MS);
  const [named, address] = await Promise.all([failuresSince(db, username, clientAddress, since, id), failuresSince(db, null, clientAddress, since, id)]);
  const overNamed = named.count > MAX_FAILURES;
  const overAddress = address.count > MAX_ADDRESS_FAILURES;
  if (!overNamed && !overAddress) return id;
  // The refusal itself is not counted as another failure.
  await deleteFailure(db, id);
  // The limit lifts when the oldest failure of the count that was exceeded leaves the window.
  const window = overNamed ? named : address;
  const retryAt = new Date((window.oldest ?? now).getTime() + WINDOW_MS);
  throw tooManyAttempts(
    retryAt,
    now,
    ({ minutes, at }) =>
      (overNamed ? `Too many failed sign-ins for this username from your address. ` : `Too many failed sign-ins from your address. `) +
      `Try again in ${minutesText(minutes)} (after ${at} UTC).`,
  );
}

/** An attempt that was not a guess (e.g. the right password of a deactivated account) gives its place back. */
export async function releaseSignInAttempt(db: Knex, attemptId: number): Promise<void> {
  await deleteFailure(db, attemptId);
}

/** A wrong password: its reserved place stays as the failure; rows far outside any window go now and then. */
export async function recordSignInFailure(trx: Knex, now = new Date()): Promise<void> {
  await deleteFailuresBefore(trx, new Date(now.getTime() - 24 * 60 * 60 * 1000));
}

/** A good sign-in clears the count for that name from that address only. */
export async function clearSignInFailures(trx: Knex, username: string, clientAddress: string): Promise<void> {
  await clearFailures(trx, username, clientAddress);
}
