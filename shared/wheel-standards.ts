/**
 * Which safety standard governs a wheel, for every place the code names one. Bonded
 * abrasive wheels (the consumable cut-off wheels) fall under EN 12413, "Safety requirements
 * for bonded abrasive products". Diamond and CBN wheels fall under EN 13236, "Safety
 * requirements for superabrasive products", which covers precision and non-precision
 * cutting-off wheels with diamond or cBN and does not apply to bonded abrasive products
 * (scope read in the published abstract of EN 13236:2019). In the United States ANSI B7.1
 * covers both: its definition of an abrasive wheel includes diamond wheels (B7.1-2000,
 * definition 1.2.1, read in a public reproduction); we know of no separate American safety
 * code for superabrasive wheels and cite none. OSHA 29 CFR 1910.215 applies to both.
 */
import type { WheelKind } from './vocabulary';

/** The European standard for the wheel's kind: EN 12413 (bonded) or EN 13236 (diamond/CBN rim). */
export function wheelSafetyStandard(kind: WheelKind | null | undefined): 'EN 12413' | 'EN 13236' {
  return kind === 'rim' ? 'EN 13236' : 'EN 12413';
}

/** The wheel standards to cite for the kind, e.g. "ANSI B7.1; EN 13236". */
export function wheelStandards(kind: WheelKind | null | undefined): string {
  return `ANSI B7.1; ${wheelSafetyStandard(kind)}`;
}
