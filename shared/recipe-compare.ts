/**
 * Comparing two versions of a recipe (the Compare and Review screens): the parameters
 * that changed, in plain words with units (stock shown by name), and word-level diffs of
 * the text fields. Pure: the caller supplies the names of the referenced stock.
 */
import { diffLines, diffWordsWithSpace } from 'diff';
import type { UnitPreference } from './api-types';
import type { ParameterChange, RecipeComparison, TextChange } from './recipe-types';
import type { RecipeContent } from './schemas/recipe';
import { formatMotionSetting, MOTION_SETTING_UNITS } from './motion-settings';
import { formatQuantity, NO_VALUE, type QuantityKind } from './units';
import {
  CLAMPING_METHOD_LABELS,
  COOLANT_TYPE_LABELS,
  CUT_MOTION_LABELS,
  CUT_ORIENTATION_LABELS,
  MATERIAL_GROUP_LABELS,
  MOTION_SETTING_LABELS,
  MOTION_SETTINGS,
  SHAPE_LABELS,
  WHEEL_PATH_LABELS,
} from './vocabulary';

/** One side of the comparison. */
export interface ComparedVersion {
  version: number;
  status: string;
  title: string;
  content: RecipeContent;
}

/** Names of the stock records the versions refer to, by id (archived ones included). */
export interface StockNames {
  materials: ReadonlyMap<number, string>;
  wheels: ReadonlyMap<number, string>;
  machines: ReadonlyMap<number, string>;
}

export type VersionComparison = Omit<RecipeComparison, 'recipeId' | 'number'>;

type Formatter = (value: unknown, names: StockNames, pref: UnitPreference) => string;

const yesNo: Formatter = (v) => (v === true ? 'Yes' : v === false ? 'No' : NO_VALUE);
/**
 * Any stored value as text without calling its own toString: a corrupted row may hold an
 * object whose "toString" key is not a function, and String() would throw on it.
 */
function textOf(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'string') return v;
  if (typeof v === 'number' || typeof v === 'boolean' || typeof v === 'bigint') return String(v);
  try {
    return JSON.stringify(v) ?? '';
  } catch {
    return '(unreadable value)';
  }
}

const plain: Formatter = (v) => (v === null || v === undefined || v === '' ? NO_VALUE : textOf(v));
const quantity =
  (kind: QuantityKind): Formatter =>
  (v, _names, pref) =>
    formatQuantity(v as number | null, kind, pref);
const withUnit =
  (unit: string): Formatter =>
  (v) =>
    typeof v === 'number' ? `${v} ${unit}` : NO_VALUE;
const label =
  <K extends string>(labels: Record<K, string>, none = NO_VALUE): Formatter =>
  (v) =>
    v === null || v === undefined ? none : typeof v === 'string' ? (labels[v as K] ?? v) : textOf(v);
const stock =
  (pick: (n: StockNames) => ReadonlyMap<number, string>, none = NO_VALUE): Formatter =>
  (v, names) =>
    typeof v === 'number' ? (pick(names).get(v) ?? `#${v} (unknown)`) : none;

interface ParameterField {
  path: string;
  label: string;
  format: Formatter;
  /** The unit of a raw number, for when two close values round to the same display text. */
  unit?: string;
}

/**
 * Every parameter of recipeContent, in the editor's order, with its plain-words label.
 * The hardness window is one parameter ("170–230 HV"), not three. Text fields are compared
 * word by word instead (TEXT_FIELDS).
 */
export const PARAMETER_FIELDS: readonly ParameterField[] = [
  { path: 'scope.materialId', label: 'Material', format: stock((n) => n.materials, 'Any in the group') },
  { path: 'scope.group', label: 'Material group', format: label(MATERIAL_GROUP_LABELS) },
  {
    path: 'scope.hardness',
    label: 'Hardness window',
    format: (v) => {
      const w = v as { min: number; max: number; scale: string } | null;
      return w ? `${textOf(w.min)}–${textOf(w.max)} ${textOf(w.scale)}` : 'Not limited';
    },
  },
  { path: 'scope.shape', label: 'Shape', format: label(SHAPE_LABELS) },
  { path: 'scope.sizeMinMm', label: 'Smallest size', format: quantity('length'), unit: 'mm' },
  { path: 'scope.sizeMaxMm', label: 'Largest size', format: quantity('length'), unit: 'mm' },
  { path: 'scope.widthMm', label: 'Width', format: quantity('length'), unit: 'mm' },
  { path: 'scope.wallMm', label: 'Wall thickness', format: quantity('length'), unit: 'mm' },
  { path: 'scope.orientation', label: 'Cut orientation', format: label(CUT_ORIENTATION_LABELS) },
  { path: 'scope.orientationNote', label: 'Orientation note', format: plain },
  { path: 'cutting.machineId', label: 'Machine', format: stock((n) => n.machines) },
  { path: 'cutting.wheelId', label: 'Wheel', format: stock((n) => n.wheels) },
  { path: 'cutting.wheelRpm', label: 'Wheel speed', format: quantity('rpm'), unit: 'rpm' },
  { path: 'cutting.feedMmS', label: 'Feed', format: quantity('feed'), unit: 'mm/s' },
  { path: 'cutting.entryFeedMmS', label: 'Entry feed', format: quantity('feed'), unit: 'mm/s' },
  { path: 'cutting.entryLengthMm', label: 'Entry length', format: quantity('length'), unit: 'mm' },
  { path: 'cutting.cutMotion', label: 'Cut motion', format: label(CUT_MOTION_LABELS) },
  { path: 'cutting.passes', label: 'Passes', format: (v) => (typeof v === 'number' ? String(v) : 'Single cut') },
  // The cut motion's settings; content stored before they existed has no keys: "not given".
  ...MOTION_SETTINGS.map((key): ParameterField => ({
    path: `cutting.${key}`,
    label: MOTION_SETTING_LABELS[key],
    format: (v, _names, pref) => (typeof v === 'number' ? formatMotionSetting(key, v, pref) : 'Not given'),
    unit: MOTION_SETTING_UNITS[key],
  })),
  { path: 'clamping.method', label: 'Clamping method', format: label(CLAMPING_METHOD_LABELS, 'None chosen') },
  { path: 'clamping.bothSides', label: 'Clamped on both sides of the cut', format: yesNo },
  { path: 'clamping.softInserts', label: 'Soft inserts', format: yesNo },
  { path: 'clamping.supportBlocks', label: 'Support blocks', format: yesNo },
  // Content stored before the field existed has no key: compared as null, "not given".
  { path: 'clamping.wheelPath', label: 'Wheel path through a coating', format: label(WHEEL_PATH_LABELS, 'Not given') },
  { path: 'coolant.type', label: 'Coolant', format: label(COOLANT_TYPE_LABELS) },
  { path: 'coolant.concentrationPct', label: 'Coolant concentration', format: withUnit('% v/v') },
  { path: 'coolant.flowLMin', label: 'Coolant flow', format: withUnit('L/min') },
];

/** The free-text fields, compared word by word. `title` is the version's title, beside the content. */
export const TEXT_FIELDS: readonly { path: string; label: string }[] = [
  { path: 'title', label: 'Title' },
  { path: 'clamping.placement', label: 'Clamp placement' },
  { path: 'clamping.orientationRule', label: 'Orientation rule' },
  { path: 'instructionsMd', label: 'Instructions' },
  { path: 'acceptanceMd', label: 'Acceptance criteria' },
  { path: 'cautionsMd', label: 'Cautions' },
  { path: 'changeReason', label: 'Change reason' },
];

function at(source: unknown, path: string): unknown {
  let value = source;
  for (const key of path.split('.')) value = value !== null && typeof value === 'object' ? (value as Record<string, unknown>)[key] : undefined;
  return value;
}

/** Stable text of a value for "did it change": key order in objects does not count. */
function same(a: unknown, b: unknown): boolean {
  const norm = (v: unknown): unknown =>
    Array.isArray(v)
      ? v.map(norm)
      : v !== null && typeof v === 'object'
        ? Object.fromEntries(
            Object.keys(v)
              .sort()
              .map((k) => [k, norm((v as Record<string, unknown>)[k])]),
          )
        : (v ?? null);
  return JSON.stringify(norm(a)) === JSON.stringify(norm(b));
}

/** Every leaf path of a content object (objects walked, arrays and the hardness window kept whole). */
export function contentLeafPaths(content: unknown, prefix = ''): string[] {
  if (content === null || typeof content !== 'object' || Array.isArray(content) || prefix === 'scope.hardness') return [prefix];
  return Object.keys(content).flatMap((key) => contentLeafPaths((content as Record<string, unknown>)[key], prefix ? `${prefix}.${key}` : key));
}

const KNOWN_PATHS = new Set([...PARAMETER_FIELDS.map((f) => f.path), ...TEXT_FIELDS.map((f) => f.path)]);

/** How two texts are diffed: wordDiff, or a caller's memo of it (the server keeps recent ones). */
export type TextDiff = (before: string, after: string) => TextChange['parts'];

export function compareVersions(
  a: ComparedVersion,
  b: ComparedVersion,
  names: StockNames,
  pref: UnitPreference,
  diffText: TextDiff = wordDiff,
): VersionComparison {
  const parameters: ParameterChange[] = [];
  for (const field of PARAMETER_FIELDS) {
    const before = at(a.content, field.path);
    const after = at(b.content, field.path);
    if (same(before, after)) continue;
    let shownBefore = field.format(before, names, pref);
    let shownAfter = field.format(after, names, pref);
    // Two values that round to the same text (0.301 and 0.304 mm/s): show them unrounded.
    if (shownBefore === shownAfter && field.unit && typeof before === 'number' && typeof after === 'number') {
      shownBefore = `${before} ${field.unit}`;
      shownAfter = `${after} ${field.unit}`;
    }
    parameters.push({ path: field.path, label: field.label, before: shownBefore, after: shownAfter });
  }
  // A field added to the content schema but not to the tables above still shows, by its path.
  const extra = new Set([...contentLeafPaths(a.content), ...contentLeafPaths(b.content)].filter((p) => p && !KNOWN_PATHS.has(p)));
  for (const path of extra) {
    const before = at(a.content, path);
    const after = at(b.content, path);
    if (!same(before, after))
      parameters.push({
        path,
        label: path,
        before: plain(JSON.stringify(before ?? null), names, pref),
        after: plain(JSON.stringify(after ?? null), names, pref),
      });
  }

  const texts: TextChange[] = [];
  for (const field of TEXT_FIELDS) {
    const before = textOf(field.path === 'title' ? a.title : at(a.content, field.path));
    const after = textOf(field.path === 'title' ? b.title : at(b.content, field.path));
    if (before === after) continue;
    texts.push({ path: field.path, label: field.label, parts: diffText(before, after) });
  }

  return {
    from: { version: a.version, status: a.status, title: a.title },
    to: { version: b.version, status: b.status, title: b.title },
    parameters,
    texts,
  };
}

type TextPart = TextChange['parts'][number];

/**
 * Word-level differences, narrowed line by line first: a word diff of the whole text is
 * O(N·D) over words and took ~0.4 s for two 20,000-character instructions (npm run bench);
 * diffing lines first and words only inside each changed block of lines gives the same kind
 * of parts (unchanged + removed = before, unchanged + added = after) in a few milliseconds.
 */
export function wordDiff(before: string, after: string): TextPart[] {
  const parts: TextPart[] = [];
  const push = (value: string, added: boolean, removed: boolean) => {
    if (!value) return;
    const last = parts[parts.length - 1];
    if (last && Boolean(last.added) === added && Boolean(last.removed) === removed) last.value += value;
    else parts.push({ value, ...(added ? { added: true } : {}), ...(removed ? { removed: true } : {}) });
  };
  const lines = diffLines(before, after);
  for (let i = 0; i < lines.length; i++) {
    if (!lines[i]!.added && !lines[i]!.removed) {
      push(lines[i]!.value, false, false);
      continue;
    }
    // A run of removed and added lines is one changed block: its words are diffed together.
    let removed = '';
    let added = '';
    for (; i < lines.length && (lines[i]!.added || lines[i]!.removed); i++) {
      if (lines[i]!.added) added += lines[i]!.value;
      else removed += lines[i]!.value;
    }
    i--;
    const words = diffWordsWithSpace(removed, added, { maxEditLength: WORD_EDITS_MAX });
    if (!words) {
      // Rewritten rather than edited: the block reads better (and is found far faster) whole.
      push(removed, false, true);
      push(added, true, false);
      continue;
    }
    for (const c of words) push(c.value, Boolean(c.added), Boolean(c.removed));
  }
  return parts;
}

/**
 * Above this many word edits in one changed block of lines the block is shown as removed
 * and added whole: interleaved fragments of two different sentences help nobody, and the
 * word diff's cost grows with the number of edits (~1 ms per rewritten line).
 */
const WORD_EDITS_MAX = 40;
