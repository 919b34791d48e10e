/**
 * At most MAX_FAILURES failed sign-ins per (username, client address) in a sliding
 * window. The counter lives in MariaDB so that every app process shares it (design 12).
 * Keyed by both so that someone guessing from one address cannot lock a person out
 * everywhere.
 */
import type { Knex } from 'knex';
import { AppError } from '../app-error';
import { clearFailures, deleteFailuresBefore, failuresSince, insertFailure } from '../data/sign-in-failures';

export const MAX_FAILURES = 10;
export const WINDOW_MS = 15 * 60 * 1000;

/** Throws 429 TOO_MANY_ATTEMPTS when the limit is reached, before any password is checked. */
export async function assertSignInAllowed(db: Knex, username: string, clientAddress: string, now = new Date()): Promise<void> {
  const window = await failuresSince(db, username, clientAddress, new Date(now.getTime() - WINDOW_MS));
  if (window.count < MAX_FAILURES) return;
  const retryAt = new Date((window.oldest ?? now).getTime() + WINDOW_MS);
  const seconds = Math.max(1, Math.ceil((retryAt.getTime() - now.getTime()) / 1000));
  const minutes = Math.ceil(seconds / 60);
  throw new AppError(
    429,
    'TOO_MANY_ATTEMPTS',
    [
      {
        path: '',
        message:
          `Too many failed sign-ins for this username from your address. ` +
          `Try again in ${minutes} minute${minutes === 1 ? '' : 's'} (after ${retryAt.toISOString().slice(11, 16)} UTC).`,
      },
    ],
    { headers: { 'Retry-After': String(seconds) } },
  );
}

export async function recordSignInFailure(trx: Knex, username: string, clientAddress: string, now = new Date()): Promise<void> {
  await insertFailure(trx, username, clientAddress, now);
  await deleteFailuresBefore(trx, new Date(now.getTime() - 24 * 60 * 60 * 1000));
}

/** A good sign-in clears the count for that name from that address only. */
export async function clearSignInFailures(trx: Knex, username: string, clientAddress: string): Promise<void> {
  await clearFailures(trx, username, clientAddress);
}
