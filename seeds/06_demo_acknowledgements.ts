import type { Knex } from 'knex';
import type { Actor } from '../server/services/actor';
import { acknowledgeVersion } from '../server/services/recipes/acknowledgements';
import { DEMO_ACCOUNTS } from './data/demo-accounts';

/**
 * The demo operator has read and understood the versions in use on his saws — all but the
 * newest one (the 42CrMo4 bar's version 2), which waits on his Today list. Through the same
 * service as the API, so the trail has each acknowledgement. Each is dated an hour after the
 * version's approval, before the demo cuts (07_demo_cuts.ts), which the server takes only on
 * acknowledged versions. Skipped when any exists.
 */
const HOUR_MS = 60 * 60 * 1000;
const LEFT_TO_ACKNOWLEDGE = '42CrMo4 quenched and tempered bar, large diameters';

export async function seed(knex: Knex): Promise<void> {
  if (await knex('acknowledgements').first('id')) return;
  const account = DEMO_ACCOUNTS.find((a) => a.roles.includes('operator') && (a.machines ?? []).length > 0);
  if (!account) return;
  const user = (await knex('users').where({ username: account.username }).first('id', 'display_name')) as { id: number; display_name: string } | undefined;
  if (!user) throw new Error(`The demo operator ${account.username} is missing: the people seed must run first.`);
  const actor: Actor = { userId: user.id, name: user.display_name, clientAddress: '' };
  const current = (await knex('recipes as r')
    .join('recipe_versions as v', 'v.id', 'r.current_version_id')
    .join('user_machines as um', 'um.machine_id', 'v.machine_id')
    .where('um.user_id', user.id)
    .whereNot('r.title', LEFT_TO_ACKNOWLEDGE)
    .orderBy('r.id')
    .select('r.id', 'v.version', 'v.id as versionId')) as { id: number; version: number; versionId: number }[];
  const now = Date.now();
  for (const v of current) {
    const approvedAt = (await knex('signatures').where({ version_id: v.versionId, meaning: 'approved' }).max({ at: 'signed_at' }).first()) as {
      at: Date | null;
    };
    const at = approvedAt.at ? Math.min(now, new Date(approvedAt.at).getTime() + HOUR_MS) : now;
    await acknowledgeVersion(knex, actor, { id: user.id, roles: account.roles }, 'released', v.id, v.version, new Date(at));
  }
}
