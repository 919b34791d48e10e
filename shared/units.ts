/**
 * Unit conversions. Kerfbook stores SI/metric values; these exact factors (inch = 25.4 mm,
 * foot = 0.3048 m by the 1959 international yard and pound agreement; NIST SP 811)
 * convert for display only, and rounding happens only in `formatQuantity`.
 */
import type { UnitPreference } from './api-types';

/** Millimetres in one inch (exact, by definition of the international inch). */
export const MM_PER_INCH = 25.4;
/** Metres in one foot (exact, by definition of the international foot). */
export const M_PER_FOOT = 0.3048;
/** Cubic millimetres in one cubic inch (25.4³, exact). */
export const MM3_PER_IN3 = MM_PER_INCH ** 3;

export const mmToIn = (mm: number): number => mm / MM_PER_INCH;
export const inToMm = (inches: number): number => inches * MM_PER_INCH;
/** mm/s → in/min: × 60 / 25.4. */
export const mmSToInMin = (mmS: number): number => (mmS * 60) / MM_PER_INCH;
/** in/min → mm/s: × 25.4 / 60. */
export const inMinToMmS = (inMin: number): number => (inMin * MM_PER_INCH) / 60;
/** m/s → ft/min: × 60 / 0.3048. */
export const msToFtMin = (ms: number): number => (ms * 60) / M_PER_FOOT;
/** ft/min → m/s: × 0.3048 / 60 = × 0.00508. */
export const ftMinToMs = (ftMin: number): number => (ftMin * M_PER_FOOT) / 60;
export const mmSToMmMin = (mmS: number): number => mmS * 60;
export const mmMinToMmS = (mmMin: number): number => mmMin / 60;
/** mm³/s → in³/min. */
export const mm3SToIn3Min = (mm3S: number): number => (mm3S * 60) / MM3_PER_IN3;

/** Newtons in one pound-force: 0.45359237 kg × 9.80665 m/s² (exact, by the definitions of the pound and of standard gravity). */
export const N_PER_LBF = 0.45359237 * 9.80665;
/** Watts in one mechanical horsepower: 550 ft·lbf/s (exact from the foot and the pound-force). */
export const W_PER_HP = 550 * M_PER_FOOT * N_PER_LBF;
export const wToHp = (w: number): number => w / W_PER_HP;
export const nToLbf = (n: number): number => n / N_PER_LBF;

/** What a number measures: decides the metric unit, the imperial companion and the rounding. */
export type QuantityKind = 'length' | 'feed' | 'speed' | 'rpm' | 'removal' | 'time' | 'power' | 'force' | 'chip-thickness';

/** Shown for a missing or non-finite value. */
export const NO_VALUE = '—';

/** Fixed decimals chosen by magnitude: small values keep more digits so they never show as 0. */
function decimals(value: number, steps: readonly [below: number, digits: number][], otherwise: number): string {
  const abs = Math.abs(value);
  for (const [below, digits] of steps) if (abs < below) return value.toFixed(digits);
  return value.toFixed(otherwise);
}

function formatTime(seconds: number): string {
  if (seconds < 10) return `${seconds.toFixed(1)} s`;
  const total = Math.round(seconds);
  if (total < 60) return `${total} s`;
  const h = Math.floor(total / 3600);
  const min = Math.floor((total % 3600) / 60);
  const s = total % 60;
  if (h > 0) return `${h} h ${String(min).padStart(2, '0')} min`;
  return `${min} min ${String(s).padStart(2, '0')} s`;
}

/**
 * A stored metric value as display text, with the imperial value in parentheses when the
 * person prefers both, e.g. `formatQuantity(0.3, 'feed', 'metric+imperial')` →
 * "0.30 mm/s (0.71 in/min)". Units by kind: length mm (in), feed mm/s (in/min), speed m/s
 * (ft/min), rpm, removal mm³/s (in³/min), time s (no imperial companion), power W or kW (hp),
 * force N (lbf), chip thickness µm (no imperial companion).
 */
export function formatQuantity(value: number | null | undefined, kind: QuantityKind, pref: UnitPreference): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NO_VALUE;
  const both = pref === 'metric+imperial';
  switch (kind) {
    case 'length': {
      const metric = `${decimals(
        value,
        [
          [10, 2],
          [100, 1],
        ],
        0,
      )} mm`;
      return both ? `${metric} (${decimals(mmToIn(value), [[10, 3]], 2)} in)` : metric;
    }
    case 'feed': {
      const metric = `${decimals(
        value,
        [
          [0.1, 3],
          [10, 2],
        ],
        1,
      )} mm/s`;
      return both
        ? `${metric} (${decimals(
            mmSToInMin(value),
            [
              [0.1, 3],
              [10, 2],
            ],
            1,
          )} in/min)`
        : metric;
    }
    case 'speed': {
      const metric = `${decimals(value, [[10, 2]], 1)} m/s`;
      return both ? `${metric} (${Math.round(msToFtMin(value))} ft/min)` : metric;
    }
    case 'rpm':
      return `${Math.round(value)} rpm`;
    case 'removal': {
      const metric = `${decimals(
        value,
        [
          [10, 2],
          [100, 1],
        ],
        0,
      )} mm³/s`;
      return both
        ? `${metric} (${decimals(
            mm3SToIn3Min(value),
            [
              [1, 3],
              [10, 2],
            ],
            1,
          )} in³/min)`
        : metric;
    }
    case 'time':
      return formatTime(value);
    case 'power': {
      const metric = Math.abs(value) >= 1000 ? `${(value / 1000).toFixed(2)} kW` : `${decimals(value, [[10, 1]], 0)} W`;
      return both
        ? `${metric} (${decimals(
            wToHp(value),
            [
              [1, 3],
              [10, 2],
            ],
            1,
          )} hp)`
        : metric;
    }
    case 'force': {
      const metric = `${decimals(
        value,
        [
          [10, 2],
          [100, 1],
        ],
        0,
      )} N`;
      return both
        ? `${metric} (${decimals(
            nToLbf(value),
            [
              [10, 2],
              [100, 1],
            ],
            0,
          )} lbf)`
        : metric;
    }
    case 'chip-thickness':
      return `${decimals(
        value,
        [
          [0.1, 4],
          [1, 3],
        ],
        2,
      )} µm`;
  }
}
