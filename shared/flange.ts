/**
 * Flange diameter against the wheel. The flanges clamp and drive the wheel; the stresses of a
 * turning wheel are highest at its bore, so the clamping must bear well away from it, and too
 * small a flange can let the wheel break.
 *
 * What Kerfbook relies on:
 * - OSHA 29 CFR 1910.215(c)(1): abrasive wheels are mounted between flanges "not less than
 *   one-third the diameter of the wheel", with listed exceptions (wording read in OSHA's
 *   published interpretation of 1 March 1992).
 * - Cutting-off wheels are among those exceptions: Type 1 (straight) cutting-off wheels are
 *   mounted between relieved flanges with matching bearing surfaces of at least one-fourth of
 *   the wheel diameter (read in California Code of Regulations, title 8, §3579(a), exception
 *   9(A), which follows ANSI B7.1; ANSI B7.1's list of exceptions names Type 1 and 27A
 *   cutting-off wheels, read in a public reproduction of the 2010 edition; that the federal
 *   text carries the same one-fourth figure is from memory).
 * - Every wheel in Kerfbook is a cut-off wheel, so the one-fourth minimum applies. Diamond and
 *   CBN rim wheels on steel centres fall under EN 13236, where the wheel maker states the
 *   flange; Kerfbook applies the same one-fourth floor to them (Kerfbook's choice, common
 *   practice) and the maker's larger figure, where given, takes precedence.
 */

/** Smallest flange diameter as a share of the wheel diameter for cut-off wheels. */
export const CUTOFF_FLANGE_MIN_SHARE = 1 / 4;

/** Smallest flange diameter (mm) for a cut-off wheel of `wheelDiameterMm` (mm): D / 4. */
export function minFlangeDiameterMm(wheelDiameterMm: number): number {
  return wheelDiameterMm * CUTOFF_FLANGE_MIN_SHARE;
}

/**
 * Whether a flange of `flangeDiameterMm` is too small for a cut-off wheel of
 * `wheelDiameterMm` (both mm). Compared as 4·flange < D so the exact boundary (a 50 mm flange
 * on a 200 mm wheel) is not lost to rounding.
 */
export function flangeTooSmall(flangeDiameterMm: number, wheelDiameterMm: number): boolean {
  return flangeDiameterMm / CUTOFF_FLANGE_MIN_SHARE < wheelDiameterMm;
}
