/** Stock records as the API returns them: the body that was saved plus id and archive state. */
import type { FeedCeiling } from './schemas/lab-settings';
import type { MachineBody, MaterialBody, SelectionRowBody, WheelBody } from './schemas/stock';
import type { MaterialGroup } from './vocabulary';
import { DEFAULT_POWER_WARNING_PCT } from './cutting-power';
import { KERFBOOK_KERF_ALLOWANCE_MM, KERFBOOK_WORN_DIAMETER_SHARE } from './worn-wheel';

interface Stored {
  id: number;
  /** Archived records stay readable (recipes reference them) but are not offered for new recipes. */
  archived: boolean;
  /** ISO 8601 UTC. */
  updatedAt: string;
}

export type MaterialRecord = MaterialBody & Stored;
/** A wheel as stored: both speed figures are known (one as marked, the other computed from the diameter). */
export type WheelRecord = Omit<WheelBody, 'maxSpeedMs' | 'maxSpeedRpm'> & {
  /** Maximum operating speed, m/s. */
  maxSpeedMs: number;
  /** Maximum operating speed at the new diameter, rpm. */
  maxSpeedRpm: number;
} & Stored;
export type MachineRecord = MachineBody & Stored;
export type SelectionRow = SelectionRowBody & { id: number };
/** A selection-table row with the kind and marking of its wheel (a wheel in use), as the recipe checks read the table. */
export type SelectionRowWheel = SelectionRow & { wheel: Pick<WheelRecord, 'kind' | 'specification'> };

/** Lab settings the computations and checks need. */
export interface LabLimits {
  /** Plunge-feed ceilings per material group × hardness band × machine class, mm/s: above the one that applies the feed check warns. */
  feedCeilings: FeedCeiling[];
  /** Traverse passes: the highest removal per mm of wheel width (Q'w), mm³/s per mm, per material group. */
  traverseRemovalCeilings: Partial<Record<MaterialGroup, number>>;
  /** Contact length above which a straight plunge gets the long-contact note, mm; null = no note. */
  longContactMm: number | null;
  /** Smallest usable diameter of a consumable wheel whose record gives none, as a share of its new diameter (0–1). */
  wornDiameterShare: number;
  /** Added to the wheel's thickness for the kerf loss, mm. */
  kerfAllowanceMm: number;
  /** Specific cutting energy per material group, J/mm³ (order of magnitude): cutting power = removal rate × this. */
  specificEnergyJMm3: Partial<Record<MaterialGroup, number>>;
  /** Share of the machine's motor power above which the peak cutting power gets a warning, %. */
  powerWarningPct: number;
}

/**
 * Where the lab's limits cannot be had: no feed or removal ceilings, no long-contact note, no
 * cutting energies (so no power figures); the worn wheel, the kerf and the power share on
 * Kerfbook's defaults.
 */
export const NO_LAB_LIMITS: LabLimits = {
  feedCeilings: [],
  traverseRemovalCeilings: {},
  longContactMm: null,
  wornDiameterShare: KERFBOOK_WORN_DIAMETER_SHARE,
  kerfAllowanceMm: KERFBOOK_KERF_ALLOWANCE_MM,
  specificEnergyJMm3: {},
  powerWarningPct: DEFAULT_POWER_WARNING_PCT,
};
