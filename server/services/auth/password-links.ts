/**
 * What the public link routes do: "forgot password" mails a 1 h link to every
 * active account with the address, and a link (invitation or reset) lets its person set a
 * password once.
 */
import type { Knex } from 'knex';
import type { LinkInfoDto, MessageDto } from '../../../shared/api-types';
import { findLabSettings } from '../../data/lab-settings';
import { countRecentTokens } from '../../data/user-tokens';
import { findActiveUsersByEmail, findUserRowById } from '../../data/users';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { enqueueMail } from '../mail/outbox';
import { passwordResetMail } from '../mail/account-mails';
import type { MailSettings } from '../mail/settings';
import { replacePassword } from './password-replacement';
import { hashPassword } from './passwords';
import { checkToken, issueToken, redeemToken } from './user-tokens';

/** The one answer to "forgot password", whatever happened. */
export const FORGOT_MESSAGE = 'If an account uses that address, a link to set a new password is on its way. It works for one hour.';

/** "Forgot password" never answers sooner than this, so the time taken does not tell whether the address is known. */
export const FORGOT_FLOOR_MS = 400;

/** At most this many reset mails per account in an hour; more requests are answered alike and send nothing. */
export const RESETS_PER_HOUR = 3;

const HOUR_MS = 60 * 60 * 1000;

/**
 * Issues a 1 h reset link and enqueues its mail for every active account with this address
 * (case-insensitive), in one transaction. Says nothing about what it found.
 */
export async function requestPasswordReset(db: Knex, actor: Actor, mail: MailSettings, email: string, now: Date = new Date()): Promise<MessageDto> {
  const candidates = await findActiveUsersByEmail(db, email);
  if (candidates.length > 0) {
    await db.transaction(async (trx) => {
      const labName = (await findLabSettings(trx))?.lab_name || 'Kerfbook';
      for (const candidate of candidates) {
        // Locked: two requests at once count each other's links (the hourly limit holds).
        const user = await findUserRowById(trx, candidate.id, true);
        if (!user || !user.active || !user.email) continue;
        const recent = await countRecentTokens(trx, [user.id], 'password-reset', new Date(now.getTime() - HOUR_MS));
        if (recent >= RESETS_PER_HOUR) continue;
        const link = await issueToken(trx, user.id, 'password-reset', null, now);
        await enqueueMail(
          trx,
          passwordResetMail(mail, { to: user.email, displayName: user.display_name, username: user.username, labName, token: link.token }),
          now,
        );
        await appendTrailEvent(
          trx,
          actor,
          { type: TRAIL_EVENTS.passwordResetRequested, entityType: 'user', entityId: user.id, actorName: user.email, after: { email: user.email } },
          now,
        );
      }
    });
  }
  return { message: FORGOT_MESSAGE };
}

/** What a link is for, before the person types a password; refusals as in checkToken. */
export async function inspectLink(db: Knex, token: string, now: Date = new Date()): Promise<LinkInfoDto> {
  const { token: row, user } = await checkToken(db, token, now);
  return { purpose: row.purpose, username: user.username, displayName: user.display_name, expiresAt: new Date(row.expires_at).toISOString() };
}

/**
 * Sets the password with a link: the link is used, every other open link of the person is
 * void, the must-change flag is cleared and every session of the person ends. Audited.
 */
export async function setPasswordWithLink(db: Knex, actor: Actor, token: string, newPassword: string, now: Date = new Date()): Promise<MessageDto> {
  // Refuse a bad link before the slow hash; the transaction checks it again under lock.
  await checkToken(db, token, now);
  const passwordHash = await hashPassword(newPassword);
  return db.transaction(async (trx) => {
    const { user } = await redeemToken(trx, token, now);
    await replacePassword(
      trx,
      { ...actor, userId: user.id, name: user.display_name },
      {
        userId: user.id,
        passwordHash,
        mustChange: false,
        mustChangeBefore: Boolean(user.must_change_password),
        byLink: true,
      },
    );
    return { message: `Your password is set. Sign in as ${user.username} with your new password.` };
  });
}
