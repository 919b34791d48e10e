import type { UnitPreference } from '@shared/api-types';
import { CAPACITY_LIMIT_RULES } from '@shared/capacity';
import type { RecipeComputed } from '@shared/recipe-computations';
import { formatQuantity } from '@shared/units';
import { CAPACITY_LIMIT_LABELS } from '@shared/vocabulary';

/** The capacity in words, saying which geometric limit applies. */
export interface CapacityWords {
  /** E.g. "Sections this wide up to 69.6 mm high (a thin one: 80.0 mm)". */
  headline: string;
  /** The limit's name and its rule with the formula. */
  limit: string;
  rule: string;
  fits: boolean;
  /** E.g. "The scope fits, 29.6 mm to spare" or "The wall is 5.0 mm too thick". */
  state: string;
  /** The smallest wheel that still cuts the scope on this machine, or null. */
  smallestWheel: string | null;
}

/** Null until the capacity is known (wheel, machine, motion and the section's dimensions). */
export function capacityWords(c: RecipeComputed | null | undefined, units: UnitPreference): CapacityWords | null {
  if (!c || c.capacityLimit === null || c.cuttableSizeMm === null || c.cuttingDepthMm === null || c.capacityMarginMm === null) return null;
  const len = (v: number | null) => formatQuantity(v, 'length', units);
  const limit = c.capacityLimit;
  const headline = {
    radius: `Parts up to ${len(c.cuttableSizeMm)} (cutting depth ${len(c.cuttingDepthMm)})`,
    chord: `Sections this wide up to ${len(c.cuttableSizeMm)} high (a thin one: ${len(c.cuttingDepthMm)})`,
    'turned-to-centre': `Turned bars up to ${len(c.cuttableSizeMm)}: the wheel reaches the centre (cutting depth ${len(c.cuttingDepthMm)})`,
    'turned-through-wall': `Turned tubes with walls up to ${len(c.cuttableSizeMm)}, whatever the outside diameter`,
  }[limit];
  const wall = limit === 'turned-through-wall';
  const fits = c.capacityFits === true;
  const margin = len(Math.abs(c.capacityMarginMm));
  const state = fits
    ? `The ${wall ? 'wall' : 'scope'} fits, ${margin} to spare`
    : wall
      ? `The wall is ${margin} too thick`
      : `The scope is ${margin} too large`;
  const smallest = c.smallestWheelForScopeMm;
  return {
    headline,
    limit: CAPACITY_LIMIT_LABELS[limit],
    rule: CAPACITY_LIMIT_RULES[limit],
    fits,
    state,
    // Rounded up to whole mm: a wheel rounded down would be too small.
    smallestWheel: smallest !== null && Number.isFinite(smallest) ? `The smallest wheel that cuts the scope here: ${len(Math.ceil(smallest - 1e-9))}` : null,
  };
}
