/**
 * Single-use links: invitation (72 h) and password reset (1 h). The token is 32
 * random bytes in base64url and only its SHA-256 is stored, so a reader of the database
 * cannot use a link. Issuing a link voids the person's older open links of the same purpose.
 */
import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { AppError } from '../../app-error';
import { findTokenByHash, insertUserToken, markTokenUsed, voidOpenTokens, type TokenPurpose, type UserTokenRow } from '../../data/user-tokens';
import { findUserRowById, type UserRow } from '../../data/users';

export type { TokenPurpose } from '../../data/user-tokens';

const HOUR_MS = 60 * 60 * 1000;

/** How long a link works. */
export const TOKEN_LIFETIME_MS: Record<TokenPurpose, number> = {
  invitation: 72 * HOUR_MS,
  'password-reset': 1 * HOUR_MS,
};

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export interface IssuedToken {
  /** The secret for the mail; never stored. */
  token: string;
  expiresAt: Date;
}

/** Issues a link inside the caller's transaction, voiding the person's open links of the same purpose. */
export async function issueToken(
  trx: Knex.Transaction,
  userId: number,
  purpose: TokenPurpose,
  createdBy: number | null,
  now: Date = new Date(),
): Promise<IssuedToken> {
  await voidOpenTokens(trx, userId, now, purpose);
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(now.getTime() + TOKEN_LIFETIME_MS[purpose]);
  await insertUserToken(trx, { user_id: userId, purpose, token_sha256: hashToken(token), created_at: now, expires_at: expiresAt, created_by: createdBy });
  return { token, expiresAt };
}

export const LINK_INVALID_MESSAGE = 'This link is not valid. Copy the whole link from the mail, or ask for a new one.';
export const LINK_USED_MESSAGE = 'This link has already been used or was replaced by a newer one. Ask for a new one if you still need it.';
export const LINK_EXPIRED_MESSAGE = 'This link has expired. Ask for a new one: an admin can send a new invitation, or use "Forgot password".';

function linkInvalid(): AppError {
  return new AppError(400, 'LINK_INVALID', [{ path: 'token', message: LINK_INVALID_MESSAGE }]);
}

export interface ValidLink {
  token: UserTokenRow;
  user: UserRow;
}

/**
 * The link and its person, or the refusal: unknown, tampered, or of a deactivated person →
 * 400 LINK_INVALID; used or voided → 410 LINK_USED; past its time → 410 LINK_EXPIRED.
 * With `forUpdate` the token and person rows stay locked until the transaction ends, so two
 * requests with the same link cannot both redeem it: the second waits and then sees it used.
 */
export async function checkToken(db: Knex, token: string, now: Date = new Date(), forUpdate = false): Promise<ValidLink> {
  const row = await findTokenByHash(db, hashToken(token), forUpdate);
  if (!row) throw linkInvalid();
  const user = await findUserRowById(db, row.user_id, forUpdate);
  if (!user || !user.active) throw linkInvalid();
  if (row.used_at) throw new AppError(410, 'LINK_USED', [{ path: 'token', message: LINK_USED_MESSAGE }]);
  if (new Date(row.expires_at).getTime() <= now.getTime()) throw new AppError(410, 'LINK_EXPIRED', [{ path: 'token', message: LINK_EXPIRED_MESSAGE }]);
  return { token: row, user };
}

/**
 * Redeems a link in the caller's transaction: checks it under lock, marks it used and voids
 * every other open link of the person. Then the caller changes the password in the same
 * transaction.
 */
export async function redeemToken(trx: Knex.Transaction, token: string, now: Date = new Date()): Promise<ValidLink> {
  const link = await checkToken(trx, token, now, true);
  await markTokenUsed(trx, link.token.id, now);
  await voidOpenTokens(trx, link.user.id, now);
  return link;
}
