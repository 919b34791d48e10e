/**
 * Wheel suggestion from the lab's own selection table: material group × hardness band →
 * a wheel from the lab's stock. The table is the lab's; Kerfbook only ships a starting
 * table built from common practice (STARTER_SELECTION).
 */
import { convertHardness } from './hardness';
import { hardestBandRows, isAbove, pointWindow } from './hardness-bands';
import type { HardnessValue, HardnessWindow } from './schemas/stock';
import type { SelectionRow, WheelRecord } from './stock-types';
import type { MaterialGroup, WheelKind } from './vocabulary';
import { MATERIAL_GROUP_LABELS } from './vocabulary';
import { abrasiveFamily, gradeBand, parseWheelSpec, type AbrasiveFamily, type GradeBand } from './wheel-spec';

export interface WheelSuggestion {
  wheel: WheelRecord;
  /** The selection-table row that matched. */
  row: SelectionRow;
  /** Plain words: why this wheel is offered. */
  reason: string;
}

/** `hardness` expressed on the window's scale (converted for steels), or null when that is not possible. */
function onScale(hardness: HardnessValue, window: HardnessWindow, group: MaterialGroup): number | null {
  if (hardness.scale === window.scale) return hardness.value;
  const c = convertHardness(hardness.value, hardness.scale, window.scale, group);
  return c.ok ? c.value : null;
}

/** Width of a band in HV where it converts (so bands on different scales compare), else on its own scale. */
function bandWidth(window: HardnessWindow, group: MaterialGroup): number {
  if (window.scale === 'HV') return window.max - window.min;
  const lo = convertHardness(window.min, window.scale, 'HV', group);
  const hi = convertHardness(window.max, window.scale, 'HV', group);
  return lo.ok && hi.ok ? Math.abs(hi.value - lo.value) : window.max - window.min;
}

const describe = (w: HardnessWindow): string => `${w.min}–${w.max} ${w.scale}`;

/**
 * Non-archived wheels the lab's table offers for `group` at `hardness`: rows whose band
 * contains the hardness first (narrowest band first), then the group-wide rows. Without a
 * hardness, group-wide rows come first and banded rows follow, marked as unconfirmed.
 * Each wheel appears once, with the most specific row that offered it.
 *
 * A coated part (`coatingHardness`) has two layers to cut: the rows for the harder layer
 * come first, since the harder material sets the bond (harder material, softer bond; common
 * practice), then those for the other layer. A coating harder than every band of the
 * group takes the hardest band's rows, the closest the table comes.
 */
export function suggestWheels(
  group: MaterialGroup,
  hardness: HardnessValue | null,
  rows: SelectionRow[],
  wheels: WheelRecord[],
  coatingHardness: HardnessValue | null = null,
): WheelSuggestion[] {
  const byId = new Map(wheels.filter((w) => !w.archived).map((w) => [w.id, w]));
  const groupLabel = MATERIAL_GROUP_LABELS[group];
  const coatingFirst = coatingHardness !== null && (hardness === null || isAbove(pointWindow(coatingHardness), pointWindow(hardness), group) === true);
  const layers: { h: HardnessValue; coating: boolean }[] = [];
  if (hardness) layers.push({ h: hardness, coating: false });
  if (coatingHardness) layers[coatingFirst ? 'unshift' : 'push']({ h: coatingHardness, coating: true });
  const groupRows = rows.filter((row) => row.group === group && byId.has(row.wheelId));
  const hardest = new Set(coatingHardness === null ? [] : hardestBandRows(groupRows, group, pointWindow(coatingHardness)));
  const coatingText = (h: HardnessValue) => ` For the coating's ${h.value} ${h.scale}${coatingFirst ? ', the harder layer, which sets the bond' : ''}.`;

  type Ranked = { rank: number; width: number; order: number; row: SelectionRow; reason: string };
  const ranked: Ranked[] = [];
  rows.forEach((row, order) => {
    if (row.group !== group || !byId.has(row.wheelId)) return;
    if (row.hardness === null) {
      ranked.push({ rank: 2, width: 0, order, row, reason: `Lab table: ${groupLabel}, any hardness.` });
      return;
    }
    const width = bandWidth(row.hardness, group);
    const layer = layers.findIndex(({ h }) => {
      const v = onScale(h, row.hardness!, group);
      return v !== null && v >= row.hardness!.min && v <= row.hardness!.max;
    });
    if (layer >= 0) {
      const { h, coating } = layers[layer]!;
      const v = onScale(h, row.hardness, group)!;
      const converted = h.scale === row.hardness.scale ? '' : ` (${h.value} ${h.scale} ≈ ${Math.round(v)} ${row.hardness.scale}, approximate)`;
      ranked.push({
        rank: layer,
        width,
        order,
        row,
        reason: coating
          ? `Lab table: ${groupLabel}, ${describe(row.hardness)}${converted}.${coatingText(h)}`
          : `Lab table: ${groupLabel}, ${describe(row.hardness)}${converted}.`,
      });
      return;
    }
    if (hardest.has(row)) {
      ranked.push({
        rank: layers.findIndex((l) => l.coating),
        width,
        order,
        row,
        reason: `Lab table: ${groupLabel}, ${describe(row.hardness)}, its hardest band: the coating's ${coatingHardness!.value} ${coatingHardness!.scale} is harder than every band of the table.`,
      });
      return;
    }
    if (hardness === null) {
      ranked.push({
        rank: 3,
        width,
        order,
        row,
        reason: `Lab table: ${groupLabel}, ${describe(row.hardness)} (hardness not given, so the band is not confirmed).`,
      });
    }
  });
  ranked.sort((a, b) => a.rank - b.rank || a.width - b.width || a.order - b.order);
  const seen = new Set<number>();
  const out: WheelSuggestion[] = [];
  for (const r of ranked) {
    if (seen.has(r.row.wheelId)) continue;
    seen.add(r.row.wheelId);
    out.push({ wheel: byId.get(r.row.wheelId)!, row: r.row, reason: r.row.note ? `${r.reason} ${r.row.note}` : r.reason });
  }
  return out;
}

/** The kind of wheel a starter row asks for; the seeds pick a wheel of the lab's stock that matches. */
export interface StarterWheel {
  kind: WheelKind;
  /** Allowed abrasives, first preferred. */
  abrasives: readonly AbrasiveFamily[];
  /** For bonded wheels: the grade band wanted (harder material → softer bond); null for rim wheels. */
  grade: GradeBand | null;
}

/** One row of the starting selection table. */
export interface StarterSelectionRow {
  group: MaterialGroup;
  /** Hardness band, or null for the whole group. */
  hardness: HardnessWindow | null;
  wheel: StarterWheel;
  /** Shown with the suggestion. */
  note: string;
}

const bonded = (abrasive: AbrasiveFamily, grade: GradeBand): StarterWheel => ({ kind: 'bonded', abrasives: [abrasive], grade });
const rim = (...abrasives: AbrasiveFamily[]): StarterWheel => ({ kind: 'rim', abrasives, grade: null });

/** A steel group's hardness bands, each on an aluminium oxide wheel of its own grade band (harder band, softer bond). */
const aluminiumOxideBands = (group: MaterialGroup, bands: readonly [HardnessWindow, GradeBand, string][]): StarterSelectionRow[] =>
  bands.map(([hardness, grade, note]) => ({ group, hardness, wheel: bonded('aluminium-oxide', grade), note }));

/**
 * Kerfbook's starting table (common practice): aluminium oxide for ferrous metals, silicon
 * carbide for non-ferrous metals, diamond (or CBN) rim wheels for ceramics, cemented
 * carbides and hard brittle materials; the harder the material, the softer the bond, so
 * worn grains are released. A starting point for the lab to adjust from its own trials.
 *
 * Plain and low-alloy steels are banded by hardness, like the hardened steels: a quenched
 * low-alloy steel at 45 HRC needs a softer bond than a normalised one at 200 HBW (the band
 * limits at about 35 and 50 HRC from memory). Nickel and cobalt alloys take aluminium
 * oxide, as most wheel charts give them (from memory): like iron, nickel and cobalt wear
 * silicon carbide chemically at cutting temperature (from memory), and the tough, often
 * age-hardened alloys want a medium bond; confirm by trial cuts.
 */
export const STARTER_SELECTION: readonly StarterSelectionRow[] = [
  ...aluminiumOxideBands('plain-low-alloy-steel', [
    [{ min: 80, max: 345, scale: 'HV' }, 'hard', 'Soft ferrous metal (up to about 35 HRC): aluminium oxide, harder bond.'],
    [{ min: 35, max: 50, scale: 'HRC' }, 'medium', 'Hardened low-alloy steel: aluminium oxide, medium bond.'],
    [{ min: 50, max: 68, scale: 'HRC' }, 'soft', 'Fully hardened low-alloy steel: aluminium oxide, softer bond so worn grains are released.'],
  ]),
  ...aluminiumOxideBands('hardened-tool-steel', [
    [{ min: 20, max: 45, scale: 'HRC' }, 'medium', 'Medium-hard steel: aluminium oxide, medium bond.'],
    [{ min: 45, max: 68, scale: 'HRC' }, 'soft', 'Hard steel: aluminium oxide, softer bond so worn grains are released.'],
  ]),
  {
    group: 'hardened-tool-steel',
    hardness: { min: 58, max: 68, scale: 'HRC' },
    wheel: rim('cbn'),
    note: 'Very hard steel on a precision saw: CBN rim wheel (diamond dulls on steel).',
  },
  {
    group: 'stainless-steel',
    hardness: null,
    wheel: bonded('aluminium-oxide', 'medium'),
    note: 'Ferrous metal: aluminium oxide, medium bond; keep the feed low to avoid heat.',
  },
  { group: 'cast-iron', hardness: null, wheel: bonded('aluminium-oxide', 'medium'), note: 'Ferrous metal: aluminium oxide, medium bond.' },
  { group: 'aluminium-magnesium', hardness: null, wheel: bonded('silicon-carbide', 'hard'), note: 'Soft non-ferrous metal: silicon carbide, harder bond.' },
  { group: 'copper', hardness: null, wheel: bonded('silicon-carbide', 'hard'), note: 'Soft non-ferrous metal: silicon carbide, harder bond.' },
  {
    group: 'titanium',
    hardness: null,
    wheel: bonded('silicon-carbide', 'medium'),
    note: 'Non-ferrous metal: silicon carbide, medium bond; plenty of coolant.',
  },
  {
    group: 'nickel-cobalt',
    hardness: null,
    wheel: bonded('aluminium-oxide', 'medium'),
    note: 'Nickel and cobalt alloys: aluminium oxide, medium bond, low feed; a starting point to confirm by trial cuts.',
  },
  { group: 'cemented-carbide', hardness: null, wheel: rim('diamond'), note: 'Hard brittle material: diamond rim wheel.' },
  { group: 'ceramic-glass', hardness: null, wheel: rim('diamond'), note: 'Hard brittle material: diamond rim wheel.' },
  { group: 'polymer-composite', hardness: null, wheel: rim('diamond'), note: 'Fibre composites: diamond rim wheel; cut slowly to avoid fraying.' },
  {
    group: 'electronics-mixed',
    hardness: null,
    wheel: rim('diamond'),
    note: 'Mostly non-metallic: diamond rim wheel; dress it with an alumina or SiC stick where metal dulls it.',
  },
];

/** Whether a stocked wheel satisfies a starter row's wheel (kind, abrasive from its marking, grade band). */
export function matchesStarterWheel(want: StarterWheel, wheel: Pick<WheelRecord, 'kind' | 'specification'>): boolean {
  if (wheel.kind !== want.kind) return false;
  const parsed = parseWheelSpec(wheel.specification);
  if (!parsed.ok || !want.abrasives.includes(abrasiveFamily(parsed.spec))) return false;
  if (want.grade === null) return true;
  return parsed.spec.grade !== null && gradeBand(parsed.spec.grade) === want.grade;
}
