/**
 * The lab's plunge-feed ceiling that applies to a recipe: its material group, the machine's
 * class and the hardness of the scope (or of the material). Precision saws feed far slower
 * than abrasive saws, and harder material needs a lower feed (common practice), so the lab
 * keeps one ceiling per group × hardness band × machine class.
 */
import { describeWindow, overlapsBand } from './hardness-bands';
import type { FeedCeiling } from './schemas/lab-settings';
import type { HardnessWindow } from './schemas/stock';
import type { MachineClass, MaterialGroup } from './vocabulary';

export interface AppliedFeedCeiling {
  /** The lowest ceiling among the rows that apply, mm/s. */
  maxFeedMmS: number;
  /** The row that gave it. */
  row: FeedCeiling;
  /**
   * Why these rows: the hardness lies in their band (or the row covers any hardness);
   * the hardness is not given, or is in none of the bands, so the lowest ceiling of the
   * group on this machine class applies (the cautious reading).
   */
  basis: 'band' | 'no-hardness' | 'outside-bands';
}

/**
 * Rows of the group and machine class whose band overlaps the hardness (a row without a
 * band always does); the lowest of their ceilings applies, counting also the bands that
 * cannot be compared with the hardness (another scale, no table for the group), to stay on
 * the cautious side. Where no row is known to apply, the lowest of them all. Null when the
 * lab has no row for the group and class.
 */
export function plungeFeedCeiling(
  ceilings: readonly FeedCeiling[],
  group: MaterialGroup,
  machineClass: MachineClass,
  hardness: HardnessWindow | null,
): AppliedFeedCeiling | null {
  const rows = ceilings.filter((c) => c.group === group && c.machineClass === machineClass && Number.isFinite(c.maxFeedMmS) && c.maxFeedMmS > 0);
  if (rows.length === 0) return null;
  const lowest = (list: readonly FeedCeiling[]) => list.reduce((a, b) => (b.maxFeedMmS < a.maxFeedMmS ? b : a));
  if (!hardness) return { maxFeedMmS: lowest(rows).maxFeedMmS, row: lowest(rows), basis: 'no-hardness' };
  const overlap = rows.map((c) => (c.hardness === null ? true : overlapsBand(hardness, c.hardness, group)));
  if (!overlap.includes(true)) return { maxFeedMmS: lowest(rows).maxFeedMmS, row: lowest(rows), basis: 'outside-bands' };
  const applying = rows.filter((_, i) => overlap[i] !== false);
  const row = lowest(applying);
  return { maxFeedMmS: row.maxFeedMmS, row, basis: 'band' };
}

/** The ceiling's row in words, e.g. "35–50 HRC" or "any hardness". */
export const describeCeilingBand = (row: FeedCeiling): string => (row.hardness ? describeWindow(row.hardness) : 'any hardness');
