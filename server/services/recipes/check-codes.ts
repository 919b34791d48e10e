/**
 * Check codes (the "Check a sheet" page and the bench sheet): each approved version gets 8 random Crockford
 * base32 characters, printed on its bench sheet as XXXX-XXXX with a QR code of
 * `<origin>/check/<CODE>`. Whoever holds a printed sheet asks here whether that version may
 * still be used (ISO/IEC 17025 §8.3: obsolete documents unusable by mistake).
 */
import { randomInt } from 'node:crypto';
import type { Knex } from 'knex';
import type { CheckCodeResult } from '../../../shared/recipe-types';
import { AppError } from '../../app-error';
import { findVersionByCheckCode, setCheckCode } from '../../data/check-codes';
import { dayOf } from '../../../shared/calendar-dates';

/** Crockford base32: digits and letters without I, L, O and U (the alphabet of CHECK_CODE_PATTERN). */
export const CHECK_CODE_ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
export const CHECK_CODE_LENGTH = 8;

/** 8 characters from the operating system's random source (40 bits: guessing one is hopeless). */
export function newCheckCode(): string {
  let code = '';
  for (let i = 0; i < CHECK_CODE_LENGTH; i += 1) code += CHECK_CODE_ALPHABET[randomInt(CHECK_CODE_ALPHABET.length)];
  return code;
}

/** As printed and shown: "7KQ2M9XD" → "7KQ2-M9XD". */
export function formatCheckCode(code: string): string {
  return `${code.slice(0, 4)}-${code.slice(4)}`;
}

function isDuplicate(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as { code?: string }).code === 'ER_DUP_ENTRY';
}

/**
 * Gives a version its code, inside the approving transaction; a version that has one keeps
 * it. A clash with another version's code (unique index) is retried with a new code; in
 * MariaDB a duplicate-key error undoes only that statement, not the transaction.
 */
export async function assignCheckCode(trx: Knex, versionId: number, generate: () => string = newCheckCode): Promise<void> {
  for (let attempt = 0; attempt < 10; attempt += 1) {
    try {
      await setCheckCode(trx, versionId, generate());
      return;
    } catch (err) {
      if (!isDuplicate(err)) throw err;
    }
  }
  throw new Error('Could not find a free check code after 10 tries.');
}

function day(value: Date | string | null): string {
  return dayOf(value) ?? 'an unknown day';
}

/** What a printed sheet's code says now. `code` is already validated (checkCodeParam: uppercase, no dash). */
export async function checkCode(db: Knex, code: string): Promise<CheckCodeResult> {
  const row = await findVersionByCheckCode(db, code);
  if (!row)
    throw AppError.notFound(
      `No sheet has the check code ${formatCheckCode(code)}. Compare it with the sheet; if it matches, do not use the sheet and ask the recipe's author.`,
    );
  const other = row.current_version !== null && row.current_version !== row.version ? row.current_version : null;
  const base = {
    code: formatCheckCode(row.check_code),
    recipeId: row.recipe_id,
    number: row.number,
    title: row.title,
    version: row.version,
    currentVersion: other,
  };

  if (row.status === 'approved' && row.current_version === row.version) {
    return { ...base, state: 'current', message: `Version ${row.version} is current — this sheet may be used.` };
  }
  if (row.status === 'approved') {
    const now = other === null ? '' : ` Until then version ${other} is current.`;
    return {
      ...base,
      state: 'pending',
      message: `Version ${row.version} becomes current on ${day(row.effective_from)} — do not use this sheet before then.${now}`,
    };
  }
  if (row.status === 'withdrawn') {
    const instead = other === null ? 'do not use this recipe.' : `do not use this sheet; version ${other} is current — print that one.`;
    return { ...base, state: 'withdrawn', message: `Withdrawn on ${day(row.withdrawn_at)} — ${instead}` };
  }
  if (row.status === 'superseded') {
    const message =
      other === null
        ? `Superseded on ${day(row.superseded_at)} and no version of ${row.number} is current now — do not use this sheet.`
        : `Superseded by version ${other} — do not use this sheet; print the current one.`;
    return { ...base, state: 'superseded', message };
  }
  // Codes are given at approval, so no open version has one; answer as for an unknown code.
  throw AppError.notFound(`No sheet has the check code ${formatCheckCode(code)}.`);
}
