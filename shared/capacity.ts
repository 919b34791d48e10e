/**
 * Cutting capacity of a wheel on a machine. The flanges that clamp the wheel cannot enter
 * the cut, so the usable depth is the wheel's radius beyond the flange, less a clearance so
 * the flange never rubs the part or the vise.
 */
import type { CutMotion, Shape } from './vocabulary';

/**
 * Clearance kept between the flange and the part, mm. Kerfbook's choice (common practice):
 * room for clamp jaws, burrs and the wheel wearing down during the cut.
 */
export const CUT_CLEARANCE_MM = 5;

/**
 * Largest depth (mm) a wheel of `wheelDiameterMm` clamped between flanges of
 * `flangeDiameterMm` can cut: (D − flange)/2 − clearance, never below zero.
 */
export function cuttingDepthMm(wheelDiameterMm: number, flangeDiameterMm: number, clearanceMm: number = CUT_CLEARANCE_MM): number {
  return Math.max(0, (wheelDiameterMm - flangeDiameterMm) / 2 - clearanceMm);
}

/**
 * Largest part size (mm, the scope's size: a diameter or a section height) that a cutting
 * depth allows with a cut motion. With a turning specimen the part rotates, so the wheel
 * only has to reach the centre of a round part: the cuttable diameter is about twice the
 * depth (Kerfbook's model). A rectangular section does not gain that way, so it keeps the
 * depth.
 */
export function cuttableSizeMm(depthMm: number, motion: CutMotion, shape: Shape): number {
  return motion === 'turning-specimen' && shape !== 'rectangular' ? 2 * depthMm : depthMm;
}

export interface CapacityFit {
  /** Largest depth the wheel can cut on this machine, mm. */
  depthMm: number;
  /** Largest part size that depth allows with this motion and shape, mm. */
  cuttableSizeMm: number;
  /** Whether the scope's largest size fits. */
  fits: boolean;
  /** Cuttable size minus the scope's largest size, mm (negative when it does not fit). */
  marginMm: number;
}

/** Whether a scope whose largest size is `sizeMaxMm` (mm) can be cut through. */
export function capacityFit(
  sizeMaxMm: number,
  wheelDiameterMm: number,
  flangeDiameterMm: number,
  motion: CutMotion,
  shape: Shape,
  clearanceMm: number = CUT_CLEARANCE_MM,
): CapacityFit {
  const depthMm = cuttingDepthMm(wheelDiameterMm, flangeDiameterMm, clearanceMm);
  const size = cuttableSizeMm(depthMm, motion, shape);
  return { depthMm, cuttableSizeMm: size, fits: sizeMaxMm <= size, marginMm: size - sizeMaxMm };
}
