/**
 * Peripheral (surface) speed of a wheel: v [m/s] = π·D[mm]·n[rpm] / 60 000 (the rim travels
 * π·D per turn; mm → m and per minute → per second), and its inverse n = 60 000·v / (π·D).
 * The check is made at the new (largest) wheel diameter, where the speed is highest: a
 * wheel must never run above the maximum operating speed marked on it (ANSI B7.1, EN 12413,
 * OSHA 29 CFR 1910.215(d)(1)).
 */
import { msToFtMin } from './units';

/** Peripheral speed (m/s) of a wheel of diameter `diameterMm` (mm) turning at `rpm`. */
export function peripheralSpeedMs(diameterMm: number, rpm: number): number {
  return (Math.PI * diameterMm * rpm) / 60_000;
}

/** m/s → ft/min (exact factor 60 / 0.3048). */
export function toFtPerMin(ms: number): number {
  return msToFtMin(ms);
}

/** Spindle speed (rpm, unrounded) that gives `speedMs` (m/s) at the rim of a wheel of `diameterMm` (mm). */
export function rpmForSpeed(diameterMm: number, speedMs: number): number {
  return (60_000 * speedMs) / (Math.PI * diameterMm);
}

/**
 * Highest whole rpm that keeps a wheel of `diameterMm` (mm) at or below its marked maximum
 * operating speed `maxSpeedMs` (m/s). Floored, never rounded up: rounding up would exceed
 * the marked speed. The tiny tolerance keeps an exact integer result (e.g. 3000.0000000001
 * from floating point) from dropping by one.
 */
export function maxRpmForWheel(diameterMm: number, maxSpeedMs: number): number {
  return Math.floor(rpmForSpeed(diameterMm, maxSpeedMs) * (1 + 1e-12));
}

/** How far a running speed is below the wheel's marked maximum. Negative = above the maximum. */
export interface SpeedMargin {
  /** Marked maximum minus running speed, m/s. */
  marginMs: number;
  /** The same as a share of the marked maximum, %. */
  marginPct: number;
}

/** Margin between the running peripheral speed `speedMs` and the marked maximum `maxSpeedMs` (both m/s). */
export function speedMargin(speedMs: number, maxSpeedMs: number): SpeedMargin {
  const marginMs = maxSpeedMs - speedMs;
  return { marginMs, marginPct: (marginMs / maxSpeedMs) * 100 };
}

/**
 * A wheel's maximum operating speed in both units, from the one marked on it: a marking in
 * m/s gives the rpm at the new diameter, a marking in rpm gives the m/s (exact, unrounded:
 * the figure a check compares against is the marked one, converted without loss).
 */
export function markedSpeedPair(diameterMm: number, markedIn: 'm/s' | 'rpm', marked: number): { maxSpeedMs: number; maxSpeedRpm: number } {
  return markedIn === 'm/s'
    ? { maxSpeedMs: marked, maxSpeedRpm: rpmForSpeed(diameterMm, marked) }
    : { maxSpeedMs: peripheralSpeedMs(diameterMm, marked), maxSpeedRpm: marked };
}
