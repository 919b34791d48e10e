/**
 * Hardness conversion for non-austenitic steels by linear interpolation between adjacent
 * rows of ASTM E140 Table 1 (HRC range) and Table 2 (HRB range). Never extrapolates: a
 * value outside the embedded rows is refused. Other material groups keep their measured
 * scale.
 */
import type { HardnessValue } from './schemas/stock';
import type { HardnessScale, MaterialGroup } from './vocabulary';

/** The standard's caveats, shown wherever a converted value appears (ASTM E140 and ISO 18265, in our own words). */
export const HARDNESS_CAVEATS: readonly string[] = [
  'Converted hardness is approximate and depends on the material. Convert specification limits rather than test results where you can, and report the measured value with the converted one in parentheses, e.g. 353 HBW (38 HRC).',
  'ASTM E140 Tables 1 and 2 apply only to homogeneous non-austenitic carbon, alloy and tool steels (as-forged, annealed, normalized, quenched and tempered). The standard has tables for other materials too (austenitic stainless steels, nickel alloys, brass, copper and aluminium among them, from memory), but Kerfbook includes only the two steel tables: other materials keep their measured scale.',
  'ISO 18265: a converted value is exact only for the material the table was made for; for any other material it is an indication.',
  'Values in parentheses lie outside the normal range of that scale. HBW is Brinell with a 10 mm carbide ball at 3000 kgf.',
  'Outside the range of the table no conversion is given; values are never extrapolated.',
];

/** Groups ASTM E140 Tables 1 and 2 apply to. */
export const CONVERTIBLE_GROUPS: readonly MaterialGroup[] = ['plain-low-alloy-steel', 'hardened-tool-steel'];

/** Why a group keeps its measured scale. */
const NOT_CONVERTIBLE: Partial<Record<MaterialGroup, string>> = {
  'stainless-steel':
    'Stainless steels include austenitic grades, which the non-austenitic steel tables do not cover. ASTM E140 has separate tables for them, but Kerfbook includes only the steel tables it uses (Tables 1 and 2); keep the measured scale.',
  'cast-iron': 'Cast irons are not covered by the steel conversion tables (ASTM E140 Tables 1 and 2); keep the measured scale.',
};

/** One row of a conversion table; null where the standard gives no value; `hbwOutside` marks a value in parentheses. */
interface Row {
  hrc?: number;
  hrb?: number;
  hv: number;
  hbw: number | null;
  hbwOutside?: boolean;
}

/*
 * ASTM E140, Table 1 (non-austenitic steels, Rockwell C range): HRC, HV, HBW (10 mm carbide
 * ball, 3000 kgf). Every row from 68 to 20 HRC; HBW is not given above 65 HRC and is in
 * parentheses from 65 to 60 HRC. Confirmed row by row against the public reproduction of
 * the table at phase2plus.com/hardness-testers/conversion-charts ("Approximate Hardness
 * Conversion Numbers for Non-Austenitic Steels (Rockwell C Hardness Range)") and for 68–44
 * HRC also against mikipulley.co.jp (Tech data 20), which additionally puts 634 at 59 HRC in
 * parentheses; we follow phase2plus there (634 is below the 650 HBW limit of ASTM E10).
 */
const HRC_ROWS: readonly Row[] = [
  [68, 940, null],
  [67, 900, null],
  [66, 865, null],
  [65, 832, 739, true],
  [64, 800, 722, true],
  [63, 772, 705, true],
  [62, 746, 688, true],
  [61, 720, 670, true],
  [60, 697, 654, true],
  [59, 674, 634],
  [58, 653, 615],
  [57, 633, 595],
  [56, 613, 577],
  [55, 595, 560],
  [54, 577, 543],
  [53, 560, 525],
  [52, 544, 512],
  [51, 528, 496],
  [50, 513, 481],
  [49, 498, 469],
  [48, 484, 455],
  [47, 471, 443],
  [46, 458, 432],
  [45, 446, 421],
  [44, 434, 409],
  [43, 423, 400],
  [42, 412, 390],
  [41, 402, 381],
  [40, 392, 371],
  [39, 382, 362],
  [38, 372, 353],
  [37, 363, 344],
  [36, 354, 336],
  [35, 345, 327],
  [34, 336, 319],
  [33, 327, 311],
  [32, 318, 301],
  [31, 310, 294],
  [30, 302, 286],
  [29, 294, 279],
  [28, 286, 271],
  [27, 279, 264],
  [26, 272, 258],
  [25, 266, 253],
  [24, 260, 247],
  [23, 254, 243],
  [22, 248, 237],
  [21, 243, 231],
  [20, 238, 226],
].map(([hrc, hv, hbw, outside]) => ({ hrc: hrc as number, hv: hv as number, hbw: hbw as number | null, hbwOutside: outside === true }));

/*
 * ASTM E140, Table 2 (non-austenitic steels, Rockwell B range): HRB, HV, HB (3000 kgf).
 * FROM MEMORY: no public reproduction of Table 2 was found to confirm these rows, the
 * check points 100/240, 90/185 and 80/150 included. Only 100 down to 55 HRB is embedded;
 * below that the table changes Brinell load, so lower values are refused rather than
 * guessed. Check against a licensed copy.
 */
const HRB_ROWS: readonly Row[] = [
  [100, 240],
  [99, 234],
  [98, 228],
  [97, 222],
  [96, 216],
  [95, 210],
  [94, 205],
  [93, 200],
  [92, 195],
  [91, 190],
  [90, 185],
  [89, 180],
  [88, 176],
  [87, 172],
  [86, 169],
  [85, 165],
  [84, 162],
  [83, 159],
  [82, 156],
  [81, 153],
  [80, 150],
  [79, 147],
  [78, 144],
  [77, 141],
  [76, 139],
  [75, 137],
  [74, 135],
  [73, 132],
  [72, 130],
  [71, 127],
  [70, 125],
  [69, 123],
  [68, 121],
  [67, 119],
  [66, 117],
  [65, 116],
  [64, 114],
  [63, 112],
  [62, 110],
  [61, 108],
  [60, 107],
  [59, 106],
  [58, 104],
  [57, 103],
  [56, 101],
  [55, 100],
].map(([hrb, hv]) => ({ hrb: hrb as number, hv: hv as number, hbw: hv as number }));

interface Table {
  name: string;
  rows: readonly Row[];
}
export const E140_TABLE_1 = 'ASTM E140, Table 1';
export const E140_TABLE_2 = 'ASTM E140, Table 2 (from memory)';
const TABLES: readonly Table[] = [
  { name: E140_TABLE_1, rows: HRC_ROWS },
  { name: E140_TABLE_2, rows: HRB_ROWS },
];

/** Read-only copies of the embedded rows, for display and tests. */
export const HARDNESS_TABLE_1: readonly { hrc: number; hv: number; hbw: number | null; hbwInParentheses: boolean }[] = HRC_ROWS.map((r) => ({
  hrc: r.hrc!,
  hv: r.hv,
  hbw: r.hbw,
  hbwInParentheses: r.hbwOutside === true,
}));
export const HARDNESS_TABLE_2: readonly { hrb: number; hv: number; hb: number }[] = HRB_ROWS.map((r) => ({ hrb: r.hrb!, hv: r.hv, hb: r.hbw! }));

function column(row: Row, scale: HardnessScale): number | null {
  switch (scale) {
    case 'HRC':
      return row.hrc ?? null;
    case 'HRB':
      return row.hrb ?? null;
    case 'HV':
      return row.hv;
    case 'HBW':
      return row.hbw;
  }
}

interface Interpolated {
  value: number;
  /** Whether a bracketing cell lies outside the normal range (in parentheses). */
  outside: boolean;
}

/** Linear interpolation from column `from` to column `to` within one table, or null outside its rows. */
function interpolate(table: Table, value: number, from: HardnessScale, to: HardnessScale): Interpolated | null {
  const pairs = table.rows
    .map((row) => ({ x: column(row, from), y: column(row, to), outside: row.hbwOutside === true && (from === 'HBW' || to === 'HBW') }))
    .filter((p): p is { x: number; y: number; outside: boolean } => p.x !== null && p.y !== null)
    .sort((a, b) => a.x - b.x);
  if (pairs.length === 0) return null;
  const first = pairs[0]!;
  const last = pairs[pairs.length - 1]!;
  if (value < first.x || value > last.x) return null;
  for (let i = 0; i < pairs.length; i++) {
    const p = pairs[i]!;
    if (value === p.x) return { value: p.y, outside: p.outside };
    const q = pairs[i + 1];
    if (q && value > p.x && value < q.x) {
      const t = (value - p.x) / (q.x - p.x);
      return { value: p.y + t * (q.y - p.y), outside: p.outside || q.outside };
    }
  }
  return null;
}

export type HardnessConversion =
  | {
      ok: true;
      /** Converted value on the target scale (unrounded; round Rockwell values to whole numbers for display). */
      value: number;
      scale: HardnessScale;
      /** True when the value comes from a cell in parentheses (outside the scale's normal range). */
      outsideNormalRange: boolean;
      /** Table used, e.g. "ASTM E140, Table 1". */
      source: string;
      caveats: readonly string[];
    }
  | {
      ok: false;
      /** False when conversion does not apply to the material at all (keep the measured scale). */
      applies: boolean;
      /** Plain words: why no value is given. */
      reason: string;
    };

/** Whether the steel tables apply to a group, and if not, why. */
export function conversionApplies(group: MaterialGroup): { applies: true } | { applies: false; reason: string } {
  if (CONVERTIBLE_GROUPS.includes(group)) return { applies: true };
  return {
    applies: false,
    // Own keys only: an inherited name ("__proto__", "constructor") is not a reason.
    reason:
      (Object.hasOwn(NOT_CONVERTIBLE, group) ? NOT_CONVERTIBLE[group] : undefined) ??
      'Kerfbook includes only the conversion tables for non-austenitic steels (ASTM E140, Tables 1 and 2); the standard has tables for some other materials, which Kerfbook does not include, so this material keeps its measured scale.',
  };
}

/**
 * Convert `value` on scale `from` to scale `to` for a material of `group` (default: a
 * non-austenitic steel). Uses one table where both scales are in it (Table 1 first); HRC ↔
 * HRB goes through HV where the tables overlap. Refuses values outside the embedded rows.
 */
export function convertHardness(value: number, from: HardnessScale, to: HardnessScale, group: MaterialGroup = 'plain-low-alloy-steel'): HardnessConversion {
  const applies = conversionApplies(group);
  if (!applies.applies) return { ok: false, applies: false, reason: applies.reason };
  if (!Number.isFinite(value)) return { ok: false, applies: true, reason: 'The hardness is not a number.' };
  if (from === to) return { ok: true, value, scale: to, outsideNormalRange: false, source: 'measured', caveats: HARDNESS_CAVEATS };
  for (const table of TABLES) {
    const hit = interpolate(table, value, from, to);
    if (hit) return { ok: true, value: hit.value, scale: to, outsideNormalRange: hit.outside, source: table.name, caveats: HARDNESS_CAVEATS };
  }
  // Via HV across the two tables (only where they overlap, about 238–240 HV).
  for (const a of TABLES) {
    const hv = interpolate(a, value, from, 'HV');
    if (!hv) continue;
    for (const b of TABLES) {
      if (b === a) continue;
      const hit = interpolate(b, hv.value, 'HV', to);
      if (hit)
        return {
          ok: true,
          value: hit.value,
          scale: to,
          outsideNormalRange: hv.outside || hit.outside,
          source: `${a.name} and ${b.name}`,
          caveats: HARDNESS_CAVEATS,
        };
    }
  }
  return { ok: false, applies: true, reason: `${value} ${from} is outside the conversion table's range for ${to}; no value is given (never extrapolated).` };
}

/**
 * Hardness in HV for the library's filter: the value itself for HV, otherwise the steel
 * conversion, or null outside the table.
 */
export function toHv(value: number, scale: HardnessScale): number | null {
  if (scale === 'HV') return value;
  const result = convertHardness(value, scale, 'HV');
  return result.ok ? result.value : null;
}

/** Whole numbers for Rockwell, whole numbers for HV and HBW too (the tables' resolution). */
export function roundHardness(value: number): number {
  return Math.round(value);
}

/** Display text: the value with its scale, in parentheses when outside the normal range, e.g. "(654) HBW". */
export function formatHardness(value: number, scale: HardnessScale, outsideNormalRange = false): string {
  const n = String(roundHardness(value));
  return `${outsideNormalRange ? `(${n})` : n} ${scale}`;
}

/** "353 HBW (38 HRC)": the measured value first, the converted one in parentheses; the measured value alone when no conversion applies. */
export function formatMeasuredWithConverted(measured: HardnessValue, to: HardnessScale, group: MaterialGroup = 'plain-low-alloy-steel'): string {
  const base = `${measured.value} ${measured.scale}`;
  if (measured.scale === to) return base;
  const c = convertHardness(measured.value, measured.scale, to, group);
  return c.ok ? `${base} (${roundHardness(c.value)} ${to})` : base;
}
