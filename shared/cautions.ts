/**
 * The standard cautions every recipe page and bench sheet carries, in Kerfbook's own words,
 * each with the standards or regulations behind it, and the cautions a recipe's material,
 * coolant or flags call for. Kerfbook computes and checks; it never certifies a setup as
 * safe, and these lines defer to local rules and the lab's licensed practice.
 */
import type { RecipeContext } from './recipe-context';
import type { RecipeContent } from './schemas/recipe';
import type { MaterialGroup, WheelKind } from './vocabulary';
import { wheelSafetyStandard } from './wheel-standards';

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

/** Bonded abrasive wheels and diamond or CBN wheels have their own European safety standards (see wheel-standards.ts). */
const BONDED_STANDARD = 'EN 12413 (bonded wheels)';
const SUPERABRASIVE_STANDARD = 'EN 13236 (diamond and CBN wheels)';

export const STANDARD_CAUTIONS: readonly Caution[] = [
  {
    id: 'wheel-burst',
    title: 'Wheel speed and guards',
    text: 'Never run a wheel faster than the maximum speed marked on it. Keep the guard or hood closed and never defeat an interlock. Stand out of the plane of the wheel when starting it.',
    sources: ['ANSI B7.1', BONDED_STANDARD, SUPERABRASIVE_STANDARD, 'OSHA 29 CFR 1910.215'],
  },
  {
    id: 'wheel-inspection',
    title: 'Inspect the wheel before mounting',
    text: 'Look for cracks, chips and damp; do not use an organic-bonded wheel past its expiry date. Ring-test vitrified wheels.',
    sources: ['ANSI B7.1', BONDED_STANDARD, SUPERABRASIVE_STANDARD],
  },
  {
    // ANSI B7.1, "starting the wheel" (read in a public quotation of the 2000 edition). OSHA
    // 29 CFR 1910.215(d)(1) asks the inspection, ring test and speed check before mounting,
    // but not this run (from memory), so it is not cited here.
    id: 'new-wheel-run',
    title: 'Run a newly mounted wheel first',
    text: 'After mounting a new wheel or remounting a used one, run it at operating speed with the hood closed for at least a minute before cutting. Nobody stands in front of it or in line with it meanwhile.',
    sources: ['ANSI B7.1 (starting the wheel)'],
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

/**
 * The standard cautions for a recipe's wheel: the wheel cautions cite only the European
 * standard of its kind (EN 12413 for bonded wheels, EN 13236 for diamond and CBN rim wheels);
 * without a wheel, both.
 */
export function standardCautionsFor(kind: WheelKind | null | undefined): readonly Caution[] {
  if (!kind) return STANDARD_CAUTIONS;
  const drop = wheelSafetyStandard(kind) === 'EN 13236' ? BONDED_STANDARD : SUPERABRASIVE_STANDARD;
  const keep = wheelSafetyStandard(kind);
  return STANDARD_CAUTIONS.map((c) => ({
    ...c,
    sources: c.sources.filter((s) => s !== drop).map((s) => (s === BONDED_STANDARD || s === SUPERABRASIVE_STANDARD ? keep : s)),
  }));
}

/** Fines of these metals burn; titanium alloys always (the group), magnesium and zirconium where the material says so. */
export const COMBUSTIBLE_FINES: Caution = {
  id: 'combustible-fines',
  title: 'Metal fines that can burn',
  text: 'Fines and sludge of magnesium, titanium and zirconium burn fiercely once lit, and water on a burning metal makes it worse. Keep the swarf wet and the machine clean, empty sump and filters into a closed metal container, never let the sludge dry out in the machine, keep sparks and flames away, and keep a class D extinguisher or dry sand at hand. Wet magnesium sludge gives off hydrogen: store it vented.',
  sources: ['NFPA 484, combustible metals (from memory)', 'common practice'],
};

/** Shown with COMBUSTIBLE_FINES when the recipe cuts with oil. */
export const COMBUSTIBLE_FINES_OIL: Caution = {
  id: 'combustible-fines-oil',
  title: 'Cutting oil with metal fines that can burn',
  text: "Cutting oil adds fuel: its mist and the oily sludge can be lit by the sparks and hot fines of the cut. Keep the hood closed, the oil flowing over the cut and the extraction on, and keep the fire precautions of the machine's manual.",
  sources: ['NFPA 484, combustible metals (from memory)', 'common practice'],
};

/** Electronic assemblies. */
export const LITHIUM_CELLS: Caution = {
  id: 'lithium-cells',
  title: 'Lithium cells in assemblies',
  text: "Electronic assemblies may hold lithium cells (coin cells, packs). Find and remove them before cutting: a cut or crushed cell can short, heat up, vent toxic gas and burn. If one is cut by mistake, stop, keep clear and follow the lab's procedure for burning batteries.",
  sources: ['common practice'],
};

/** Cemented carbides always; nickel and cobalt alloys when the material is marked for hazardous dust. */
export const HARD_METAL_DUST: Caution = {
  id: 'hard-metal-dust',
  title: 'Cobalt and hard-metal dust',
  text: 'Cutting dust of cemented carbide (hard metal) and cobalt alloys carries cobalt, which sensitises skin and lungs and can cause hard-metal lung disease. Cut wet only, keep the hood closed and the extraction on, clean up wet (never with compressed air), wear nitrile gloves and wash your hands.',
  sources: ['OSHA PEL for cobalt metal, dust and fume, 0.1 mg/m³ (from memory)', 'IARC: cobalt metal with tungsten carbide, Group 2A (from memory)'],
};

/**
 * The cautions a recipe calls for beyond the standard ones, from its material group (the
 * scope's, else the material's), the material's flags and the coolant:
 * - metal fines that can burn: the titanium group, or a material flagged for combustible fines
 *   (magnesium alloys share a group with aluminium and zirconium has none, so the flag tells);
 *   the oil caution besides when the coolant is cutting oil;
 * - lithium cells: the electronics and mixed assemblies group;
 * - cobalt and hard-metal dust: cemented carbides, or nickel and cobalt alloys whose material
 *   is flagged for hazardous dust.
 * Tolerates half-typed content (the editor calls it on every change).
 */
export function recipeCautions(content: RecipeContent, ctx: Pick<RecipeContext, 'material'>): Caution[] {
  const material = ctx.material;
  const group: MaterialGroup | null = content.scope?.group ?? material?.group ?? null;
  const out: Caution[] = [];
  if (group === 'titanium' || material?.combustibleFines === true) {
    out.push(COMBUSTIBLE_FINES);
    if (content.coolant?.type === 'oil') out.push(COMBUSTIBLE_FINES_OIL);
  }
  if (group === 'electronics-mixed') out.push(LITHIUM_CELLS);
  if (group === 'cemented-carbide' || (group === 'nickel-cobalt' && material?.hazardousDust === true)) out.push(HARD_METAL_DUST);
  return out;
}
