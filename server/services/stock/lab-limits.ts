/** The lab settings the computations and checks need (feed ceilings per material group). */
import type { Knex } from 'knex';
import type { LabLimits } from '../../../shared/stock-types';
import { MATERIAL_GROUPS, type MaterialGroup } from '../../../shared/vocabulary';
import { feedCeilingsOf, findLabSettings } from '../../data/lab-settings';

export async function getLabLimits(db: Knex): Promise<LabLimits> {
  const stored = feedCeilingsOf(await findLabSettings(db));
  const feedCeilingsMmS: LabLimits['feedCeilingsMmS'] = {};
  // Only known groups with a usable number reach the checks.
  for (const group of MATERIAL_GROUPS) {
    const value = stored[group];
    if (typeof value === 'number' && Number.isFinite(value) && value > 0) feedCeilingsMmS[group as MaterialGroup] = value;
  }
  return { feedCeilingsMmS };
}
