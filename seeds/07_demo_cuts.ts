import type { Knex } from 'knex';
import type { CutRecordBody } from '../shared/schemas/operator';
import type { Actor } from '../server/services/actor';
import { recordCut } from '../server/services/operator/cuts';
import { DEMO_ACCOUNTS } from './data/demo-accounts';

const HOUR_MS = 60 * 60 * 1000;

/** Cuts by the demo operator on three recipes in force: mostly good, one burnt (a flag on the author's Today). */
const DEMO_CUTS: { title: string; hoursAgo: number; cut: CutRecordBody }[] = [
  { title: 'C45 bar, transverse section', hoursAgo: 50, cut: { specimenId: 'HF-24-0412', partRef: 'Heat 7731', quantity: 1, outcome: 'good', notes: '' } },
  {
    title: 'C45 bar, transverse section',
    hoursAgo: 49,
    cut: { specimenId: 'HF-24-0413', partRef: 'Heat 7731', quantity: 2, outcome: 'good', notes: 'Clean face, no burr.' },
  },
  { title: 'EN AW-6082 bar, transverse', hoursAgo: 30, cut: { specimenId: 'HF-24-0420', partRef: 'Lot A-118', quantity: 1, outcome: 'good', notes: '' } },
  {
    title: 'EN AW-6082 bar, transverse',
    hoursAgo: 28,
    cut: {
      specimenId: 'HF-24-0421',
      partRef: 'Lot A-118',
      quantity: 1,
      outcome: 'burnt',
      notes: 'Temper colours on the face near the centre; coolant flow looked low at the end of the cut.',
    },
  },
  { title: 'CW614N brass bar', hoursAgo: 5, cut: { specimenId: 'HF-24-0430', partRef: 'Lot B-52', quantity: 3, outcome: 'good', notes: '' } },
];

async function demoOperator(knex: Knex): Promise<Actor> {
  const account = DEMO_ACCOUNTS.find((a) => a.roles.includes('operator'));
  const row = account
    ? ((await knex('users').where({ username: account.username }).first('id', 'display_name')) as { id: number; display_name: string } | undefined)
    : undefined;
  if (!row) throw new Error('The demo operator is missing: the people seed must run first.');
  return { userId: row.id, name: row.display_name, clientAddress: '' };
}

/**
 * A few cut records through the same service as the API (current versions only, one trail
 * event each). Skipped when any cut is already recorded, so a second run changes nothing.
 */
export async function seed(knex: Knex): Promise<void> {
  if (await knex('cut_records').first('id')) return;
  const operator = await demoOperator(knex);
  const loadedAt = Date.now();
  for (const entry of DEMO_CUTS) {
    const recipe = (await knex('recipes as r')
      .join('recipe_versions as v', 'v.id', 'r.current_version_id')
      .where('r.title', entry.title)
      .first('r.id', 'v.version')) as { id: number; version: number } | undefined;
    if (!recipe) throw new Error(`The demo cuts name "${entry.title}", which has no version in force.`);
    await recordCut(knex, operator, 'released', recipe.id, recipe.version, entry.cut, new Date(loadedAt - entry.hoursAgo * HOUR_MS));
  }
}
