/** The lab settings the computations and checks need: feed ceilings per material group, the worn wheel's default and the kerf allowance, cutting energy and the power share. */
import type { Knex } from 'knex';
import { DEFAULT_POWER_WARNING_PCT } from '../../../shared/cutting-power';
import type { LabLimits } from '../../../shared/stock-types';
import { MATERIAL_GROUPS, type MaterialGroup } from '../../../shared/vocabulary';
import { KERFBOOK_KERF_ALLOWANCE_MM, KERFBOOK_WORN_DIAMETER_SHARE } from '../../../shared/worn-wheel';
import { feedCeilingsOf, findLabSettings, specificEnergiesOf, type LabSettingsRow } from '../../data/lab-settings';

export async function getLabLimits(db: Knex): Promise<LabLimits> {
  const row = await findLabSettings(db);
  const stored = feedCeilingsOf(row);
  const feedCeilingsMmS: LabLimits['feedCeilingsMmS'] = {};
  // Only known groups with a usable number reach the checks.
  for (const group of MATERIAL_GROUPS) {
    const value = stored[group];
    if (typeof value === 'number' && Number.isFinite(value) && value > 0) feedCeilingsMmS[group as MaterialGroup] = value;
  }
  return { feedCeilingsMmS, ...wheelWearLimits(row), ...cuttingPowerLimits(row) };
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

/** Specific cutting energy per known group (usable numbers only) and the power warning share. */
function cuttingPowerLimits(row: LabSettingsRow | undefined): Pick<LabLimits, 'specificEnergyJMm3' | 'powerWarningPct'> {
  const stored = specificEnergiesOf(row);
  const specificEnergyJMm3: LabLimits['specificEnergyJMm3'] = {};
  for (const group of MATERIAL_GROUPS) {
    const value = stored[group];
    if (typeof value === 'number' && Number.isFinite(value) && value > 0) specificEnergyJMm3[group] = value;
  }
  const share = row?.power_warning_pct;
  // A row the data migration has not filled yet still gets the usual share.
  const powerWarningPct = typeof share === 'number' && Number.isFinite(share) && share > 0 ? share : DEFAULT_POWER_WARNING_PCT;
  return { specificEnergyJMm3, powerWarningPct };
}
