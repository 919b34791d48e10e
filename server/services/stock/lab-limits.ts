/**
 * The lab settings the computations and checks need: plunge-feed ceilings per material
 * group × hardness band × machine class, the traverse removal ceilings per group and the
 * long-contact length; the worn wheel's default share and the kerf allowance; the cutting
 * energy per group and the motor power share that warns. Stored values are validated here: a row that does not pass its
 * schema, an unknown group or a number that is not positive and finite never reaches the
 * checks.
 */
import type { Knex } from 'knex';
import { feedCeiling, longContactLength, traverseRemovalCeiling } from '../../../shared/schemas/lab-settings';
import type { LabLimits } from '../../../shared/stock-types';
import { MATERIAL_GROUPS } from '../../../shared/vocabulary';
import { DEFAULT_POWER_WARNING_PCT } from '../../../shared/cutting-power';
import { KERFBOOK_KERF_ALLOWANCE_MM, KERFBOOK_WORN_DIAMETER_SHARE } from '../../../shared/worn-wheel';
import { feedLimitsOf, findLabSettings, specificEnergiesOf, type LabSettingsRow } from '../../data/lab-settings';

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
  return {
    feedCeilings,
    traverseRemovalCeilings,
    longContactMm: longContact.success ? longContact.data : null,
    ...wheelWearLimits(row),
    ...cuttingPowerLimits(row),
  };
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
