/**
 * Everything the recipe editor, the recipe page and the bench sheet show as computed:
 * peripheral speed, capacity, contact and removal, cutting time, hardness, the worn wheel and
 * the kerf, cutting power and heat. Called on every (debounced) keystroke, so it must stay cheap and must not throw
 * on half-typed content: every field is null while an input it needs is missing.
 */
import { capacityFit, smallestWheelDiameterMm, type CapacityFit, type CapacityPart } from './capacity';
import { contactMeasureOf, contactProfile, estimateCutTimeS, peakRemovalMm3S, type ContactPoint, type CutSection, type CutSetup } from './contact-length';
import { cutPower, DEFAULT_POWER_WARNING_PCT, type CutPower } from './cutting-power';
import { conversionApplies, convertHardness, HARDNESS_CAVEATS } from './hardness';
import { maxRpmForWheel, peripheralSpeedMs, speedMargin, toFtPerMin } from './peripheral-speed';
import type { RecipeContext } from './recipe-context';
import { neverAboveRpm, spindleOverspeed, wheelMaxRpm, type SpindleOverspeed } from './spindle-speed';
import type { WheelRecord } from './stock-types';
import type { HardnessWindow } from './schemas/stock';
import { recipeCutting, type RecipeContent } from './schemas/recipe';
import { CUT_MOTIONS, FEED_DIRECTIONS, SHAPES, type CapacityLimit, type ContactMeasure, type RpmCap, type WornDiameterSource } from './vocabulary';
import {
  capRpm,
  KERFBOOK_KERF_ALLOWANCE_MM,
  KERFBOOK_WORN_DIAMETER_SHARE,
  kerfLossMm,
  markedMaxRpmAt,
  RIM_WHEEL_WEAR_NOTE,
  rpmToHoldSpeed,
  wornDiameterOf,
} from './worn-wheel';

/** Scope hardness converted to HV for the steel groups. */
export interface ComputedHardness {
  /** The hardness as given (the scope's window, or the material's single value as min = max). */
  measured: HardnessWindow;
  /** Lowest and highest in HV, or null where no conversion applies or a bound is off the table. */
  minHv: number | null;
  maxHv: number | null;
  /** Whether conversion applies to the group at all. */
  applies: boolean;
  /** Why no HV is given, or null. */
  reason: string | null;
  /** The standard's caveats, to show beside any converted value. */
  caveats: readonly string[];
}

export interface RecipeComputed {
  /** Peripheral speed at the wheel's (new) diameter and the chosen rpm, m/s. */
  peripheralSpeedMs: number | null;
  /** The same in ft/min. */
  peripheralSpeedFtMin: number | null;
  /** Maximum operating speed marked on the wheel, m/s. */
  markedMaxSpeedMs: number | null;
  /** Marked maximum minus running speed, m/s (negative = over the marked maximum). */
  speedMarginMs: number | null;
  /** The margin as a share of the marked maximum, %. */
  speedMarginPct: number | null;
  /** Highest whole rpm that keeps the wheel at or below its marked maximum, rpm. */
  rpmAtMarkedMax: number | null;
  /** The wheel's marked maximum as marked (m/s or rpm) with both figures, for display; null without a wheel. */
  markedMaximum: MarkedMaximum | null;
  /** Whether the machine can turn the wheel above its marked maximum (its top speed or spindle limit), or null when it cannot. */
  spindleOverspeed: SpindleOverspeed | null;
  /** "Never above N rpm on this machine": the wheel's marked maximum in whole rpm, or the spindle limit where lower. */
  neverAboveRpm: number | null;
  /** Largest depth the wheel can cut on the machine (flange and clearance deducted), mm. */
  cuttingDepthMm: number | null;
  /** Largest part size that depth allows with the cut motion, mm. */
  cuttableSizeMm: number | null;
  /** Whether the scope's largest size fits. */
  capacityFits: boolean | null;
  /** Cuttable size minus the scope's largest size, mm. */
  capacityMarginMm: number | null;
  /** Contact length and removal rate through the cut at the scope's largest size, for the plot. */
  profile: ContactPoint[] | null;
  /** Largest removal rate along the cut, mm³/s. */
  peakRemovalMm3S: number | null;
  /** Estimated cutting time at the scope's largest size, s. */
  cutTimeS: number | null;
  /** Scope hardness in HV where conversion applies. */
  hardness: ComputedHardness | null;

  // Cutting geometry: which capacity limit applies, the worn wheel and the kerf.
  /** The limit that sets the capacity (shared/capacity.ts); cuttableSizeMm is a turned tube's wall for 'turned-through-wall'. */
  capacityLimit: CapacityLimit | null;
  /** Smallest wheel diameter that still cuts the scope through on this machine, mm. */
  smallestWheelForScopeMm: number | null;
  /** What the profile's length figure is: a contact length, or a turning part's removal length per turn. */
  profileMeasure: ContactMeasure | null;
  /** The wheel worn to its smallest usable diameter; null while no wheel is chosen. */
  wornWheel: WornWheelFigures | null;
  /** Width the cut removes (wheel thickness + the lab's allowance), mm. */
  kerfLossMm: number | null;
  /** The allowance in it, mm. */
  kerfAllowanceMm: number | null;
  /**
   * Cutting power, tangential force and equivalent chip thickness along the cut at the
   * scope's largest size (the same depths as `profile`), with the peaks and the motor's
   * share; null while there is no profile.
   */
  cutPower: CutPower | null;
}

/** The chosen wheel at its smallest usable diameter. */
export interface WornWheelFigures {
  /** Smallest usable diameter, mm; null for a rim wheel whose record gives none (see `reason`). */
  diameterMm: number | null;
  source: WornDiameterSource | null;
  /** The lab's share of the new diameter, when that is the source. */
  labShare: number | null;
  /** Why there is no worn diameter, or null. */
  reason: string | null;
  /** Capacity at the worn diameter (same limit as the new wheel), mm; null while machine or scope are missing. */
  cuttingDepthMm: number | null;
  cuttableSizeMm: number | null;
  capacityFits: boolean | null;
  capacityMarginMm: number | null;
  /** Peripheral speed at the worn diameter and the recipe's rpm, m/s. */
  peripheralSpeedMs: number | null;
  /** Rpm that would hold the new wheel's speed at the worn diameter, n·D_new/D_worn (unrounded, before any cap). */
  rpmToHoldSpeed: number | null;
  /** That rpm floored and capped at the marked maximum at the worn diameter and the machine's top speed or spindle limit. */
  heldRpm: number | null;
  /** The cap that held it back, or null. */
  heldRpmCappedBy: RpmCap | null;
  /** Peripheral speed at the worn diameter at heldRpm, m/s. */
  heldSpeedMs: number | null;
}

/** How a wheel's maximum operating speed is marked, with both figures at its new diameter. */
export type MarkedMaximum = Pick<WheelRecord, 'diameterMm' | 'maxSpeedMarkedIn' | 'maxSpeedMs' | 'maxSpeedRpm'>;

/** A positive finite number, or null (half-typed input). */
function positive(n: unknown): number | null {
  return typeof n === 'number' && Number.isFinite(n) && n > 0 ? n : null;
}

function computeHardness(content: RecipeContent, ctx: RecipeContext): ComputedHardness | null {
  const scope = content.scope;
  const measured: HardnessWindow | null =
    scope?.hardness ??
    (ctx.material?.hardness ? { min: ctx.material.hardness.value, max: ctx.material.hardness.value, scale: ctx.material.hardness.scale } : null);
  if (!measured || !scope?.group) return null;
  const applies = conversionApplies(scope.group);
  if (!applies.applies) return { measured, minHv: null, maxHv: null, applies: false, reason: applies.reason, caveats: HARDNESS_CAVEATS };
  const lo = convertHardness(measured.min, measured.scale, 'HV', scope.group);
  const hi = convertHardness(measured.max, measured.scale, 'HV', scope.group);
  const reason = !lo.ok ? lo.reason : !hi.ok ? hi.reason : null;
  return { measured, minHv: lo.ok ? lo.value : null, maxHv: hi.ok ? hi.value : null, applies: true, reason, caveats: HARDNESS_CAVEATS };
}

/** The computed values of a recipe with its stock context; see RecipeComputed for units. */
export function computeRecipe(content: RecipeContent, ctx: RecipeContext): RecipeComputed {
  const { wheel, machine } = ctx;
  const cutting = content.cutting;
  const scope = content.scope;
  const diameter = positive(wheel?.diameterMm);
  const rpm = positive(cutting?.wheelRpm);
  const maxSpeed = positive(wheel?.maxSpeedMs);
  const feed = positive(cutting?.feedMmS);
  const thickness = positive(wheel?.thicknessMm);
  const sizeMax = positive(scope?.sizeMaxMm);
  // An id the vocabulary does not know (content stored under an older one) is no choice yet.
  const motion = cutting && CUT_MOTIONS.includes(cutting.cutMotion) ? cutting.cutMotion : null;
  const shape = scope && SHAPES.includes(scope.shape) ? scope.shape : null;

  const speed = diameter !== null && rpm !== null ? peripheralSpeedMs(diameter, rpm) : null;
  const margin = speed !== null && maxSpeed !== null ? speedMargin(speed, maxSpeed) : null;

  // A wheel marked in rpm keeps its marked figure: the rpm limit is that figure, floored.
  const marked: MarkedMaximum | null =
    wheel && diameter !== null && maxSpeed !== null
      ? {
          diameterMm: diameter,
          maxSpeedMarkedIn: wheel.maxSpeedMarkedIn === 'rpm' && positive(wheel.maxSpeedRpm) !== null ? 'rpm' : 'm/s',
          maxSpeedMs: maxSpeed,
          maxSpeedRpm: positive(wheel.maxSpeedRpm) ?? maxRpmForWheel(diameter, maxSpeed),
        }
      : null;
  const spindle = machine && marked && positive(machine.rpmMax) !== null ? spindleOverspeed(machine, marked) : null;

  const flange = positive(machine?.flangeDiameterMm);
  // An unknown stored feed direction counts as the wheel coming down: it is the stricter limit.
  const feedDirection = machine && FEED_DIRECTIONS.includes(machine.feedDirection) ? machine.feedDirection : 'wheel-down';
  const part: CapacityPart | null =
    shape && sizeMax !== null ? { shape, sizeMaxMm: sizeMax, widthMm: nonNegative(scope.widthMm), wallMm: positive(scope.wallMm) } : null;
  const fitAt = (wheelDiameterMm: number): CapacityFit | null =>
    part && flange !== null && motion ? capacityFit(part, { wheelDiameterMm, flangeDiameterMm: flange, feedDirection, motion }) : null;
  const fit = diameter !== null ? fitAt(diameter) : null;

  // The section needs its shape's extra dimension; without it there is no profile yet.
  const section: CutSection | null =
    shape && sizeMax !== null && (shape !== 'rectangular' || positive(scope.widthMm) !== null) && (shape !== 'tube' || positive(scope.wallMm) !== null)
      ? { shape, sizeMm: sizeMax, widthMm: scope.widthMm, wallMm: scope.wallMm }
      : null;
  // Passes outside the schema's whole 1–500 give no profile or time yet: the traverse travel is
  // summed pass by pass, so a half-typed 1e9 would freeze the editor.
  const passesOk = recipeCutting.shape.passes.safeParse(cutting?.passes ?? null).success;
  const setup: CutSetup | null =
    motion && feed !== null && thickness !== null && diameter !== null && passesOk
      ? {
          motion,
          feedMmS: feed,
          entryFeedMmS: positive(cutting.entryFeedMmS),
          entryLengthMm: positive(cutting.entryLengthMm),
          passes: cutting.passes ?? null,
          wheelThicknessMm: thickness,
          wheelDiameterMm: diameter,
        }
      : null;
  const profile = section && setup ? contactProfile(section, setup) : null;
  // The schema's feeds need only be more than 0: near 5e-324 mm/s the time overflows to ∞; show none.
  const cutTime = section && setup ? estimateCutTimeS(section, setup) : null;

  return {
    peripheralSpeedMs: speed,
    peripheralSpeedFtMin: speed === null ? null : toFtPerMin(speed),
    markedMaxSpeedMs: maxSpeed,
    speedMarginMs: margin?.marginMs ?? null,
    speedMarginPct: margin?.marginPct ?? null,
    rpmAtMarkedMax: marked === null ? null : marked.maxSpeedMarkedIn === 'rpm' ? wheelMaxRpm(marked) : maxRpmForWheel(marked.diameterMm, marked.maxSpeedMs),
    markedMaximum: marked,
    spindleOverspeed: spindle,
    neverAboveRpm: machine && marked ? neverAboveRpm({ spindleLimitRpm: positive(machine.spindleLimitRpm) }, marked) : null,
    cuttingDepthMm: fit?.depthMm ?? null,
    cuttableSizeMm: fit?.cuttableSizeMm ?? null,
    capacityFits: fit?.fits ?? null,
    capacityMarginMm: fit?.marginMm ?? null,
    profile,
    peakRemovalMm3S: profile ? peakRemovalMm3S(profile) : null,
    cutTimeS: cutTime !== null && Number.isFinite(cutTime) ? cutTime : null,
    hardness: computeHardness(content, ctx),

    capacityLimit: fit?.limit ?? null,
    smallestWheelForScopeMm: part && flange !== null && motion ? smallestWheelDiameterMm(part, { flangeDiameterMm: flange, feedDirection, motion }) : null,
    profileMeasure: profile && motion && shape ? contactMeasureOf(shape, motion) : null,
    wornWheel: wheel && diameter !== null ? computeWornWheel(ctx, diameter, rpm, fitAt) : null,
    kerfLossMm: thickness !== null ? kerfLossMm(thickness, kerfAllowance(ctx)) : null,
    kerfAllowanceMm: thickness !== null ? kerfAllowance(ctx) : null,
    cutPower: profile && setup ? computeCutPower(profile, setup.wheelThicknessMm, speed, content, ctx) : null,
  };
}

/** A finite number of at least 0, or null. */
function nonNegative(n: unknown): number | null {
  return typeof n === 'number' && Number.isFinite(n) && n >= 0 ? n : null;
}

/** The lab's kerf allowance, or Kerfbook's default where the limits carry none. */
function kerfAllowance(ctx: RecipeContext): number {
  return nonNegative(ctx.limits?.kerfAllowanceMm) ?? KERFBOOK_KERF_ALLOWANCE_MM;
}

function computeWornWheel(ctx: RecipeContext, newDiameter: number, rpm: number | null, fitAt: (d: number) => CapacityFit | null): WornWheelFigures {
  const wheel = ctx.wheel!;
  const labShare = positive(ctx.limits?.wornDiameterShare) ?? KERFBOOK_WORN_DIAMETER_SHARE;
  const worn = wornDiameterOf(wheel, labShare);
  if (!worn)
    return {
      diameterMm: null,
      source: null,
      labShare: null,
      reason: RIM_WHEEL_WEAR_NOTE,
      cuttingDepthMm: null,
      cuttableSizeMm: null,
      capacityFits: null,
      capacityMarginMm: null,
      peripheralSpeedMs: null,
      rpmToHoldSpeed: null,
      heldRpm: null,
      heldRpmCappedBy: null,
      heldSpeedMs: null,
    };
  const d = worn.diameterMm;
  const fit = fitAt(d);
  const m = ctx.machine;
  // A diameter that underflows to 0 (half-typed 5e-324 mm) holds no speed: no rpm rather than ∞ or NaN.
  const hold = rpm !== null ? positive(rpmToHoldSpeed(rpm, newDiameter, d)) : null;
  const held =
    hold !== null
      ? capRpm(hold, {
          'marked-maximum': markedMaxRpmAt(wheel, d),
          'machine-top-speed': m ? m.rpmMax : null,
          'spindle-limit': m ? m.spindleLimitRpm : null,
        })
      : null;
  return {
    diameterMm: d,
    source: worn.source,
    labShare: worn.source === 'lab-default' ? labShare : null,
    reason: null,
    cuttingDepthMm: fit?.depthMm ?? null,
    cuttableSizeMm: fit?.cuttableSizeMm ?? null,
    capacityFits: fit?.fits ?? null,
    capacityMarginMm: fit?.marginMm ?? null,
    peripheralSpeedMs: rpm !== null ? peripheralSpeedMs(d, rpm) : null,
    rpmToHoldSpeed: hold,
    heldRpm: held?.rpm ?? null,
    heldRpmCappedBy: held?.cappedBy ?? null,
    heldSpeedMs: held ? peripheralSpeedMs(d, held.rpm) : null,
  };
}

/** Power and heat along the cut: the scope's group gives the specific energy (lab setting). */
function computeCutPower(profile: ContactPoint[], wheelThicknessMm: number, speedMs: number | null, content: RecipeContent, ctx: RecipeContext): CutPower {
  const group = content.scope?.group ?? ctx.material?.group ?? null;
  const energies = ctx.limits?.specificEnergyJMm3;
  const u = group && energies && Object.hasOwn(energies, group) ? (energies[group] ?? null) : null;
  const share = ctx.limits?.powerWarningPct;
  return cutPower(profile, {
    specificEnergyJMm3: u,
    peripheralSpeedMs: speedMs,
    wheelThicknessMm,
    motorPowerKw: ctx.machine?.motorPowerKw ?? null,
    warningSharePct: typeof share === 'number' && Number.isFinite(share) && share > 0 ? share : DEFAULT_POWER_WARNING_PCT,
  });
}
