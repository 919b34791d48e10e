/**
 * Checks on the cut motion's settings: only values that are clearly wrong against the
 * recipe's own numbers. A setting not given (null, or no key in older content) is never
 * flagged; settings of a motion not chosen are not looked at.
 */
import type { CheckResult } from './recipe-checks';
import type { RecipeContent } from './schemas/recipe';
import { motionSetting } from './motion-settings';

const mm = (v: number) => `${Number(v.toFixed(2))} mm`;
const isPositive = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;

/**
 * A pulsed plunge whose retract is not below its advance: the net advance per pulse
 * (advance − retract) is zero or negative, so the wheel never gets deeper.
 * Worked example: advance 0.3 mm, retract 0.3 mm → net 0 mm per pulse.
 */
function pulseMakesNoHeadway(content: RecipeContent): CheckResult | null {
  const c = content.cutting;
  if (c?.cutMotion !== 'pulsed-plunge') return null;
  const advance = motionSetting(c, 'pulseAdvanceMm');
  const retract = motionSetting(c, 'pulseRetractMm');
  if (advance === null || retract === null || retract < advance) return null;
  return {
    id: 'pulse-retract-not-below-advance',
    severity: 'blocker',
    path: 'cutting.pulseRetractMm',
    message: `Each pulse advances ${mm(advance)} and retracts ${mm(retract)}: the wheel gains ${mm(Math.max(0, advance - retract))} per pulse and never cuts through. Retract less than it advances.`,
    reason: 'The wheel gets deeper by the advance minus the retract in each pulse (arithmetic); the retract only lifts the wheel to let the coolant in.',
  };
}

/**
 * A depth step (stepped depth) or pass depth (traverse) at least as deep as the largest part:
 * the first step or pass goes straight through, so the motion is a straight plunge in fact.
 * Worked example: step depth 30 mm on bars up to 25 mm → one step cuts the whole bar.
 */
function stepDeeperThanPart(content: RecipeContent): CheckResult | null {
  const c = content.cutting;
  const size = content.scope?.sizeMaxMm;
  const key = c?.cutMotion === 'stepped-depth' ? 'stepDepthMm' : c?.cutMotion === 'traverse-pass' ? 'depthPerPassMm' : null;
  if (!key || !isPositive(size)) return null;
  const depth = motionSetting(c, key);
  if (depth === null || depth < size) return null;
  const what = key === 'stepDepthMm' ? 'A depth step' : 'A pass';
  return {
    id: key === 'stepDepthMm' ? 'step-depth-above-size' : 'pass-depth-above-size',
    severity: 'warning',
    path: `cutting.${key}`,
    message: `${what} of ${mm(depth)} is at least as deep as the largest part (${mm(size)}): the first one cuts straight through, as a straight plunge would. Give a smaller depth, or choose a straight plunge.`,
    reason:
      'Stepped and traverse cuts keep the wheel’s contact short by cutting a part of the depth at a time; a step as deep as the part gives a full-depth plunge with its long contact and heat (common practice).',
  };
}

/**
 * Depth per step or pass times the number of passes short of the largest part: the cut as
 * written stops before it is through.
 * Worked example: traverse, 12 passes of 0.5 mm = 6 mm, on bars up to 20 mm → 14 mm left.
 */
function passesShortOfPart(content: RecipeContent): CheckResult | null {
  const c = content.cutting;
  const size = content.scope?.sizeMaxMm;
  const key = c?.cutMotion === 'stepped-depth' ? 'stepDepthMm' : c?.cutMotion === 'traverse-pass' ? 'depthPerPassMm' : null;
  const passes: unknown = c?.passes;
  if (!key || !isPositive(size) || !isPositive(passes)) return null;
  const depth = motionSetting(c, key);
  // Rounding of typed decimals (3 × 0.1) is not a shortfall.
  if (depth === null || depth * passes >= size - 1e-6) return null;
  const needed = Math.ceil(size / depth - 1e-6);
  // Beyond the 500 passes a recipe may hold (or a depth so small the count overflows): just "more".
  const more = Number.isFinite(needed) && needed <= 500 ? `at least ${needed} passes` : 'more passes';
  return {
    id: 'passes-short-of-size',
    severity: 'warning',
    path: 'cutting.passes',
    message: `${passes} ${passes === 1 ? 'pass' : 'passes'} of ${mm(depth)} ${passes === 1 ? 'reaches' : 'reach'} ${mm(depth * passes)}, short of the largest part (${mm(size)}): the cut stops before it is through. Give ${more}, or a deeper ${key === 'stepDepthMm' ? 'step' : 'pass'}.`,
    reason: 'The depth cut is the number of passes times the depth of each (arithmetic); a section must be cut through.',
  };
}

/** The motion-setting checks, in the order they are reported within a severity. */
export function motionSettingChecks(content: RecipeContent): CheckResult[] {
  return [pulseMakesNoHeadway(content), stepDeeperThanPart(content), passesShortOfPart(content)].filter((r): r is CheckResult => r !== null);
}

/** Every id motionSettingChecks can report. */
export const MOTION_CHECK_IDS = ['pulse-retract-not-below-advance', 'step-depth-above-size', 'pass-depth-above-size', 'passes-short-of-size'] as const;
