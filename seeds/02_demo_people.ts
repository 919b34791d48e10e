import type { Knex } from 'knex';
import { hashPassword } from '../server/services/auth/passwords';
import { insertUser } from '../server/data/users';
import { DEMO_ACCOUNTS } from './data/demo-accounts';

/** One demo person per role. Skips anyone already there, so a second run changes nothing. */
export async function seed(knex: Knex): Promise<void> {
  const now = new Date();
  for (const account of DEMO_ACCOUNTS) {
    if (await knex('users').where({ username: account.username }).first()) continue;
    await insertUser(
      knex,
      {
        username: account.username,
        display_name: account.displayName,
        email: account.email,
        password_hash: await hashPassword(account.password),
        // Demo people sign in straight away with the printed passwords.
        must_change_password: false,
      },
      account.roles,
      now,
    );
  }
}
