import { type AbstractControl, FormGroup, type NonNullableFormBuilder, type ValidationErrors, type ValidatorFn, Validators } from '@angular/forms';
import type { QuantityKind } from '@shared/units';
import { type RecipeContent, recipeContent } from '@shared/schemas/recipe';
import {
  type ClampingMethod,
  type CoolantType,
  type CutMotion,
  type CutOrientation,
  type HardnessScale,
  MOTION_SETTING_LABELS,
  MOTION_SETTINGS,
  type MaterialGroup,
  type MotionSetting,
  type Shape,
  type WheelPath,
} from '@shared/vocabulary';
import { MOTION_SETTING_UNITS, settingsOfMotion } from '@shared/motion-settings';
import { requiredText } from '@shared/schemas/numbers';
import { toFieldErrors } from '@shared/validation';
import { zodValidator } from '../../core/forms/zod-validator';

/** Motions that cut in passes (a shallow traverse, a deep cut in depth steps), so they take a number of passes. */
export const MOTIONS_WITH_PASSES: readonly CutMotion[] = ['traverse-pass', 'stepped-depth'];

/**
 * The editor's form. It mirrors the save body (`title` + `content`) so server field errors
 * ("content.cutting.wheelRpm") and check paths ("cutting.wheelRpm") find their controls.
 * Two controls exist only in the form: `scope.by` (one material or a whole group) and
 * `scope.hasHardness` (whether the scope is limited to a hardness window). Numbers the author
 * has not typed yet are null; the shared schema says what is missing.
 */
export function buildRecipeForm(fb: NonNullableFormBuilder) {
  const num = () => fb.control<number | null>(null);
  return fb.group({
    title: fb.control('', [Validators.required, zodValidator(requiredText('Title', 160))]),
    content: fb.group({
      scope: fb.group({
        by: fb.control<'material' | 'group'>('material'),
        materialId: num(),
        group: fb.control<MaterialGroup | null>(null),
        hasHardness: fb.control(false),
        hardness: fb.group({ min: num(), max: num(), scale: fb.control<HardnessScale>('HRC') }),
        shape: fb.control<Shape | null>('round-bar'),
        sizeMinMm: num(),
        sizeMaxMm: num(),
        widthMm: num(),
        wallMm: num(),
        orientation: fb.control<CutOrientation | null>('transverse'),
        orientationNote: fb.control(''),
      }),
      cutting: fb.group({
        machineId: num(),
        wheelId: num(),
        wheelRpm: num(),
        feedMmS: num(),
        entryFeedMmS: num(),
        entryLengthMm: num(),
        cutMotion: fb.control<CutMotion | null>('straight-plunge'),
        passes: num(),
        // The cut motion's settings (the section shows the chosen motion's only).
        pulseAdvanceMm: num(),
        pulseRetractMm: num(),
        pulseFeedS: num(),
        pulsePauseS: num(),
        rockingAngleDeg: num(),
        rockingStrokeMm: num(),
        specimenRpm: num(),
        depthPerPassMm: num(),
        stepDepthMm: num(),
      }),
      clamping: fb.group({
        method: fb.control<ClampingMethod | null>(null),
        placement: fb.control(''),
        bothSides: fb.control(true),
        softInserts: fb.control(false),
        supportBlocks: fb.control(false),
        orientationRule: fb.control(''),
        wheelPath: fb.control<WheelPath | null>(null),
      }),
      coolant: fb.group({
        type: fb.control<CoolantType>('water-soluble'),
        concentrationPct: num(),
        flowLMin: num(),
      }),
      instructionsMd: fb.control(''),
      acceptanceMd: fb.control(''),
      cautionsMd: fb.control(''),
      changeReason: fb.control(''),
    }),
  });
}

export type RecipeForm = ReturnType<typeof buildRecipeForm>;
export type RecipeFormValue = ReturnType<RecipeForm['getRawValue']>;
export type FormContent = RecipeFormValue['content'];
/** The form group of each section, as the section components take them. */
export type ContentControls = RecipeForm['controls']['content']['controls'];
export type ScopeGroup = ContentControls['scope'];
export type CuttingGroup = ContentControls['cutting'];
export type ClampingGroup = ContentControls['clamping'];
export type CoolantGroup = ContentControls['coolant'];

/**
 * The content as it would be saved. Fields the shape, motion or coolant do not use are sent
 * as null (their typed values stay in the form in case the author switches back). Numbers
 * not typed yet stay null, so the result may not pass `recipeContent` — that is what the
 * schema is for; the computations and checks accept half-typed content.
 */
export function toContent(value: FormContent): RecipeContent {
  const { scope, cutting, coolant } = value;
  return {
    scope: {
      materialId: scope.by === 'material' ? scope.materialId : null,
      group: scope.group,
      hardness: scope.hasHardness ? { ...scope.hardness } : null,
      shape: scope.shape,
      sizeMinMm: scope.sizeMinMm,
      sizeMaxMm: scope.sizeMaxMm,
      widthMm: scope.shape === 'rectangular' ? scope.widthMm : null,
      wallMm: scope.shape === 'tube' ? scope.wallMm : null,
      orientation: scope.orientation,
      orientationNote: scope.orientationNote,
    },
    cutting: {
      ...cutting,
      passes: cutting.cutMotion && MOTIONS_WITH_PASSES.includes(cutting.cutMotion) ? cutting.passes : null,
      ...chosenMotionSettings(cutting),
    },
    clamping: { ...value.clamping },
    coolant: {
      type: coolant.type,
      concentrationPct: coolant.type === 'water-soluble' ? coolant.concentrationPct : null,
      flowLMin: coolant.type === 'dry' ? null : coolant.flowLMin,
    },
    instructionsMd: value.instructionsMd,
    acceptanceMd: value.acceptanceMd,
    cautionsMd: value.cautionsMd,
    changeReason: value.changeReason,
  } as RecipeContent;
}

/** Every motion setting, the chosen motion's as typed and the others null. */
function chosenMotionSettings(cutting: FormContent['cutting']): Record<MotionSetting, number | null> {
  const used = settingsOfMotion(cutting.cutMotion);
  return Object.fromEntries(MOTION_SETTINGS.map((key) => [key, used.includes(key) ? cutting[key] : null])) as Record<MotionSetting, number | null>;
}

/** The form value for stored content (the inverse of toContent). */
export function fromContent(content: RecipeContent): FormContent {
  const { scope } = content;
  return {
    scope: {
      by: scope.materialId !== null ? 'material' : 'group',
      materialId: scope.materialId,
      group: scope.group,
      hasHardness: scope.hardness !== null,
      hardness: scope.hardness ?? { min: null, max: null, scale: 'HRC' },
      shape: scope.shape,
      sizeMinMm: scope.sizeMinMm,
      sizeMaxMm: scope.sizeMaxMm,
      widthMm: scope.widthMm,
      wallMm: scope.wallMm,
      orientation: scope.orientation,
      orientationNote: scope.orientationNote,
    },
    // Content stored before the motion settings existed has none of their keys: "not given".
    cutting: { ...content.cutting, ...Object.fromEntries(MOTION_SETTINGS.map((key) => [key, content.cutting[key] ?? null])) },
    // Content stored before the wheel path existed has no key: "not given".
    clamping: { ...content.clamping, wheelPath: content.clamping.wheelPath ?? null },
    coolant: { ...content.coolant },
    instructionsMd: content.instructionsMd,
    acceptanceMd: content.acceptanceMd,
    cautionsMd: content.cautionsMd,
    changeReason: content.changeReason,
  };
}

/** Schema problems of the content, first message per dotted path ("scope.sizeMaxMm"). */
export function contentIssues(value: FormContent): Map<string, string> {
  const result = recipeContent.safeParse(toContent(value));
  const issues = new Map<string, string>();
  if (!result.success) {
    for (const { path, message } of toFieldErrors(result.error)) {
      if (!issues.has(path)) issues.set(path, message);
    }
  }
  return issues;
}

/** While the whole form is re-validated, every leaf reads one parse instead of its own. */
let sharedIssues: Map<string, string> | null = null;

/**
 * Validator for a content leaf at `path`: runs the whole content through `recipeContent`, so
 * rules that join fields (width for a rectangular section, largest size ≥ smallest) land on
 * the right control, in the schema's words.
 */
export function contentPathValidator(path: string): ValidatorFn {
  return (control: AbstractControl) => {
    const content = control.root.get('content');
    if (!(content instanceof FormGroup)) return null;
    const issues = sharedIssues ?? contentIssues(content.getRawValue() as FormContent);
    const message = issues.get(path);
    return message ? { zod: message } : null;
  };
}

/** Paths of every content leaf, skipping the form-only controls. */
export function contentLeafPaths(form: RecipeForm): string[] {
  const paths: string[] = [];
  const walk = (control: AbstractControl, prefix: string) => {
    if (control instanceof FormGroup) {
      for (const [name, child] of Object.entries(control.controls)) walk(child, prefix ? `${prefix}.${name}` : name);
    } else if (prefix !== 'scope.by' && prefix !== 'scope.hasHardness') {
      paths.push(prefix);
    }
  };
  walk(form.controls.content, '');
  return paths;
}

/**
 * Gives every content leaf its schema validator. The stored content has no "one material"
 * mode (a material id or none), so the form says itself that this mode needs the material.
 */
export function attachContentValidators(form: RecipeForm): void {
  for (const path of contentLeafPaths(form)) form.controls.content.get(path)!.addValidators(contentPathValidator(path));
  const scope = form.controls.content.controls.scope.controls;
  scope.materialId.addValidators((c: AbstractControl): ValidationErrors | null =>
    scope.by.value === 'material' && c.value === null ? { zod: 'Choose a material, or scope the recipe by material group.' } : null,
  );
}

/**
 * Re-runs every validator after a change, without events: a change to one field (the shape)
 * can make another valid or invalid (the width). Leaves first, then their groups.
 */
export function revalidate(form: RecipeForm): void {
  sharedIssues = contentIssues(form.controls.content.getRawValue());
  try {
    const walk = (control: AbstractControl) => {
      if (control instanceof FormGroup) Object.values(control.controls).forEach(walk);
      control.updateValueAndValidity({ onlySelf: true, emitEvent: false });
    };
    walk(form);
  } finally {
    sharedIssues = null;
  }
}

/** How a field is shown by name, with its unit (conflict dialog, check links). */
export interface FieldInfo {
  label: string;
  /** Unit shown after the value. */
  unit?: string;
  /** For formatQuantity, when the unit has an imperial companion. */
  kind?: QuantityKind;
}

export const FIELD_INFO: Record<string, FieldInfo> = {
  title: { label: 'Title' },
  'scope.materialId': { label: 'Material' },
  'scope.group': { label: 'Material group' },
  'scope.hardness': { label: 'Hardness window' },
  'scope.hardness.min': { label: 'Lowest hardness' },
  'scope.hardness.max': { label: 'Highest hardness' },
  'scope.hardness.scale': { label: 'Hardness scale' },
  'scope.shape': { label: 'Shape' },
  'scope.sizeMinMm': { label: 'Smallest size', unit: 'mm', kind: 'length' },
  'scope.sizeMaxMm': { label: 'Largest size', unit: 'mm', kind: 'length' },
  'scope.widthMm': { label: 'Width', unit: 'mm', kind: 'length' },
  'scope.wallMm': { label: 'Wall thickness', unit: 'mm', kind: 'length' },
  'scope.orientation': { label: 'Cut orientation' },
  'scope.orientationNote': { label: 'Orientation note' },
  'cutting.machineId': { label: 'Machine' },
  'cutting.wheelId': { label: 'Wheel' },
  'cutting.wheelRpm': { label: 'Wheel speed', unit: 'rpm', kind: 'rpm' },
  'cutting.feedMmS': { label: 'Feed', unit: 'mm/s', kind: 'feed' },
  'cutting.entryFeedMmS': { label: 'Entry feed', unit: 'mm/s', kind: 'feed' },
  'cutting.entryLengthMm': { label: 'Entry length', unit: 'mm', kind: 'length' },
  'cutting.cutMotion': { label: 'Cut motion' },
  'cutting.passes': { label: 'Passes' },
  ...Object.fromEntries(
    MOTION_SETTINGS.map((key): [string, FieldInfo] => [
      `cutting.${key}`,
      { label: MOTION_SETTING_LABELS[key], unit: MOTION_SETTING_UNITS[key], ...(MOTION_SETTING_UNITS[key] === 'mm' ? { kind: 'length' as const } : {}) },
    ]),
  ),
  'clamping.method': { label: 'Clamping method' },
  'clamping.placement': { label: 'Clamp placement' },
  'clamping.bothSides': { label: 'Clamps on both sides of the cut' },
  'clamping.softInserts': { label: 'Soft inserts' },
  'clamping.supportBlocks': { label: 'Support blocks' },
  'clamping.orientationRule': { label: 'Orientation rule' },
  'clamping.wheelPath': { label: 'Wheel path through the coating' },
  'coolant.type': { label: 'Coolant' },
  'coolant.concentrationPct': { label: 'Concentration', unit: '% v/v' },
  'coolant.flowLMin': { label: 'Flow', unit: 'L/min' },
  instructionsMd: { label: 'Instructions' },
  acceptanceMd: { label: 'Acceptance criteria' },
  cautionsMd: { label: 'Recipe cautions' },
  changeReason: { label: 'Change reason' },
};

/** The element id of the field a content path points at ("cutting.wheelRpm" → "f-cutting-wheelRpm"). */
export function fieldId(path: string): string {
  return 'f-' + path.replaceAll('.', '-');
}
