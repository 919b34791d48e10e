/**
 * Recipe content: everything a version holds. Stored
 * as canonical JSON per version, with indexed columns copied out for the library's search.
 * Every length is mm, speed rpm, feed mm/s, concentration % v/v, flow L/min.
 */
import { z } from 'zod';
import {
  CLAMPING_METHODS,
  COOLANT_TYPES,
  CUT_MOTIONS,
  CUT_ORIENTATIONS,
  MOTION_SETTING_LABELS as MS,
  type MotionSetting,
  RECIPE_STATUSES,
  SHAPES,
  WHEEL_PATHS,
} from '../vocabulary';
import { quantity, refId, requiredText, text } from './numbers';
import { hardnessWindow, materialGroup } from './stock';

export const recipeScope = z
  .strictObject({
    /** The material, or null when the recipe covers a whole group within a hardness window. */
    materialId: refId('Material').nullable(),
    /** The material group (the material's own group when a material is chosen). */
    group: materialGroup,
    hardness: hardnessWindow.nullable(),
    shape: z.enum(SHAPES, { error: 'Choose a shape.' }),
    /** Size window: the depth the wheel cuts through (diameter, or height of a rectangular section), mm. */
    sizeMinMm: quantity('Smallest size', 'mm', 0, 2000),
    sizeMaxMm: quantity('Largest size', 'mm', 0, 2000),
    /** Width of a rectangular section along the cut, mm (null for round bars and tubes). */
    widthMm: quantity('Width', 'mm', 0, 2000).nullable(),
    /** Wall thickness of a tube, mm (null otherwise). */
    wallMm: quantity('Wall thickness', 'mm', 0, 500).nullable(),
    orientation: z.enum(CUT_ORIENTATIONS, { error: 'Choose the cut orientation.' }),
    orientationNote: text('Orientation note', 200),
  })
  .refine((s) => s.sizeMinMm <= s.sizeMaxMm, { path: ['sizeMaxMm'], message: 'Largest size must not be below the smallest.' })
  .refine((s) => s.shape !== 'rectangular' || s.widthMm !== null, { path: ['widthMm'], message: 'Give the width of a rectangular section.' })
  .refine((s) => s.shape !== 'tube' || s.wallMm !== null, { path: ['wallMm'], message: 'Give the wall thickness of a tube.' })
  .refine((s) => s.shape !== 'tube' || s.wallMm === null || 2 * s.wallMm < s.sizeMinMm || s.sizeMinMm === 0, {
    path: ['wallMm'],
    message: 'The wall is too thick for the smallest diameter; use a round bar instead.',
  });
export type RecipeScope = z.infer<typeof recipeScope>;

/**
 * The settings of the cut motion (which motion uses which: CUT_MOTION_SETTINGS), each null
 * when not given. Content stored before they existed has no such keys and reads as null,
 * "not given": stored content is hashed and signed, so it is never rewritten to add them.
 */
function motionSettingsShape() {
  const setting = (key: MotionSetting, unit: string, max: number, options?: { inclusiveMin?: boolean }) =>
    quantity(MS[key], unit, 0, max, options).nullable().default(null);
  return {
    pulseAdvanceMm: setting('pulseAdvanceMm', 'mm', 50),
    /** 0: the wheel pauses in the cut without backing off. */
    pulseRetractMm: setting('pulseRetractMm', 'mm', 50, { inclusiveMin: true }),
    pulseFeedS: setting('pulseFeedS', 's', 600),
    pulsePauseS: setting('pulsePauseS', 's', 600),
    rockingAngleDeg: setting('rockingAngleDeg', '°', 90),
    rockingStrokeMm: setting('rockingStrokeMm', 'mm', 1000),
    specimenRpm: setting('specimenRpm', 'rpm', 1000),
    depthPerPassMm: setting('depthPerPassMm', 'mm', 500),
    stepDepthMm: setting('stepDepthMm', 'mm', 2000),
  } satisfies Record<MotionSetting, unknown>;
}

/** Every motion setting not given: for code that builds content (fixtures, seeds). */
export const NO_MOTION_SETTINGS: Readonly<Record<MotionSetting, null>> = {
  pulseAdvanceMm: null,
  pulseRetractMm: null,
  pulseFeedS: null,
  pulsePauseS: null,
  rockingAngleDeg: null,
  rockingStrokeMm: null,
  specimenRpm: null,
  depthPerPassMm: null,
  stepDepthMm: null,
};

export const recipeCutting = z.strictObject({
  machineId: refId('Machine'),
  wheelId: refId('Wheel'),
  wheelRpm: quantity('Wheel speed', 'rpm', 0, 30000),
  feedMmS: quantity('Feed', 'mm/s', 0, 50),
  /** Slower feed for the first millimetres of the cut, optional. */
  entryFeedMmS: quantity('Entry feed', 'mm/s', 0, 50).nullable(),
  entryLengthMm: quantity('Entry length', 'mm', 0, 500).nullable(),
  cutMotion: z.enum(CUT_MOTIONS, { error: 'Choose a cut motion.' }),
  /** Number of passes for traverse or stepped cuts; null for a single cut. */
  passes: z
    .number({ error: 'Passes must be a whole number.' })
    .int('Passes must be a whole number.')
    .min(1, 'At least one pass.')
    .max(500, 'At most 500 passes.')
    .nullable(),
  ...motionSettingsShape(),
});
export type RecipeCutting = z.infer<typeof recipeCutting>;

export const recipeClamping = z.strictObject({
  /** null while the author has not chosen one: a blocker, not a form error, so drafts can be saved. */
  method: z.enum(CLAMPING_METHODS).nullable(),
  /** Where the clamps go, e.g. "both sides of the cut, 10 mm from it". */
  placement: text('Clamp placement', 500),
  bothSides: z.boolean(),
  softInserts: z.boolean(),
  supportBlocks: z.boolean(),
  /** E.g. "the wheel enters through the coating so it is pressed onto the substrate". */
  orientationRule: text('Orientation rule', 500),
  /**
   * For a coated part: where the wheel enters and leaves. Content stored before this field
   * existed has no such key and reads as null, "not given"; the checks treat both alike.
   */
  wheelPath: z.enum(WHEEL_PATHS, { error: 'Choose where the wheel enters and leaves.' }).nullable().default(null),
});
export type RecipeClamping = z.infer<typeof recipeClamping>;

export const recipeCoolant = z
  .strictObject({
    type: z.enum(COOLANT_TYPES, { error: 'Choose a coolant.' }),
    concentrationPct: quantity('Concentration', '% v/v', 0, 100).nullable(),
    /** 0 is accepted so the checks can say what it means (no flow: the cut runs dry). */
    flowLMin: quantity('Flow', 'L/min', 0, 200, { inclusiveMin: true }).nullable(),
  })
  .refine((c) => c.type !== 'water-soluble' || c.concentrationPct !== null, {
    path: ['concentrationPct'],
    message: 'Give the concentration of a water-soluble coolant.',
  });
export type RecipeCoolant = z.infer<typeof recipeCoolant>;

/** The full content of one version. */
export const recipeContent = z.strictObject({
  scope: recipeScope,
  cutting: recipeCutting,
  clamping: recipeClamping,
  coolant: recipeCoolant,
  /** Markdown; rendered with marked and sanitized with DOMPurify wherever shown. */
  instructionsMd: text('Instructions', 20000),
  acceptanceMd: text('Acceptance criteria', 5000),
  /** Cautions specific to this recipe, shown after the standard ones. */
  cautionsMd: text('Cautions', 5000),
  /** Why this version differs from the one before; required from version 2 on. */
  changeReason: text('Change reason', 1000),
});
export type RecipeContent = z.infer<typeof recipeContent>;

/** POST /api/recipes: a new recipe starts as a draft version 1. */
export const createRecipeBody = z.strictObject({
  title: requiredText('Title', 160),
  content: recipeContent,
});
export type CreateRecipeBody = z.infer<typeof createRecipeBody>;

/** PUT /api/recipes/:id/versions/:n: save a draft; `revision` is the one the edit started from. */
export const saveDraftBody = z.strictObject({
  revision: z.number({ error: 'Revision is required.' }).int().min(0),
  title: requiredText('Title', 160),
  content: recipeContent,
});
export type SaveDraftBody = z.infer<typeof saveDraftBody>;

export const RECIPE_SORT_FIELDS = ['number', 'title', 'group', 'status', 'updatedAt', 'sizeMaxMm'] as const;

/** GET /api/recipes: the library's table query over indexed columns. */
export const recipeListQuery = z.strictObject({
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(100, 'Page size must be at most 100.').default(25),
  sort: z.enum(RECIPE_SORT_FIELDS).default('number'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  q: z.string().trim().max(100, 'Search text must be at most 100 characters.').optional(),
  group: materialGroup.optional(),
  shape: z.enum(SHAPES).optional(),
  machineId: z.coerce.number().int().positive().optional(),
  status: z.enum(RECIPE_STATUSES).optional(),
  /** A size the recipe must cover, mm. */
  size: z.coerce.number().positive().max(2000).optional(),
  /** A hardness the recipe must cover, in HV (converted client-side from other scales). */
  hardnessHv: z.coerce.number().positive().max(3000).optional(),
  /** "overdue": only recipes whose current version's periodic review date has passed. */
  review: z.enum(['overdue'], { error: 'Use review=overdue, or leave it out.' }).optional(),
});
export type RecipeListQuery = z.infer<typeof recipeListQuery>;
