/**
 * Hardness against a lab's hardness bands (the selection table's, the feed ceilings'): a
 * band is a window on one scale; a recipe's hardness is a window too (a single value is a
 * window of one point). Both are compared on the band's scale, or else in HV through the
 * steel conversion tables (ASTM E140, for the groups they apply to). Where neither works
 * the answer is "cannot tell" (null), and each caller decides what that means for it.
 */
import { convertHardness } from './hardness';
import type { HardnessValue, HardnessWindow } from './schemas/stock';
import { HARDNESS_SCALES, type HardnessScale, type MaterialGroup } from './vocabulary';

/** A single reading as a window of one point. */
export const pointWindow = (h: HardnessValue): HardnessWindow => ({ min: h.value, max: h.value, scale: h.scale });

/** `value` on `scale`, or null where the group's tables give no value. */
function onScale(value: number, from: HardnessScale, to: HardnessScale, group: MaterialGroup): number | null {
  if (from === to) return value;
  const c = convertHardness(value, from, to, group);
  return c.ok ? c.value : null;
}

/** Both ends of a window on `scale`, or null. */
function windowOn(w: HardnessWindow, scale: HardnessScale, group: MaterialGroup): { min: number; max: number } | null {
  const min = onScale(w.min, w.scale, scale, group);
  const max = onScale(w.max, w.scale, scale, group);
  return min === null || max === null ? null : { min, max };
}

/** A usable window: finite positive numbers, lowest not above highest, a known scale (half-typed input is not). */
export function usableWindow(w: HardnessWindow | null | undefined): w is HardnessWindow {
  return (
    !!w &&
    typeof w === 'object' &&
    typeof w.min === 'number' &&
    typeof w.max === 'number' &&
    Number.isFinite(w.min) &&
    Number.isFinite(w.max) &&
    w.min > 0 &&
    w.min <= w.max &&
    HARDNESS_SCALES.includes(w.scale)
  );
}

/**
 * Whether `hardness` and `band` share any value (ends included): on the band's scale, else
 * both in HV; null when they cannot be compared (another scale with no table for the group).
 */
export function overlapsBand(hardness: HardnessWindow, band: HardnessWindow, group: MaterialGroup): boolean | null {
  if (!usableWindow(hardness) || !usableWindow(band)) return null;
  const onBand = windowOn(hardness, band.scale, group);
  if (onBand) return onBand.min <= band.max && onBand.max >= band.min;
  const h = windowOn(hardness, 'HV', group);
  const b = windowOn(band, 'HV', group);
  if (h && b) return h.min <= b.max && h.max >= b.min;
  return null;
}

/** Whether `a` lies wholly above `b` (its lowest above b's highest), compared as overlapsBand does; null when they cannot be compared. */
export function isAbove(a: HardnessWindow, b: HardnessWindow, group: MaterialGroup): boolean | null {
  if (!usableWindow(a) || !usableWindow(b)) return null;
  const onB = windowOn(a, b.scale, group);
  if (onB) return onB.min > b.max;
  const x = windowOn(a, 'HV', group);
  const y = windowOn(b, 'HV', group);
  return x && y ? x.min > y.max : null;
}

/** Text of a window, e.g. "25–35 HRC" or "30 HRC". */
export const describeWindow = (w: HardnessWindow): string => (w.min === w.max ? `${w.min} ${w.scale}` : `${w.min}–${w.max} ${w.scale}`);

/** Whether band `a` reaches higher than band `b` (a's highest above b's highest), compared as overlapsBand does; null when they cannot be compared. */
function topAbove(a: HardnessWindow, b: HardnessWindow, group: MaterialGroup): boolean | null {
  const top = (w: HardnessWindow): HardnessWindow => ({ min: w.max, max: w.max, scale: w.scale });
  return isAbove(top(a), top(b), group);
}

/**
 * For a hardness above every band of the group: the rows of the hardest band (no other band
 * reaches higher), the closest a table comes; otherwise none. Used for a hard coating.
 */
export function hardestBandRows<T extends { group: MaterialGroup; hardness: HardnessWindow | null }>(
  rows: readonly T[],
  group: MaterialGroup,
  hardness: HardnessWindow,
): T[] {
  const banded = rows.filter((r) => r.group === group && r.hardness !== null);
  if (banded.length === 0 || !banded.every((r) => isAbove(hardness, r.hardness!, group) === true)) return [];
  return banded.filter((r) => banded.every((o) => o === r || topAbove(o.hardness!, r.hardness!, group) !== true));
}
