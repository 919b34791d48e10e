/** Helpers for the notification mail tests: the outbox rows of a kind, links in them, machines and opt-outs. */
import { expect } from 'chai';
import type { Knex } from 'knex';
import type { MailRow } from '../../../server/data/mail-outbox';
import type { NotificationKind } from '../../../shared/notification-kinds';

/** Where links in mails point in these tests (APP_BASE_URL). */
export const BASE_URL = 'https://kerfbook.lab.example';

export async function mailsOf(db: Knex, kind: NotificationKind): Promise<MailRow[]> {
  return db<MailRow>('mail_outbox').where({ kind }).orderBy('to_address').orderBy('id');
}

export async function recipientsOf(db: Knex, kind: NotificationKind): Promise<string[]> {
  return (await mailsOf(db, kind)).map((m) => m.to_address);
}

export const addressOf = (username: string) => `${username}@lab.example`;

/** Every app path a text links to (absolute links against BASE_URL), in order. */
export function linkPaths(text: string): string[] {
  const escaped = BASE_URL.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  return [...text.matchAll(new RegExp(`${escaped}(/\\S*)`, 'g'))].map((m) => m[1]!);
}

/**
 * Checks what every notification mail carries: both parts, the action link first (absolute,
 * against the base URL) in the text and in the HTML, and — for the optional kinds — the
 * footer pointing to /account.
 */
export function expectMail(mail: MailRow, expected: { subject: RegExp | string; path: string; optional: boolean }): void {
  if (typeof expected.subject === 'string') expect(mail.subject).to.equal(expected.subject);
  else expect(mail.subject).to.match(expected.subject);
  const paths = linkPaths(mail.text_body);
  expect(paths[0], mail.text_body).to.equal(expected.path);
  expect(mail.html_body).to.contain(`href="${`${BASE_URL}${expected.path}`.replace(/&/g, '&amp;')}"`);
  if (expected.optional) {
    expect(paths).to.include('/account');
    expect(mail.text_body).to.match(/turn these mails off under My account/);
  } else {
    expect(paths).not.to.include('/account');
  }
}

export async function assignMachine(db: Knex, userId: number, machineId: number): Promise<void> {
  await db('user_machines').insert({ user_id: userId, machine_id: machineId, assigned_at: new Date() });
}

export async function optOut(db: Knex, userId: number, kind: NotificationKind): Promise<void> {
  await db('notification_opt_outs').insert({ user_id: userId, kind });
}

export async function clearEmail(db: Knex, userId: number): Promise<void> {
  await db('users').where({ id: userId }).update({ email: '' });
}

export async function deactivate(db: Knex, userId: number): Promise<void> {
  await db('users').where({ id: userId }).update({ active: false, deactivated_at: new Date() });
}
