/**
 * The settings of a recipe's cut motion as the operator reads them: rows for the sheet and
 * the recipe page, one line for the sheet's key-settings strip and the review summary.
 * Content stored before the settings existed has no such keys: they read as "not given".
 */
import type { UnitPreference } from './api-types';
import type { RecipeContent } from './schemas/recipe';
import { formatQuantity, type QuantityKind } from './units';
import { CUT_MOTION_LABELS, CUT_MOTION_SETTINGS, MOTION_SETTING_LABELS, type CutMotion, type MotionSetting } from './vocabulary';

/** Shown for a motion that takes settings when none is given. */
export const MOTION_SETTINGS_NOT_GIVEN = 'Settings not given';

/** How each setting is shown: a quantity kind of units.ts, or its own unit. */
const SHOWN_AS: Record<MotionSetting, { kind: QuantityKind } | { unit: string }> = {
  pulseAdvanceMm: { kind: 'length' },
  pulseRetractMm: { kind: 'length' },
  pulseFeedS: { kind: 'time' },
  pulsePauseS: { kind: 'time' },
  rockingAngleDeg: { unit: '°' },
  rockingStrokeMm: { kind: 'length' },
  specimenRpm: { kind: 'rpm' },
  depthPerPassMm: { kind: 'length' },
  stepDepthMm: { kind: 'length' },
};

/** The unit a setting is entered in (the editor's field suffix). */
export const MOTION_SETTING_UNITS: Record<MotionSetting, string> = {
  pulseAdvanceMm: 'mm',
  pulseRetractMm: 'mm',
  pulseFeedS: 's',
  pulsePauseS: 's',
  rockingAngleDeg: '°',
  rockingStrokeMm: 'mm',
  specimenRpm: 'rpm',
  depthPerPassMm: 'mm',
  stepDepthMm: 'mm',
};

/** A stored setting's value: a finite number, else null (no key in older content, or null). */
export function motionSetting(cutting: RecipeContent['cutting'] | undefined, key: MotionSetting): number | null {
  const v: unknown = (cutting as Partial<Record<MotionSetting, unknown>> | undefined)?.[key];
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

/** One setting's value as text with its unit, e.g. "0.50 mm", "10°", "2.0 s", "30 rpm". */
export function formatMotionSetting(key: MotionSetting, value: number, units: UnitPreference = 'metric'): string {
  const how = SHOWN_AS[key];
  return 'kind' in how ? formatQuantity(value, how.kind, units) : `${Number(value.toFixed(2))}${how.unit}`;
}

/** The settings the motion takes (CUT_MOTION_SETTINGS); none for an unknown motion id. */
export function settingsOfMotion(motion: unknown): readonly MotionSetting[] {
  return Object.hasOwn(CUT_MOTION_SETTINGS, String(motion)) ? CUT_MOTION_SETTINGS[motion as CutMotion] : [];
}

export interface MotionSettingRow {
  key: MotionSetting;
  label: string;
  value: string;
}

/**
 * The given settings of the recipe's motion, one row each, in CUT_MOTION_SETTINGS order.
 * Settings of other motions (left from a motion chosen before) are not shown. The number of
 * passes is not among them: it has its own row wherever recipes are shown.
 */
export function motionSettingRows(content: Pick<RecipeContent, 'cutting'>, units: UnitPreference = 'metric'): MotionSettingRow[] {
  const cutting = content.cutting;
  return settingsOfMotion(cutting?.cutMotion).flatMap((key) => {
    const v = motionSetting(cutting, key);
    return v === null ? [] : [{ key, label: MOTION_SETTING_LABELS[key], value: formatMotionSetting(key, v, units) }];
  });
}

/** Whether the motion takes settings but none of them is given. */
export function motionSettingsMissing(content: Pick<RecipeContent, 'cutting'>): boolean {
  return settingsOfMotion(content.cutting?.cutMotion).length > 0 && motionSettingRows(content).length === 0;
}

/**
 * The motion's settings in one line, e.g. "advance per pulse 0.50 mm, retract per pulse
 * 0.20 mm" or "depth per pass 0.50 mm, 12 passes"; "settings not given" for a motion that
 * takes settings and has none; "" for a straight plunge. Without the motion's name:
 * cutMotionText puts the two together.
 */
export function motionSettingsText(content: Pick<RecipeContent, 'cutting'>, units: UnitPreference = 'metric'): string {
  const cutting = content.cutting;
  const motion = cutting?.cutMotion;
  if (settingsOfMotion(motion).length === 0) return '';
  const parts = motionSettingRows(content, units).map((r) => `${lowerFirst(r.label)} ${r.value}`);
  const passes: unknown = cutting?.passes;
  if ((motion === 'traverse-pass' || motion === 'stepped-depth') && typeof passes === 'number') parts.push(`${passes} ${passes === 1 ? 'pass' : 'passes'}`);
  return parts.length ? parts.join(', ') : lowerFirst(MOTION_SETTINGS_NOT_GIVEN);
}

/** The motion by name with its settings, e.g. "Pulsed plunge: advance per pulse 0.50 mm, retract per pulse 0.20 mm". */
export function cutMotionText(content: Pick<RecipeContent, 'cutting'>, units: UnitPreference = 'metric'): string {
  const motion = content.cutting?.cutMotion;
  const name = Object.hasOwn(CUT_MOTION_LABELS, String(motion)) ? CUT_MOTION_LABELS[motion as CutMotion] : String(motion);
  const settings = motionSettingsText(content, units);
  return settings ? `${name}: ${settings}` : name;
}

const lowerFirst = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);
