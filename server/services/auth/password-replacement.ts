/**
 * The one way a stored password is replaced, whoever does it: new hash, the
 * must-change flag, every other session of the person ended (epoch bump), every open link
 * (invitation, reset) void, and one trail event that says it happened — never the password
 * or its hash. Voiding the links is also what ends "invitation pending" (user-tokens.ts).
 */
import type { Knex } from 'knex';
import { voidOpenTokens } from '../../data/user-tokens';
import { bumpSessionEpoch, updateUserRow } from '../../data/users';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';

export interface PasswordReplacement {
  userId: number;
  passwordHash: string;
  /** True when an admin set it and the person must choose their own at next sign-in. */
  mustChange: boolean;
  /** The flag before the change, for the trail's before/after. */
  mustChangeBefore: boolean;
  /** True when the person used an invitation or reset link (a trail event of its own). */
  byLink?: boolean;
}

export async function replacePassword(trx: Knex, actor: Actor, change: PasswordReplacement): Promise<void> {
  const now = new Date();
  await updateUserRow(trx, change.userId, { password_hash: change.passwordHash, must_change_password: change.mustChange, updated_at: now });
  await bumpSessionEpoch(trx, change.userId);
  await voidOpenTokens(trx, change.userId, now);
  await appendTrailEvent(
    trx,
    actor,
    {
      type: change.byLink ? TRAIL_EVENTS.passwordSetByLink : change.mustChange ? TRAIL_EVENTS.userTemporaryPasswordSet : TRAIL_EVENTS.ownPasswordChanged,
      entityType: 'user',
      entityId: change.userId,
      before: { mustChangePassword: change.mustChangeBefore },
      after: { mustChangePassword: change.mustChange },
    },
    now,
  );
}
