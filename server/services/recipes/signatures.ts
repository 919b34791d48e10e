/**
 * Electronic signatures (21 CFR 11.50, 11.70, 11.200): the first signing in a continuous
 * session takes both components (username and password), later ones the password again
 * (11.200(a)(1)(i)–(ii)); the signature keeps the printed name at that moment,
 * the UTC time, its meaning, a comment and the hash of the content it signs.
 */
import type { Knex } from 'knex';
import type { SignatureDto } from '../../../shared/recipe-types';
import { AppError } from '../../app-error';
import { findUserRowById } from '../../data/users';
import type { SignatureRow } from '../../data/workflow';
import type { Actor } from '../actor';
import { checkPasswordWithLimit } from '../auth/password-check-limiter';
import { DEFAULT_MAIL_SETTINGS, type MailSettings } from '../mail/settings';

export const WRONG_SIGNATURE_PASSWORD = 'The password is not correct. Type your own password to sign.';
export const USERNAME_NEEDED = 'Your first signature in this session takes both parts: type your username as well as your password.';
export const WRONG_SIGNATURE_USERNAME = 'This is not the username you are signed in with. Only you can sign as yourself.';

/** What is being signed, for the trail of a wrong password. */
export interface Signing {
  versionId: number;
  meaning: 'approved' | 'withdrawn';
}

/**
 * Checks both signature components as the session needs them: the username when the actor
 * has not yet signed fully in this session (or whenever one is typed), then the password.
 * Every wrong part answers 400 on its field, all at once, and nothing changes but the count
 * of wrong passwords: it is not a sign-in, so it counts toward the person's wrong-password
 * limit (../auth/password-check-limiter.ts), which answers 429 once reached.
 */
export async function verifySigner(
  db: Knex,
  actor: Actor,
  userId: number,
  parts: { username?: string | undefined; password: string },
  signing: Signing,
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): Promise<{ displayName: string }> {
  const user = await findUserRowById(db, userId);
  if (!user || !user.active) throw AppError.forbidden('Only an active person can sign.');
  const errors: { path: string; message: string }[] = [];
  // An empty username counts as none. Usernames compare as sign-in finds them: without regard to case.
  if (!parts.username) {
    if (!actor.signedFullyInSession) errors.push({ path: 'username', message: USERNAME_NEEDED });
  } else if (parts.username.toLowerCase() !== user.username.toLowerCase()) {
    errors.push({ path: 'username', message: WRONG_SIGNATURE_USERNAME });
  }
  const check = {
    user: { id: user.id, username: user.username, displayName: user.display_name, passwordHash: user.password_hash },
    password: parts.password,
    purpose: 'signature' as const,
    signing,
  };
  if (!(await checkPasswordWithLimit(db, actor, check, mail))) errors.push({ path: 'password', message: WRONG_SIGNATURE_PASSWORD });
  if (errors.length > 0) throw AppError.validation(errors);
  return { displayName: user.display_name };
}

export function toSignatureDto(row: SignatureRow): SignatureDto {
  return {
    id: row.id,
    signerName: row.signer_name,
    signerId: row.signer_id,
    meaning: row.meaning,
    comment: row.comment,
    signedAt: new Date(row.signed_at).toISOString(),
    contentHash: row.content_hash,
  };
}
