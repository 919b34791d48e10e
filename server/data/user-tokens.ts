/** Queries on `user_tokens`: single-use links (invitation, password reset). Only SHA-256 hashes are stored. */
import type { Knex } from 'knex';

export type TokenPurpose = 'invitation' | 'password-reset';

export interface UserTokenRow {
  id: number;
  user_id: number;
  purpose: TokenPurpose;
  token_sha256: string;
  created_at: Date;
  expires_at: Date;
  used_at: Date | null;
  created_by: number | null;
}

export type NewUserTokenRow = Omit<UserTokenRow, 'id' | 'used_at'>;

export async function insertUserToken(db: Knex, row: NewUserTokenRow): Promise<number> {
  const [id] = await db('user_tokens').insert({ ...row, used_at: null });
  return id!;
}

/** The row for a hash, locked when `forUpdate` (redeeming: a second request waits, then sees it used). */
export async function findTokenByHash(db: Knex, sha256: string, forUpdate = false): Promise<UserTokenRow | undefined> {
  const q = db<UserTokenRow>('user_tokens').where({ token_sha256: sha256 }).first();
  return forUpdate ? q.forUpdate() : q;
}

/** Voids the person's open links, of one purpose or (no purpose) all of them. */
export async function voidOpenTokens(db: Knex, userId: number, now: Date, purpose?: TokenPurpose): Promise<void> {
  const q = db('user_tokens').where({ user_id: userId }).whereNull('used_at');
  if (purpose) q.andWhere({ purpose });
  await q.update({ used_at: now });
}

export async function markTokenUsed(db: Knex, id: number, now: Date): Promise<void> {
  await db('user_tokens').where({ id }).update({ used_at: now });
}

/**
 * Links of these people created since `since`, used or not: the forgot-password rate limit
 * (a newer link voids the older ones, so counting only open links would never pass one).
 */
export async function countRecentTokens(db: Knex, userIds: readonly number[], purpose: TokenPurpose, since: Date): Promise<number> {
  if (userIds.length === 0) return 0;
  const [row] = (await db('user_tokens')
    .whereIn('user_id', userIds)
    .andWhere({ purpose })
    .andWhere('created_at', '>=', since)
    .count<{ n: number }[]>({ n: '*' })) as [{ n: number }];
  return Number(row.n);
}

/**
 * Of these people, those with an open invitation link (expired or not). Every password
 * set voids all open links, so an open invitation means "invited, no password yet".
 */
export async function usersWithOpenInvitation(db: Knex, userIds: readonly number[]): Promise<Set<number>> {
  if (userIds.length === 0) return new Set();
  const rows = await db('user_tokens')
    .whereIn('user_id', userIds)
    .andWhere({ purpose: 'invitation' })
    .whereNull('used_at')
    .distinct<{ user_id: number }[]>('user_id');
  return new Set(rows.map((r) => r.user_id));
}
