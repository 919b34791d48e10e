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
export type WheelRecord = WheelBody & Stored;
export type MachineRecord = MachineBody & Stored;
export type SelectionRow = SelectionRowBody & { id: number };

/** Lab settings the computations and checks need. */
export interface LabLimits {
  /** Feed ceilings per material group, mm/s: above it the feed check warns. */
  feedCeilingsMmS: Partial<Record<MaterialGroup, number>>;
}
