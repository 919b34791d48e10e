/**
 * Cutting capacity of a wheel on a machine: the largest part it cuts through. The flanges
 * that clamp the wheel cannot enter the cut, so the part must stay a clearance below the
 * flange's edge while the wheel's rim reaches through it. Geometry (Pythagoras and circle
 * chords; worked examples computed by hand in the tests); the clearance is common practice.
 *
 * R = wheel radius, r_f = flange radius, c = clearance. Which limit applies depends on how
 * the wheel meets the part (the machine's feed direction), the cut motion and the section:
 *
 * - radius: H ≤ R − r_f − c = (D − flange)/2 − c.
 *   Round bar or tube, wheel coming down into it (distance of centres): with the bar's
 *   centre s below the wheel's, the rim reaches its lowest point when s + ρ ≤ R and the
 *   flange clears its highest point when s − ρ ≥ r_f + c; both hold for some s exactly when
 *   2ρ ≤ R − r_f − c. Every point of the bar then lies within s + ρ ≤ R of the wheel's
 *   centre, so the bar's widest point, at its centre height, is inside the wheel as well:
 *   a round section costs no depth for its width.
 *   Part fed horizontally into the wheel (on a table), any section: the part travels along
 *   the cut through the band between the flange's edge and the rim, so its width lies
 *   along the feed and does not limit its height.
 *   Traverse pass, any section: the last pass runs the rim along the bottom of the whole
 *   width; only the height counts.
 * - chord: wheel coming down into a rectangular section of width W (along the cut): the cut
 *   is through only when the rim at ±W/2 from the wheel's centre line reaches the bottom
 *   corners, (W/2)² + s_bottom² ≤ R², while the flange stays above the top,
 *   s_bottom − H ≥ r_f + c; so H ≤ √(R² − (W/2)²) − r_f − c. A rocking stroke is given no
 *   credit (its reach depends on the machine): rocking is judged as a plunge.
 * - turned to the centre: a round bar turned under the wheel is cut through when the rim
 *   reaches its centre, with the flange above its top: ρ ≤ R − r_f − c, so d ≤ 2·depth.
 * - turned through the wall: a tube turned under the wheel is cut through when the rim
 *   reaches the bore, with the flange above its top: wall ≤ R − r_f − c, whatever the
 *   outside diameter.
 */
import type { CapacityLimit, CutMotion, FeedDirection, Shape } from './vocabulary';

/**
 * Clearance kept between the flange and the part, mm. Kerfbook's choice (common practice):
 * room for clamp jaws, burrs and the wheel wearing down during the cut.
 */
export const CUT_CLEARANCE_MM = 5;

const CLEARANCE_WORDS = `${CUT_CLEARANCE_MM} mm clearance (geometry; the clearance is common practice)`;

/** Each limit's rule in words with its formula, for the check's reason and the computed panels. */
export const CAPACITY_LIMIT_RULES: Record<CapacityLimit, string> = {
  radius: `Capacity = (wheel diameter − flange diameter)/2 less a ${CLEARANCE_WORDS}: the flanges cannot enter the cut. A round section, a part fed horizontally into the wheel and a traverse pass lose no height to the part's width.`,
  chord: `Coming down into a section W wide, the wheel cuts through only when its edge at ±W/2 reaches the bottom corners while the flange stays above the top: height ≤ √(R² − (W/2)²) − flange radius − ${CLEARANCE_WORDS}.`,
  'turned-to-centre': `A turned bar is cut through when the wheel reaches its centre with the flange above its top: diameter ≤ 2 × ((wheel diameter − flange diameter)/2 − ${CLEARANCE_WORDS}).`,
  'turned-through-wall': `A turned tube is cut through when the wheel reaches the bore with the flange above its top: wall ≤ (wheel diameter − flange diameter)/2 − ${CLEARANCE_WORDS}, whatever the outside diameter.`,
};

/**
 * Largest depth (mm) a wheel of `wheelDiameterMm` clamped between flanges of
 * `flangeDiameterMm` can cut: (D − flange)/2 − clearance, never below zero.
 */
export function cuttingDepthMm(wheelDiameterMm: number, flangeDiameterMm: number, clearanceMm: number = CUT_CLEARANCE_MM): number {
  return Math.max(0, (wheelDiameterMm - flangeDiameterMm) / 2 - clearanceMm);
}

/**
 * Largest height (mm) of a section `widthMm` wide that a wheel coming down into it cuts
 * through: √(R² − (W/2)²) − r_f − clearance, never below zero (0 when the section is as
 * wide as the wheel).
 */
export function chordDepthMm(wheelDiameterMm: number, flangeDiameterMm: number, widthMm: number, clearanceMm: number = CUT_CLEARANCE_MM): number {
  const r = wheelDiameterMm / 2;
  const half = widthMm / 2;
  if (!(half < r)) return 0;
  return Math.max(0, Math.sqrt(r * r - half * half) - flangeDiameterMm / 2 - clearanceMm);
}

/** The limit that applies to a cut (see the file's header). */
export function capacityLimitOf(motion: CutMotion, shape: Shape, feedDirection: FeedDirection): CapacityLimit {
  if (motion === 'turning-specimen' && shape === 'round-bar') return 'turned-to-centre';
  if (motion === 'turning-specimen' && shape === 'tube') return 'turned-through-wall';
  if (shape === 'rectangular' && feedDirection === 'wheel-down' && motion !== 'traverse-pass') return 'chord';
  return 'radius';
}

/** The part as the capacity sees it: the scope's largest size and its shape's extra dimension. */
export interface CapacityPart {
  shape: Shape;
  /** Outside diameter (round bar, tube) or section height (rectangular), mm. */
  sizeMaxMm: number;
  /** Width of a rectangular section along the cut, mm (null otherwise). */
  widthMm: number | null;
  /** Wall of a tube, mm (null otherwise). */
  wallMm: number | null;
}

/** The wheel on the machine, and how the cut is made. */
export interface CapacitySetup {
  wheelDiameterMm: number;
  flangeDiameterMm: number;
  feedDirection: FeedDirection;
  motion: CutMotion;
  /** mm; CUT_CLEARANCE_MM unless told. */
  clearanceMm?: number;
}

export interface CapacityFit {
  /** The limit that applies. */
  limit: CapacityLimit;
  /** Radial cutting depth (D − flange)/2 − clearance, mm. */
  depthMm: number;
  /**
   * Largest value the limit allows for the dimension it governs, mm: the part size
   * (diameter or height), or the wall of a turned tube.
   */
  cuttableSizeMm: number;
  /** The part's value of that dimension, mm. */
  partMm: number;
  /** Whether the part fits. */
  fits: boolean;
  /** cuttableSizeMm − partMm (negative when it does not fit), mm. */
  marginMm: number;
}

/** The part's dimension a limit governs: a turned tube's wall, otherwise the largest size. */
function governedMm(limit: CapacityLimit, part: CapacityPart): number | null {
  return limit === 'turned-through-wall' ? part.wallMm : part.sizeMaxMm;
}

/**
 * Whether a part can be cut through with a wheel on a machine. Null when the part lacks
 * the dimension its limit needs (a rectangle's width for the chord limit, a turned tube's
 * wall): the capacity is not known until it is given.
 */
export function capacityFit(part: CapacityPart, setup: CapacitySetup): CapacityFit | null {
  const clearance = setup.clearanceMm ?? CUT_CLEARANCE_MM;
  const limit = capacityLimitOf(setup.motion, part.shape, setup.feedDirection);
  const partMm = governedMm(limit, part);
  if (partMm === null || (limit === 'chord' && part.widthMm === null)) return null;
  const depthMm = cuttingDepthMm(setup.wheelDiameterMm, setup.flangeDiameterMm, clearance);
  const cuttable =
    limit === 'chord'
      ? chordDepthMm(setup.wheelDiameterMm, setup.flangeDiameterMm, part.widthMm!, clearance)
      : limit === 'turned-to-centre'
        ? 2 * depthMm
        : depthMm;
  return { limit, depthMm, cuttableSizeMm: cuttable, partMm, fits: partMm <= cuttable, marginMm: cuttable - partMm };
}

/**
 * Smallest wheel diameter (mm) that still cuts the part through on the machine: each limit
 * solved for D (geometry, computed by hand in the tests):
 * radius D = 2·(H + c) + flange; chord D = 2·√((H + r_f + c)² + (W/2)²);
 * turned to the centre D = d + flange + 2c; turned through the wall D = 2·(wall + c) + flange.
 * Null when the part lacks the dimension its limit needs.
 */
export function smallestWheelDiameterMm(part: CapacityPart, setup: Omit<CapacitySetup, 'wheelDiameterMm'>): number | null {
  const c = setup.clearanceMm ?? CUT_CLEARANCE_MM;
  const flange = setup.flangeDiameterMm;
  const limit = capacityLimitOf(setup.motion, part.shape, setup.feedDirection);
  const partMm = governedMm(limit, part);
  if (partMm === null || (limit === 'chord' && part.widthMm === null)) return null;
  switch (limit) {
    case 'radius':
    case 'turned-through-wall':
      return 2 * (partMm + c) + flange;
    case 'turned-to-centre':
      return partMm + flange + 2 * c;
    case 'chord':
      return 2 * Math.hypot(partMm + flange / 2 + c, part.widthMm! / 2);
  }
}
