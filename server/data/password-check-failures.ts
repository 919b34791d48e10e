/** Queries on `password_check_failures`, the per-person counter behind the wrong-password limit. */
import type { Knex } from 'knex';
import type { FailureWindow } from './sign-in-failures';

export type PasswordCheckPurpose = 'signature' | 'password-change';

/** The person's rows of the window; with `upToId`, only that row and the ones written before it. */
export async function personFailuresSince(db: Knex, userId: number, since: Date, upToId?: number): Promise<FailureWindow> {
  const query = db('password_check_failures').where({ user_id: userId }).andWhere('failed_at', '>', since);
  if (upToId !== undefined) query.andWhere('id', '<=', upToId);
  const row = (await query.first(db.raw('count(*) as count'), db.raw('min(failed_at) as oldest'))) as { count: number; oldest: Date | null };
  return { count: Number(row.count), oldest: row.oldest ? new Date(row.oldest) : null };
}

/** Returns the new row's id. */
export async function insertPasswordCheckFailure(db: Knex, userId: number, purpose: PasswordCheckPurpose, at: Date): Promise<number> {
  const [id] = await db('password_check_failures').insert({ user_id: userId, purpose, failed_at: at });
  return Number(id);
}

export async function deletePasswordCheckFailure(db: Knex, id: number): Promise<void> {
  await db('password_check_failures').where({ id }).del();
}

export async function clearPasswordCheckFailures(db: Knex, userId: number): Promise<void> {
  await db('password_check_failures').where({ user_id: userId }).del();
}

/** Rows far outside any window are useless; dropped now and then so the table stays small. */
export async function deletePasswordCheckFailuresBefore(db: Knex, before: Date): Promise<void> {
  await db('password_check_failures').where('failed_at', '<', before).del();
}
