/** Stock records as the API returns them: the body that was saved plus id and archive state. */
import type { MachineBody, MaterialBody, SelectionRowBody, WheelBody } from './schemas/stock';
import type { MaterialGroup } from './vocabulary';

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

/** Lab settings the computations and checks need. */
export interface LabLimits {
  /** Feed ceilings per material group, mm/s: above it the feed check warns. */
  feedCeilingsMmS: Partial<Record<MaterialGroup, number>>;
  /** Smallest usable diameter of a consumable wheel whose record gives none, as a share of its new diameter (0–1). */
  wornDiameterShare: number;
  /** Added to the wheel's thickness for the kerf loss, mm. */
  kerfAllowanceMm: number;
  /** Specific cutting energy per material group, J/mm³ (order of magnitude): cutting power = removal rate × this. */
  specificEnergyJMm3: Partial<Record<MaterialGroup, number>>;
  /** Share of the machine's motor power above which the peak cutting power gets a warning, %. */
  powerWarningPct: number;
}
