/**
 * The standard cautions every recipe page and bench sheet carries, in Kerfbook's own words,
 * each with the standards or regulations behind it. Kerfbook computes and checks; it never
 * certifies a setup as safe, and these lines defer to local rules and the lab's licensed
 * practice.
 */

export interface Caution {
  /** Stable id, for print layouts and tests. */
  id: string;
  title: string;
  text: string;
  /** Standards or regulations behind the caution, where there is one. */
  sources: readonly string[];
}

/** Shown with the cautions, always. */
export const PRECEDENCE_LINE = "Local regulations, the machine's manual and the lab's licensed safety practice take precedence over this sheet.";

/** Shown beside computed values and checks: the app never claims a setup is safe. */
export const NO_SAFETY_CLAIM = 'Kerfbook computes values and flags known problems; it does not certify that a setup is safe.';

export const STANDARD_CAUTIONS: readonly Caution[] = [
  {
    id: 'wheel-burst',
    title: 'Wheel speed and guards',
    text: 'Never run a wheel faster than the maximum speed marked on it. Keep the guard or hood closed and never defeat an interlock. Stand out of the plane of the wheel when starting it.',
    sources: ['ANSI B7.1', 'EN 12413', 'OSHA 29 CFR 1910.215'],
  },
  {
    id: 'wheel-inspection',
    title: 'Inspect the wheel before mounting',
    text: 'Look for cracks, chips and damp; do not use an organic-bonded wheel past its expiry date. Ring-test vitrified wheels.',
    sources: ['ANSI B7.1', 'EN 12413'],
  },
  {
    id: 'clamping',
    title: 'Clamp the part',
    text: 'The part must not move during the cut: a moving part can break the wheel. Support both sides of the cut so the offcut cannot drop or pinch the wheel.',
    sources: [],
  },
  {
    id: 'coolant',
    title: 'Coolant',
    text: "Avoid skin contact and mist (dermatitis, asthma). Check the concentration and bacteria regularly; add biocides only within the supplier's limits.",
    sources: ['NIOSH 98-102', 'NIOSH REL 0.4 mg/m³ (thoracic aerosol)'],
  },
  {
    id: 'hot-parts',
    title: 'Hot parts and burrs',
    text: 'Cut parts can be hot and sharp: handle them with tongs or gloves and deburr them.',
    sources: [],
  },
  {
    id: 'ppe',
    title: 'Personal protection',
    text: 'Wear eye and hearing protection and nitrile gloves when handling coolant; no loose sleeves near the wheel.',
    sources: ['Directive 2003/10/EC (noise action values 80 / 85 dB(A), limit 87 dB(A))'],
  },
  {
    id: 'lock-out',
    title: 'Lock out before maintenance',
    text: 'Switch off and lock out the machine before changing a wheel or doing maintenance.',
    sources: ['OSHA 29 CFR 1910.147', 'ISO 14118'],
  },
  {
    id: 'hazardous-dust',
    title: 'Hazardous dusts',
    text: 'Beryllium, lead, fibre composites and similar materials are cut wet and enclosed; radioactive or toxic materials only under a specific approved procedure.',
    sources: ['OSHA PEL for beryllium 0.2 µg/m³'],
  },
];
