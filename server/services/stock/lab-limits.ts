/** The lab settings the computations and checks need (feed ceilings per material group, the worn wheel's default and the kerf allowance). */
import type { Knex } from 'knex';
import type { LabLimits } from '../../../shared/stock-types';
import { MATERIAL_GROUPS, type MaterialGroup } from '../../../shared/vocabulary';
import { KERFBOOK_KERF_ALLOWANCE_MM, KERFBOOK_WORN_DIAMETER_SHARE } from '../../../shared/worn-wheel';
import { feedCeilingsOf, findLabSettings, type LabSettingsRow } from '../../data/lab-settings';

export async function getLabLimits(db: Knex): Promise<LabLimits> {
  const row = await findLabSettings(db);
  const stored = feedCeilingsOf(row);
  const feedCeilingsMmS: LabLimits['feedCeilingsMmS'] = {};
  // Only known groups with a usable number reach the checks.
  for (const group of MATERIAL_GROUPS) {
    const value = stored[group];
    if (typeof value === 'number' && Number.isFinite(value) && value > 0) feedCeilingsMmS[group as MaterialGroup] = value;
  }
  return { feedCeilingsMmS, ...wheelWearLimits(row) };
}

/** The worn wheel's default share (0–1, exclusive) and the kerf allowance (mm, ≥ 0); Kerfbook's defaults where a value is missing or unusable. */
function wheelWearLimits(row: LabSettingsRow | undefined): Pick<LabLimits, 'wornDiameterShare' | 'kerfAllowanceMm'> {
  const share = row?.worn_diameter_share;
  const allowance = row?.kerf_allowance_mm;
  return {
    wornDiameterShare: typeof share === 'number' && share > 0 && share < 1 ? share : KERFBOOK_WORN_DIAMETER_SHARE,
    kerfAllowanceMm: typeof allowance === 'number' && Number.isFinite(allowance) && allowance >= 0 ? allowance : KERFBOOK_KERF_ALLOWANCE_MM,
  };
}
