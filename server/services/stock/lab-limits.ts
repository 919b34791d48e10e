/**
 * The lab settings the computations and checks need: plunge-feed ceilings per material
 * group × hardness band × machine class, the traverse removal ceilings per group and the
 * long-contact length. Stored values are validated here: a row that does not pass its
 * schema, an unknown group or a number that is not positive and finite never reaches the
 * checks.
 */
import type { Knex } from 'knex';
import { feedCeiling, longContactLength, traverseRemovalCeiling } from '../../../shared/schemas/lab-settings';
import type { LabLimits } from '../../../shared/stock-types';
import { MATERIAL_GROUPS } from '../../../shared/vocabulary';
import { feedLimitsOf, findLabSettings } from '../../data/lab-settings';

export async function getLabLimits(db: Knex): Promise<LabLimits> {
  const row = await findLabSettings(db);
  const stored = feedLimitsOf(row);
  const { plunge, traverseRemoval } = (stored !== null && typeof stored === 'object' ? stored : {}) as { plunge?: unknown; traverseRemoval?: unknown };

  const feedCeilings: LabLimits['feedCeilings'] = [];
  for (const raw of Array.isArray(plunge) ? plunge : []) {
    const parsed = feedCeiling.safeParse(raw);
    if (parsed.success) feedCeilings.push(parsed.data);
  }

  const traverseRemovalCeilings: LabLimits['traverseRemovalCeilings'] = {};
  const removal = (traverseRemoval !== null && typeof traverseRemoval === 'object' ? traverseRemoval : {}) as Record<string, unknown>;
  for (const group of MATERIAL_GROUPS) {
    // Own keys only: an inherited name is not a setting.
    const parsed = Object.hasOwn(removal, group) ? traverseRemovalCeiling.safeParse(removal[group]) : null;
    if (parsed?.success) traverseRemovalCeilings[group] = parsed.data;
  }

  const longContact = longContactLength.safeParse(row?.long_contact_mm);
  return { feedCeilings, traverseRemovalCeilings, longContactMm: longContact.success ? longContact.data : null };
}
