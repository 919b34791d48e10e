/** Helpers for the account mail tests: the outbox as the dev screen shows it, and links in mails. */
import { expect } from 'chai';
import type { Knex } from 'knex';
import type { MailRow } from '../../../server/data/mail-outbox';

export const BASE_URL = 'https://kerfbook.lab.example';

export async function mailsTo(db: Knex, to: string): Promise<MailRow[]> {
  return db('mail_outbox').where({ to_address: to }).orderBy('id');
}

/** The token of the set-password link in a mail's text, checking that the link is absolute. */
export function tokenIn(text: string): string {
  const match = /(\S+)\/set-password\?token=([A-Za-z0-9_-]{43})(?=\s|$)/.exec(text);
  expect(match, text).to.not.equal(null);
  expect(match![1]).to.equal(BASE_URL);
  return match![2]!;
}

/** The same token with one character changed (still 43 valid characters). */
export function tampered(token: string): string {
  const i = 10;
  return token.slice(0, i) + (token[i] === 'A' ? 'B' : 'A') + token.slice(i + 1);
}
