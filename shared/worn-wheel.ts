/**
 * The wheel worn down, and the kerf. A consumable bonded wheel shrinks as it cuts: its
 * capacity falls with its diameter, and at the same rpm so does its peripheral speed
 * (v = π·D·n/60 000, so holding v at a smaller diameter takes n_worn = n·D_new/D_worn).
 * A wheel is used down to its smallest usable diameter: the wheel record's own, or the
 * lab's default share of the new diameter.
 *
 * Rim wheels (diamond or CBN on a metal core) are different: the abrasive is a thin rim
 * (a few millimetres) that is spent before the diameter changes much, so the lab's share
 * does not apply to them (common practice). They get a worn diameter only when their
 * record gives one.
 */
import { maxRpmForWheel } from './peripheral-speed';
import type { WheelRecord } from './stock-types';
import type { RpmCap, WornDiameterSource } from './vocabulary';

/**
 * Kerfbook's default smallest usable diameter of a consumable wheel, as a share of its new
 * diameter (common practice: a cut-off wheel is replaced once it has lost about a third of
 * its diameter; the lab sets its own).
 */
export const KERFBOOK_WORN_DIAMETER_SHARE = 0.7;

/**
 * Kerfbook's default allowance added to the wheel's thickness for the kerf loss, mm
 * (common practice: run-out and side wear make the cut a little wider than the wheel).
 */
export const KERFBOOK_KERF_ALLOWANCE_MM = 0.2;

/** Why a rim wheel has no worn diameter, in words for the panels. */
export const RIM_WHEEL_WEAR_NOTE =
  'A rim wheel (diamond or CBN on a metal core) keeps its diameter: its thin abrasive rim is spent before the diameter shrinks much, so its capacity and speed are those of the new wheel. Give a smallest usable diameter on the wheel record where the rim is deep enough to matter.';

/** Shown beside the rpm that would hold the new-wheel speed: a figure, not an instruction. */
export const WORN_RPM_CAUTION =
  "Raise the speed of a worn wheel only where the machine's manual allows it, never above the maximum marked on the wheel (ANSI B7.1; OSHA 29 CFR 1910.215(d)(1)); the wheel maker's instructions and local regulations take precedence.";

export interface WornDiameter {
  diameterMm: number;
  source: WornDiameterSource;
}

const positive = (n: unknown): n is number => typeof n === 'number' && Number.isFinite(n) && n > 0;

/**
 * Smallest usable diameter of a wheel (mm): its record's, else for a consumable wheel the
 * lab's share of its new diameter; null for a rim wheel whose record gives none. A share
 * outside (0, 1) is not a share: Kerfbook's default is used instead.
 */
export function wornDiameterOf(wheel: Pick<WheelRecord, 'kind' | 'diameterMm' | 'minUsableDiameterMm'>, labShare: number): WornDiameter | null {
  const own = wheel.minUsableDiameterMm;
  if (positive(own) && own < wheel.diameterMm) return { diameterMm: own, source: 'wheel' };
  if (wheel.kind === 'rim') return null;
  const share = positive(labShare) && labShare < 1 ? labShare : KERFBOOK_WORN_DIAMETER_SHARE;
  return { diameterMm: share * wheel.diameterMm, source: 'lab-default' };
}

/** Rpm (unrounded) that keeps the peripheral speed of `rpm` at `newDiameterMm` once the wheel is `wornDiameterMm`: n·D_new/D_worn. */
export function rpmToHoldSpeed(rpm: number, newDiameterMm: number, wornDiameterMm: number): number {
  return (rpm * newDiameterMm) / wornDiameterMm;
}

/**
 * Highest whole rpm the wheel's marking allows at `diameterMm`: a marking in m/s caps the
 * rim speed, so a smaller wheel may turn faster (60 000·v/(π·D), floored); a marking in rpm
 * caps the spindle speed whatever the wear (the marked figure is the limit).
 */
export function markedMaxRpmAt(wheel: Pick<WheelRecord, 'maxSpeedMarkedIn' | 'maxSpeedMs' | 'maxSpeedRpm'>, diameterMm: number): number {
  return wheel.maxSpeedMarkedIn === 'rpm' ? Math.floor(wheel.maxSpeedRpm) : maxRpmForWheel(diameterMm, wheel.maxSpeedMs);
}

export interface CappedRpm {
  /** Whole rpm, floored. */
  rpm: number;
  /** The cap that held it back, or null when the wanted rpm is within every cap. */
  cappedBy: RpmCap | null;
}

/** `wantedRpm` floored and held at or below each cap given (the lowest one wins). */
export function capRpm(wantedRpm: number, caps: Partial<Record<RpmCap, number | null>>): CappedRpm {
  let rpm = Math.floor(wantedRpm * (1 + 1e-12));
  let cappedBy: RpmCap | null = null;
  for (const [cap, limit] of Object.entries(caps) as [RpmCap, number | null | undefined][]) {
    if (!positive(limit)) continue;
    const whole = Math.floor(limit);
    if (whole < rpm) {
      rpm = whole;
      cappedBy = cap;
    }
  }
  return { rpm, cappedBy };
}

/** Width the cut removes, mm: the wheel's thickness plus the lab's allowance. */
export function kerfLossMm(wheelThicknessMm: number, allowanceMm: number): number {
  return wheelThicknessMm + allowanceMm;
}
