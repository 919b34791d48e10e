/** The demo author, who enters the invented lab's stock and recipes. */
import type { Knex } from 'knex';
import type { Actor } from '../../server/services/actor';
import { DEMO_ACCOUNTS } from './demo-accounts';

export async function demoAuthor(knex: Knex): Promise<Actor> {
  const account = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'));
  const row = account
    ? ((await knex('users').where({ username: account.username }).first('id', 'display_name')) as { id: number; display_name: string } | undefined)
    : undefined;
  if (!row) throw new Error('The demo author is missing: the people seed must run first.');
  return { userId: row.id, name: row.display_name, clientAddress: '' };
}
