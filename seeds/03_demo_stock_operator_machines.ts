import type { Knex } from 'knex';
import { DEMO_ACCOUNTS } from './data/demo-accounts';

/**
 * The demo operator runs the two bay saws (runs after the stock seed, before the recipes):
 * every version that becomes current on them in the demo history asks him to acknowledge it.
 * Skips assignments already there.
 */
export async function seed(knex: Knex): Promise<void> {
  for (const account of DEMO_ACCOUNTS) {
    const user = (await knex('users').where({ username: account.username }).first('id')) as { id: number } | undefined;
    if (!user) throw new Error(`The demo person ${account.username} is missing: the people seed must run first.`);
    for (const name of account.machines ?? []) {
      const machine = (await knex('machines').where({ name }).first('id')) as { id: number } | undefined;
      if (!machine) throw new Error(`The demo machine "${name}" is missing: the stock seed must run first.`);
      await knex('user_machines').insert({ user_id: user.id, machine_id: machine.id, assigned_at: new Date() }).onConflict(['user_id', 'machine_id']).ignore();
    }
  }
}
