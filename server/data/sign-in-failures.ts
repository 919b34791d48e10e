/** Queries on `sign_in_failures`, the shared counter behind the sign-in limit. */
import type { Knex } from 'knex';

export interface FailureWindow {
  count: number;
  /** The oldest failure still inside the window; the limit lifts when it leaves it. */
  oldest: Date | null;
}

/**
 * Rows of the window from one address: for one username, or with `username` null whatever
 * name they tried (password spraying). With `upToId`, only that row and the ones written before it.
 */
export async function failuresSince(db: Knex, username: string | null, clientAddress: string, since: Date, upToId?: number): Promise<FailureWindow> {
  const query = db('sign_in_failures').where({ client_address: clientAddress }).andWhere('failed_at', '>', since);
  if (username !== null) query.andWhere({ username });
  if (upToId !== undefined) query.andWhere('id', '<=', upToId);
  const row = (await query.first(db.raw('count(*) as count'), db.raw('min(failed_at) as oldest'))) as { count: number; oldest: Date | null };
  return { count: Number(row.count), oldest: row.oldest ? new Date(row.oldest) : null };
}

/** Returns the new row's id. */
export async function insertFailure(db: Knex, username: string, clientAddress: string, at: Date): Promise<number> {
  const [id] = await db('sign_in_failures').insert({ username, client_address: clientAddress, failed_at: at });
  return Number(id);
}

export async function deleteFailure(db: Knex, id: number): Promise<void> {
  await db('sign_in_failures').where({ id }).del();
}

export async function clearFailures(db: Knex, username: string, clientAddress: string): Promise<void> {
  await db('sign_in_failures').where({ username, client_address: clientAddress }).del();
}

/** Rows far outside any window are useless; dropped now and then so the table stays small. */
export async function deleteFailuresBefore(db: Knex, before: Date): Promise<void> {
  await db('sign_in_failures').where('failed_at', '<', before).del();
}
