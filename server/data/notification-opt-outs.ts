/** Queries on `notification_opt_outs`: mails a person turned off (absent row = wanted). */
import type { Knex } from 'knex';

export async function optedOutKinds(db: Knex, userId: number): Promise<string[]> {
  const rows = await db('notification_opt_outs').where({ user_id: userId }).select<{ kind: string }[]>('kind');
  return rows.map((r) => r.kind);
}

export async function addOptOut(db: Knex, userId: number, kind: string): Promise<void> {
  await db('notification_opt_outs').insert({ user_id: userId, kind }).onConflict(['user_id', 'kind']).ignore();
}

export async function removeOptOut(db: Knex, userId: number, kind: string): Promise<void> {
  await db('notification_opt_outs').where({ user_id: userId, kind }).del();
}
