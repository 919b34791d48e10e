/**
 * Mails to a lab's admins about attempts at using someone's password (21 CFR 11.300(d):
 * such attempts are detected and reported at once). Never optional.
 */
import type { PasswordCheckPurpose } from '../../data/password-check-failures';
import { findRecipientRows } from '../../data/recipients';
import { composeMail } from './layout';
import type { OutgoingMail } from './outbox';
import type { Recipient } from './recipients';
import type { MailSettings } from './settings';

export const WRONG_PASSWORD_LIMIT_MAIL_KIND = 'wrong-password-limit';

/** Every active admin with an address. */
export async function adminsToAlert(db: Parameters<typeof findRecipientRows>[0]): Promise<Recipient[]> {
  const rows = await findRecipientRows(db, { role: 'admin' });
  return rows.map((r) => ({ id: r.id, name: r.display_name, email: r.email.trim() }));
}

export interface WrongPasswordLimit {
  userId: number;
  displayName: string;
  username: string;
  purpose: PasswordCheckPurpose;
  failures: number;
  windowMinutes: number;
  clientAddress: string;
  at: Date;
  blockedUntil: Date;
}

const hhmm = (d: Date) => d.toISOString().slice(11, 16);

export function wrongPasswordLimitMail(settings: MailSettings, to: Recipient, limit: WrongPasswordLimit): OutgoingMail {
  const who = `${limit.displayName} (${limit.username})`;
  const where = limit.purpose === 'signature' ? 'while signing' : 'while changing their password';
  return composeMail(settings.baseUrl, {
    to: to.email,
    subject: `Wrong passwords: ${who} is blocked from signing`,
    greeting: to.name,
    paragraphs: [
      `In a session signed in as ${who}, ${limit.failures} wrong passwords in ${limit.windowMinutes} minutes were typed ${where}; the last at ${hhmm(limit.at)} UTC from the address ${limit.clientAddress || 'unknown'}.`,
      `The account has been signed out everywhere. Signing and changing its password stay blocked until ${hhmm(limit.blockedUntil)} UTC; other work goes on after signing in again.`,
      `Ask ${limit.displayName} whether it was them. If not — a session left open at a shared workstation, say — set a temporary password for the account under People.`,
    ],
    action: { label: 'See their events in the trail', path: `/trail?user=${limit.userId}` },
    footer: ['You get this mail because you are an admin of this lab. It cannot be turned off.'],
    kind: WRONG_PASSWORD_LIMIT_MAIL_KIND,
  });
}
