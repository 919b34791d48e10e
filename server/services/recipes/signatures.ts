/**
 * Electronic signatures (21 CFR 11.50, 11.70, 11.200): the signer types their
 * password again for each signing; the signature keeps the printed name at that moment,
 * the UTC time, its meaning, a comment and the hash of the content it signs.
 */
import type { Knex } from 'knex';
import type { SignatureDto } from '../../../shared/recipe-types';
import { AppError } from '../../app-error';
import { findUserRowById } from '../../data/users';
import type { SignatureRow } from '../../data/workflow';
import { verifyPassword } from '../auth/passwords';

export const WRONG_SIGNATURE_PASSWORD = 'The password is not correct. Type your own password to sign.';

/**
 * Re-verifies the signer's password with the stored scrypt hash. A wrong password answers
 * 400 on `password` and changes nothing — it is not a sign-in, so it counts toward no
 * sign-in limit and ends no session.
 */
export async function verifySignerPassword(db: Knex, userId: number, password: string): Promise<{ displayName: string }> {
  const user = await findUserRowById(db, userId);
  if (!user || !user.active) throw AppError.forbidden('Only an active person can sign.');
  if (!(await verifyPassword(password, user.password_hash))) {
    throw AppError.validation([{ path: 'password', message: WRONG_SIGNATURE_PASSWORD }]);
  }
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
