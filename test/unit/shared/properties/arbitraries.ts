/**
 * Generators for the property specs of shared/: hostile values (anything an API body, a
 * query string, a form control or a stored JSON column can hold) and valid stock, content
 * and contexts built on the example specs' fixtures.
 */
import fc from 'fast-check';
import type { RecipeContext } from '../../../../shared/recipe-context';
import type { RecipeContent } from '../../../../shared/schemas/recipe';
import type { HardnessWindow } from '../../../../shared/schemas/stock';
import type { FeedCeiling } from '../../../../shared/schemas/lab-settings';
import type { LabLimits, MachineRecord, MaterialRecord, SelectionRowWheel, WheelRecord } from '../../../../shared/stock-types';
import {
  CLAMPING_METHODS,
  COOLANT_TYPES,
  CUT_MOTIONS,
  CUT_ORIENTATIONS,
  FEED_DIRECTIONS,
  HARDNESS_SCALES,
  MACHINE_CLASSES,
  MATERIAL_GROUPS,
  SHAPES,
  WHEEL_KINDS,
  WHEEL_PATHS,
} from '../../../../shared/vocabulary';
import { CONVENTIONAL_BONDS } from '../../../../shared/wheel-spec';
import { content, machine, material, wheel } from '../fixtures';

/** Runs per property: enough to find edge cases, small enough for the whole folder to stay well under 30 s on 2 shared cores. */
export const RUNS = 300;
/** For the properties that build a whole recipe, run the checks or diff texts (each run costs more). */
export const RUNS_HEAVY = 150;

/** Numbers that break naive arithmetic: NaN, ±∞, −0, the extremes and the smallest subnormal. */
export const oddNumber = fc.constantFrom(
  NaN,
  Infinity,
  -Infinity,
  -0,
  0,
  Number.MAX_VALUE,
  -Number.MAX_VALUE,
  Number.MIN_VALUE,
  Number.MAX_SAFE_INTEGER,
  -1,
  1e21,
  -1e21,
);

/** Any double, including NaN, ±∞, −0, huge and negative. */
export const anyNumber = fc.oneof(fc.double(), oddNumber);

/** Text with astral characters, combining marks, controls, RTL marks and the empty string. */
export const oddText = fc.oneof(
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.constantFrom('', ' ', '\u0000', '\u200b', '\u202e', '\ud800', 'e\u0301', '𝟘𝟙', '\uFEFF', '__proto__', 'constructor', 'toString', '-', '1e999', 'NaN'),
);

/** Any primitive that can arrive from outside: null, undefined, booleans, any number, odd text. */
export const outsidePrimitive: fc.Arbitrary<unknown> = fc.oneof(oddNumber, fc.double(), oddText, fc.constantFrom(null, undefined, true, false));

/**
 * Any value that can arrive from outside (JSON body, query string, form control, stored
 * JSON): JSON values with odd keys ("__proto__", "toString") and strings, plus undefined
 * and the odd numbers.
 */
export const outsideValue: fc.Arbitrary<unknown> = fc.oneof(
  { maxDepth: 3 },
  oddNumber,
  oddText,
  fc.constant(undefined),
  fc.jsonValue({ maxDepth: 3 }),
  fc.dictionary(oddText, fc.jsonValue({ maxDepth: 2 }), { maxKeys: 5, noNullPrototype: true }),
);

/**
 * Anything JavaScript has, for the zod schemas (the gate every outside value goes through):
 * bigint, boxed values, null-prototype objects, sparse and typed arrays, dates, maps, sets.
 */
export const anyValue: fc.Arbitrary<unknown> = fc.anything({
  maxDepth: 3,
  maxKeys: 6,
  withBigInt: true,
  withBoxedValues: true,
  withDate: true,
  withMap: true,
  withSet: true,
  withNullPrototype: true,
  withObjectString: true,
  withSparseArray: true,
  withTypedArray: true,
  withUnicodeString: true,
});

/** A value of a list, or null (a select not chosen yet). */
export const orNull = <T>(arb: fc.Arbitrary<T>): fc.Arbitrary<T | null> => fc.option(arb, { nil: null, freq: 4 });

/** A finite number in [min, max] (no NaN, no ∞). */
export const finite = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
/** A finite number in (min, max], down to the smallest subnormal above min (the schemas' "more than" bounds). */
export const above = (min: number, max: number) => finite(min, max).filter((n) => n > min);
/**
 * A number a lab could type, from `min` to `max`: for the mathematical properties, which
 * floating point cannot keep below about 1e-300 (5e-324 mm halved is 0). The finiteness and
 * no-throw properties use `above` and the odd numbers instead.
 */
export const realistic = (min: number, max: number) => finite(min, max);

export const group = fc.constantFrom(...MATERIAL_GROUPS);
export const scale = fc.constantFrom(...HARDNESS_SCALES);
export const motion = fc.constantFrom(...CUT_MOTIONS);
export const shape = fc.constantFrom(...SHAPES);
export const feedDirection = fc.constantFrom(...FEED_DIRECTIONS);

/** Wheel markings that parse: conventional (A60K5V, C46KBF) and superabrasive (D126M, CB151N100B). */
export const validMarking = fc.oneof(
  fc
    .tuple(
      fc.constantFrom('A', 'C'),
      fc.integer({ min: 1, max: 9999 }),
      fc.constantFrom(...'ABCDEFGHIJKLMNOPQRSTUVWXYZ'),
      fc.option(fc.integer({ min: 0, max: 99 }), { nil: null }),
      fc.constantFrom(...CONVENTIONAL_BONDS),
    )
    .map(([a, grit, grade, structure, bond]) => `${a}${grit}${grade}${structure ?? ''}${bond}`),
  fc
    .tuple(
      fc.constantFrom('D', 'B', 'CB'),
      fc.integer({ min: 1, max: 9999 }),
      fc.option(fc.constantFrom(...'ABCDEFGHIJKLMNOPQRSTUVWXYZ'), { nil: null }),
      fc.integer({ min: 10, max: 999 }),
      fc.boolean(),
      fc.constantFrom('B', 'M', 'V', 'G'),
    )
    .map(([a, grit, grade, conc, withConc, bond]) => `${a}${grit}${grade ?? ''}${grade && withConc ? conc : ''}${bond}`),
);

/** A hardness window inside the schema's limits (min ≤ max). */
export const hardnessWindow: fc.Arbitrary<HardnessWindow> = fc
  .tuple(above(0, 3000), above(0, 3000), scale)
  .map(([a, b, s]) => ({ min: Math.min(a, b), max: Math.max(a, b), scale: s }));

/**
 * A stored wheel as wheelBody allows it (diameter over 10 to 1000 mm, over 0.05 to 20 mm
 * thick, over 1 to 200 m/s), with or without its own smallest usable diameter (over 10 mm,
 * below the new diameter).
 */
export const validWheel: fc.Arbitrary<WheelRecord> = fc
  .record({
    kind: fc.constantFrom(...WHEEL_KINDS),
    specification: validMarking,
    diameterMm: above(10, 1000),
    thicknessMm: above(0.05, 20),
    maxSpeedMs: above(1, 200),
    dryAllowed: fc.boolean(),
    archived: fc.boolean(),
    minUsableShare: orNull(finite(0, 0.999)),
  })
  .map(({ minUsableShare, ...over }) => {
    const own = minUsableShare === null ? null : 10 + minUsableShare * (over.diameterMm - 10);
    return wheel({ ...over, minUsableDiameterMm: own !== null && own > 10 && own < over.diameterMm ? own : null });
  });

/** A stored machine as machineBody allows it (ordered ranges, flange below the largest wheel). */
export const validMachine: fc.Arbitrary<MachineRecord> = fc
  .record({
    machineClass: fc.constantFrom(...MACHINE_CLASSES),
    wheels: fc.tuple(above(10, 1000), above(10, 1000)),
    flangeShare: finite(0.01, 0.99),
    rpm: fc.tuple(above(1, 30000), above(1, 30000)),
    feed: fc.tuple(above(0, 50), above(0, 50)),
    cutMotions: fc.subarray([...CUT_MOTIONS], { minLength: 1 }),
    clampingMethods: fc.subarray([...CLAMPING_METHODS], { minLength: 1 }),
    feedDirection,
    spindleLimitShare: orNull(finite(0, 1)),
    motorPowerKw: orNull(above(0.01, 500)),
    archived: fc.boolean(),
  })
  .map(({ wheels: [w1, w2], flangeShare, rpm: [r1, r2], feed: [f1, f2], spindleLimitShare, ...rest }) => {
    const wheelDiameterMaxMm = Math.max(w1, w2);
    const rpmMax = Math.max(r1, r2);
    // A limit over 1 rpm, at most the top speed (the schema's window).
    const limit = spindleLimitShare === null ? null : spindleLimitShare * rpmMax;
    const spindleLimitRpm = limit !== null && limit > 1 ? limit : null;
    return machine({
      ...rest,
      spindleLimitRpm,
      spindleLimitSetBy: spindleLimitRpm === null ? '' : 'Maintenance',
      wheelDiameterMinMm: Math.min(w1, w2),
      wheelDiameterMaxMm,
      flangeDiameterMm: Math.max(5, Math.min(500, flangeShare * wheelDiameterMaxMm)),
      rpmMin: Math.min(r1, r2),
      rpmMax,
      feedMinMmS: Math.min(f1, f2),
      feedMaxMmS: Math.max(f1, f2),
    });
  })
  .filter((m) => m.flangeDiameterMm > 5 && m.flangeDiameterMm < m.wheelDiameterMaxMm);

/** A stored material as materialBody allows it. */
export const validMaterial: fc.Arbitrary<MaterialRecord> = fc
  .record({
    group,
    hardness: orNull(fc.record({ value: above(0, 3000), scale })),
    coated: fc.boolean(),
    coatingHardness: orNull(fc.record({ value: above(0, 3000), scale })),
    caseHardened: fc.boolean(),
    caseDepthMm: above(0, 20),
    heatSensitive: fc.boolean(),
    hazardousDust: fc.boolean(),
    archived: fc.boolean(),
  })
  .map(({ caseDepthMm, coatingHardness, ...over }) =>
    material({ ...over, caseDepthMm: over.caseHardened ? caseDepthMm : null, coatingHardness: over.coated ? coatingHardness : null }),
  );

/** Content that recipeContent accepts: every combination of shape, motion, coolant and the number ranges. */
export const validContent: fc.Arbitrary<RecipeContent> = fc
  .record({
    group,
    hardness: orNull(hardnessWindow),
    shape,
    sizes: fc.tuple(above(0, 2000), above(0, 2000)),
    widthMm: above(0, 2000),
    wallShare: finite(0.001, 0.499),
    orientation: fc.constantFrom(...CUT_ORIENTATIONS),
    wheelRpm: above(0, 30000),
    feedMmS: above(0, 50),
    entryFeedMmS: orNull(above(0, 50)),
    entryLengthMm: orNull(above(0, 500)),
    cutMotion: motion,
    passes: orNull(fc.integer({ min: 1, max: 500 })),
    // The cut motion's settings, each given or not, whichever motion is chosen (the form sends only the chosen motion's).
    motionSettings: fc.record({
      pulseAdvanceMm: orNull(above(0, 50)),
      pulseRetractMm: orNull(fc.oneof(fc.constant(0), finite(0, 50))),
      pulseFeedS: orNull(above(0, 600)),
      pulsePauseS: orNull(above(0, 600)),
      rockingAngleDeg: orNull(above(0, 90)),
      rockingStrokeMm: orNull(above(0, 1000)),
      specimenRpm: orNull(above(0, 1000)),
      depthPerPassMm: orNull(above(0, 500)),
      stepDepthMm: orNull(above(0, 2000)),
    }),
    method: orNull(fc.constantFrom(...CLAMPING_METHODS)),
    bothSides: fc.boolean(),
    orientationRule: fc.string({ maxLength: 30 }),
    wheelPath: orNull(fc.constantFrom(...WHEEL_PATHS)),
    coolant: fc.constantFrom(...COOLANT_TYPES),
    concentrationPct: above(0, 100),
    // 0 L/min is valid content (the checks say what it means).
    flowLMin: orNull(fc.oneof(fc.constant(0), finite(0, 200))),
  })
  .map((r) => {
    const sizeMinMm = Math.min(...r.sizes);
    const wall = Math.min(500, r.wallShare * sizeMinMm);
    return content({
      scope: {
        group: r.group,
        hardness: r.hardness,
        shape: r.shape,
        sizeMinMm,
        sizeMaxMm: Math.max(...r.sizes),
        widthMm: r.shape === 'rectangular' ? r.widthMm : null,
        wallMm: r.shape === 'tube' ? wall : null,
        orientation: r.orientation,
      },
      cutting: {
        wheelRpm: r.wheelRpm,
        feedMmS: r.feedMmS,
        entryFeedMmS: r.entryFeedMmS,
        entryLengthMm: r.entryLengthMm,
        cutMotion: r.cutMotion,
        passes: r.passes,
        ...r.motionSettings,
      },
      clamping: { method: r.method, bothSides: r.bothSides, orientationRule: r.orientationRule.trim(), wheelPath: r.wheelPath },
      coolant: {
        type: r.coolant,
        concentrationPct: r.coolant === 'water-soluble' ? r.concentrationPct : null,
        flowLMin: r.coolant === 'dry' ? null : r.flowLMin,
      },
    });
  })
  .filter((c) => c.scope.shape !== 'tube' || (c.scope.wallMm! > 0 && 2 * c.scope.wallMm! < c.scope.sizeMinMm));

/** A plunge-feed ceiling as the settings schema allows it. */
export const validFeedCeiling: fc.Arbitrary<FeedCeiling> = fc.record({
  group,
  hardness: orNull(hardnessWindow),
  machineClass: fc.constantFrom(...MACHINE_CLASSES),
  maxFeedMmS: above(0, 50),
});

/** The lab's limits as getLabLimits hands them over (validated), possibly empty. */
export const validLimits: fc.Arbitrary<LabLimits> = fc.record({
  feedCeilings: fc.array(validFeedCeiling, { maxLength: 8 }),
  traverseRemovalCeilings: fc.dictionary(group, above(0, 10000), { maxKeys: 4 }),
  longContactMm: orNull(above(0, 2000)),
  // A share a lab would set (a wheel worn to a tenth or to almost nothing is not one), any allowance from 0 to 2 mm.
  wornDiameterShare: finite(0.1, 0.99),
  kerfAllowanceMm: finite(0, 2),
  specificEnergyJMm3: fc.dictionary(group, above(0, 1000), { maxKeys: 6 }),
  powerWarningPct: above(0, 200),
});

/** Selection-table rows with their wheel (markings that parse, and now and then one that does not). */
export const validSelectionRows: fc.Arbitrary<SelectionRowWheel[]> = fc.array(
  fc.record({
    id: fc.integer({ min: 1, max: 1000 }),
    group,
    hardness: orNull(hardnessWindow),
    wheelId: fc.integer({ min: 1, max: 1000 }),
    note: fc.constant(''),
    wheel: fc.record({
      kind: fc.constantFrom(...WHEEL_KINDS),
      specification: fc.oneof({ weight: 5, arbitrary: validMarking }, { weight: 1, arbitrary: oddText }),
    }),
  }),
  { maxLength: 8 },
);

/** A context with valid stock, any of which may be missing (a draft not finished yet). */
export const validContext: fc.Arbitrary<RecipeContext> = fc.record({
  material: orNull(validMaterial),
  wheel: orNull(validWheel),
  machine: orNull(validMachine),
  limits: validLimits,
  selectionRows: validSelectionRows,
});

/** Dotted paths of the content's number and text leaves. */
const NUMBER_AND_TEXT_LEAVES = [
  'scope.materialId',
  'scope.sizeMinMm',
  'scope.sizeMaxMm',
  'scope.widthMm',
  'scope.wallMm',
  'scope.orientationNote',
  'cutting.machineId',
  'cutting.wheelId',
  'cutting.wheelRpm',
  'cutting.feedMmS',
  'cutting.entryFeedMmS',
  'cutting.entryLengthMm',
  'cutting.passes',
  'cutting.pulseAdvanceMm',
  'cutting.pulseRetractMm',
  'cutting.pulseFeedS',
  'cutting.pulsePauseS',
  'cutting.rockingAngleDeg',
  'cutting.rockingStrokeMm',
  'cutting.specimenRpm',
  'cutting.depthPerPassMm',
  'cutting.stepDepthMm',
  'clamping.placement',
  'clamping.orientationRule',
  'coolant.concentrationPct',
  'coolant.flowLMin',
  'instructionsMd',
  'acceptanceMd',
  'cautionsMd',
  'changeReason',
] as const;

/** Dotted paths of the content's choices (selects and the hardness window). */
const CHOICE_LEAVES = [
  'scope.group',
  'scope.hardness',
  'scope.shape',
  'scope.orientation',
  'cutting.cutMotion',
  'clamping.method',
  'clamping.wheelPath',
  'coolant.type',
] as const;

/**
 * Half-typed content, as the editor's form hands it over on every keystroke: the structure
 * of recipeContent with every number or text leaf replaced, at random, by an outside value
 * (null, NaN, ∞, a string, an object) and every choice possibly not made yet (null).
 */
export const halfTyped = (leaf: fc.Arbitrary<unknown>): fc.Arbitrary<RecipeContent> =>
  fc
    .tuple(
      validContent,
      fc.dictionary(fc.constantFrom(...NUMBER_AND_TEXT_LEAVES), leaf, { maxKeys: 8 }),
      fc.subarray([...CHOICE_LEAVES]),
      // The window's inputs while its checkbox is ticked but the numbers are not typed yet.
      fc.option(fc.record({ min: leaf, max: leaf, scale: orNull(scale) }), { nil: undefined }),
    )
    .map(([c, replaced, unchosen, halfWindow]) => {
      const out = structuredClone(c) as unknown as Record<string, Record<string, unknown>>;
      const set = (path: string, v: unknown) => {
        const [section, key] = path.split('.') as [string, string | undefined];
        if (key === undefined) (out as Record<string, unknown>)[section] = v;
        else out[section]![key] = v;
      };
      for (const [path, v] of Object.entries(replaced)) set(path, v);
      for (const path of unchosen) set(path, null);
      if (halfWindow) set('scope.hardness', halfWindow);
      return out as unknown as RecipeContent;
    });
/**
 * Valid content whose choices hold ids the vocabulary does not know (content stored under an
 * older vocabulary, or a hand-edited row): "x", "", "__proto__", "constructor", odd unicode.
 */
export const staleChoiceContent: fc.Arbitrary<RecipeContent> = fc
  .tuple(validContent, fc.dictionary(fc.constantFrom(...CHOICE_LEAVES.filter((p) => p !== 'scope.hardness')), oddText, { minKeys: 1, maxKeys: 4 }))
  .map(([c, stale]) => {
    const out = structuredClone(c) as unknown as Record<string, Record<string, unknown>>;
    for (const [path, v] of Object.entries(stale)) {
      const [section, key] = path.split('.') as [string, string];
      out[section]![key] = v;
    }
    return out as unknown as RecipeContent;
  });
export const halfTypedContent = halfTyped(outsideValue);
/** The same with primitive leaves only (what a form control can hold: null, numbers, text). */
export const halfTypedPrimitiveContent = halfTyped(outsidePrimitive);

/** Every number in a computed result, with its path (to say which one is not finite). */
export function numbersIn(value: unknown, path = ''): [string, number][] {
  if (typeof value === 'number') return [[path, value]];
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([k, v]) => numbersIn(v, path ? `${path}.${k}` : k));
}
