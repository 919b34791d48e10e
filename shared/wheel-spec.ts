/**
 * Wheel marking parser, after ISO 525 / ANSI B74.13 for conventional wheels and the usual
 * superabrasive marking for diamond and cBN wheels (common practice).
 *
 * Conventional: abrasive (A aluminium oxide, C silicon carbide) · grit · grade (A soft … Z
 * hard) · structure (optional) · bond. Bond designations of ISO 525 (all from memory, to
 * check against a licensed copy): V vitrified, B resinoid, BF fibre-reinforced resinoid,
 * R rubber, RF reinforced rubber, E shellac, MG magnesite, PL plastic; also S silicate
 * (ANSI B74.13, from memory) and M metal (from memory). Cut-off wheels are mostly B, BF,
 * R or RF (common practice).
 * `A60K5V` and `A60KV` are both valid.
 *
 * Superabrasive: abrasive (D diamond; B or CB cubic boron nitride) · grit · grade
 * (optional) · concentration (optional, only after a grade) · bond (B resin, M metal,
 * V vitrified, G electroplated). E.g. `D126M`, `B151N100B`. Spaces and hyphens are ignored,
 * letters are read as capitals.
 */

export const CONVENTIONAL_BONDS = ['V', 'B', 'BF', 'R', 'RF', 'E', 'MG', 'PL', 'M', 'S'] as const;
export type ConventionalBond = (typeof CONVENTIONAL_BONDS)[number];
export const SUPERABRASIVE_BONDS = ['B', 'M', 'V', 'G'] as const;
export type SuperabrasiveBond = (typeof SUPERABRASIVE_BONDS)[number];

export const BOND_LABELS: Record<ConventionalBond | SuperabrasiveBond, string> = {
  V: 'vitrified',
  B: 'resinoid',
  BF: 'fibre-reinforced resinoid',
  R: 'rubber',
  RF: 'reinforced rubber',
  E: 'shellac',
  MG: 'magnesite',
  PL: 'plastic',
  M: 'metal',
  S: 'silicate',
  G: 'electroplated',
};

export type AbrasiveFamily = 'aluminium-oxide' | 'silicon-carbide' | 'diamond' | 'cbn';

export const ABRASIVE_FAMILY_LABELS: Record<AbrasiveFamily, string> = {
  'aluminium-oxide': 'Aluminium oxide',
  'silicon-carbide': 'Silicon carbide',
  diamond: 'Diamond',
  cbn: 'Cubic boron nitride (CBN)',
};

export interface ConventionalSpec {
  type: 'conventional';
  /** A = aluminium oxide, C = silicon carbide. */
  abrasive: 'A' | 'C';
  /** Grit number (larger = finer). */
  grit: number;
  /** Grade letter, A (soft) … Z (hard). */
  grade: string;
  /** Structure number (higher = more open, from memory), or null when not marked. */
  structure: number | null;
  bond: ConventionalBond;
  /** The marking as normalised, e.g. "A60K5V". */
  text: string;
}

export interface SuperabrasiveSpec {
  type: 'superabrasive';
  /** D = diamond, B = cubic boron nitride (also written CB). */
  abrasive: 'D' | 'B';
  /** Grit designation (for superabrasives usually the grain size in µm, e.g. 126). */
  grit: number;
  /** Grade letter, or null when not marked. */
  grade: string | null;
  /** Concentration (100 ≈ 4.4 ct/cm³, from memory), or null when not marked. */
  concentration: number | null;
  bond: SuperabrasiveBond;
  text: string;
}

export type WheelSpec = ConventionalSpec | SuperabrasiveSpec;

export type WheelSpecResult = { ok: true; spec: WheelSpec } | { ok: false; error: string };

const GRADE_MESSAGE = 'The grade must be a single letter from A (soft) to Z (hard), after the grit.';

function parseConventional(s: string): WheelSpecResult {
  const abrasive = s[0] as 'A' | 'C';
  const m = /^(\d{1,4})(.*)$/.exec(s.slice(1));
  if (!m) return { ok: false, error: 'After the abrasive letter comes the grit number, e.g. A60K5V.' };
  const grit = Number(m[1]);
  const rest = m[2]!;
  const grade = rest[0];
  if (grade === undefined || !/^[A-Z]$/.test(grade)) return { ok: false, error: GRADE_MESSAGE };
  const tail = /^(\d{1,2})?([A-Z]+)$/.exec(rest.slice(1));
  if (!tail) return { ok: false, error: 'After the grade comes an optional structure number and then the bond, e.g. A60K5V or A60KV.' };
  const bond = tail[2]!;
  if (!(CONVENTIONAL_BONDS as readonly string[]).includes(bond)) return { ok: false, error: `Unknown bond "${bond}": use ${CONVENTIONAL_BONDS.join(', ')}.` };
  const structure = tail[1] === undefined ? null : Number(tail[1]);
  const text = `${abrasive}${grit}${grade}${structure ?? ''}${bond}`;
  return { ok: true, spec: { type: 'conventional', abrasive, grit, grade, structure, bond: bond as ConventionalBond, text } };
}

function parseSuperabrasive(s: string): WheelSpecResult {
  const m = /^(D|CB|B)(\d{1,4})([A-Z])?(\d{2,3})?([A-Z])$/.exec(s);
  if (!m) return { ok: false, error: 'A diamond or CBN marking reads abrasive, grit, optional grade and concentration, then bond, e.g. D126M or B151N100B.' };
  if (m[4] !== undefined && m[3] === undefined) return { ok: false, error: 'Give the grade letter before the concentration, e.g. D126N100M.' };
  const bond = m[5]!;
  if (!(SUPERABRASIVE_BONDS as readonly string[]).includes(bond))
    return { ok: false, error: `Unknown bond "${bond}" for a diamond or CBN wheel: use B, M, V or G.` };
  const abrasive = m[1] === 'D' ? 'D' : 'B';
  const grit = Number(m[2]);
  const grade = m[3] ?? null;
  const concentration = m[4] === undefined ? null : Number(m[4]);
  const text = `${abrasive}${grit}${grade ?? ''}${concentration ?? ''}${bond}`;
  return { ok: true, spec: { type: 'superabrasive', abrasive, grit, grade, concentration, bond: bond as SuperabrasiveBond, text } };
}

/** Parse a wheel marking; returns the typed specification or a message saying what is wrong. */
export function parseWheelSpec(input: string): WheelSpecResult {
  // A value that is not text (a malformed body or stored row) is refused like an empty marking.
  const s = typeof input === 'string' ? input.replace(/[\s-]+/g, '').toUpperCase() : '';
  if (s === '') return { ok: false, error: 'Give the wheel marking, e.g. A60K5V.' };
  if (/^(D|CB|B)\d/.test(s)) return parseSuperabrasive(s);
  if (/^[AC]/.test(s)) return parseConventional(s);
  return { ok: false, error: 'The marking starts with the abrasive: A (aluminium oxide), C (silicon carbide), D (diamond) or B/CB (CBN).' };
}

/** Abrasive family of a parsed marking, or of a marking text (null when it does not parse). */
export function abrasiveFamily(spec: WheelSpec): AbrasiveFamily;
export function abrasiveFamily(spec: WheelSpec | string): AbrasiveFamily | null;
export function abrasiveFamily(spec: WheelSpec | string): AbrasiveFamily | null {
  let parsed: WheelSpec;
  if (typeof spec === 'string') {
    const r = parseWheelSpec(spec);
    if (!r.ok) return null;
    parsed = r.spec;
  } else parsed = spec;
  if (parsed.type === 'conventional') return parsed.abrasive === 'A' ? 'aluminium-oxide' : 'silicon-carbide';
  return parsed.abrasive === 'D' ? 'diamond' : 'cbn';
}

/**
 * Grade bands of a bonded wheel, Kerfbook's grouping (from memory, after the usual reading
 * of ISO 525 grades: up to K soft, L–O medium, P and up hard).
 */
export type GradeBand = 'soft' | 'medium' | 'hard';
export function gradeBand(grade: string): GradeBand {
  if (grade <= 'K') return 'soft';
  if (grade <= 'O') return 'medium';
  return 'hard';
}
