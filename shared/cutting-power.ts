/**
 * Cutting power and heat along the cut, from the removal rate profile (contact-length.ts).
 *
 * - Cutting power P = Q · u: the removal rate Q (mm³/s) times the specific cutting energy u
 *   (J/mm³, the energy it takes to remove one cubic millimetre) gives J/s = W. The relation
 *   and the specific energies of abrasive machining: Malkin & Guo, "Grinding Technology:
 *   Theory and Applications of Machining with Abrasives", 2nd ed., 2008 (specific energy).
 * - Tangential force F_t = P / v_s: W ÷ m/s = N, v_s the wheel's peripheral speed.
 * - Equivalent chip thickness h_eq = Q'_w / v_s with Q'_w = Q / b, the removal rate per mm of
 *   wheel width b (the wheel's thickness): the thickness of the layer the wheel's surface
 *   would carry away if the removed volume were spread evenly over it. mm²/s ÷ m/s =
 *   mm²/s ÷ 1000 mm/s = 10⁻³ mm = 1 µm, so Q'_w / v_s in those units is h_eq in µm.
 *   Specific energy, force per mm of width, heat into the part and wheel wear all follow it
 *   (Malkin & Guo; Marinescu et al., "Handbook of Machining with Grinding Wheels"): it is
 *   the heat and wheel-loading indicator.
 *
 * u depends on the material and, in reality, also falls as h_eq grows (the size effect);
 * Kerfbook takes one lab-set value per material group, so every figure here is an
 * order-of-magnitude estimate, not a measurement.
 */
import type { ContactPoint } from './contact-length';
import { formatQuantity } from './units';

/**
 * Share of the motor's power above which the peak cutting power gets a warning, % (the
 * lab's default; common practice: the margin covers the drive's losses and the estimate's
 * uncertainty).
 */
export const DEFAULT_POWER_WARNING_PCT = 80;

/** Cutting power, W: removal rate (mm³/s) × specific cutting energy (J/mm³). */
export function cuttingPowerW(removalMm3S: number, specificEnergyJMm3: number): number {
  return removalMm3S * specificEnergyJMm3;
}

/** Tangential (cutting) force at the wheel's rim, N: power (W) ÷ peripheral speed (m/s). */
export function tangentialForceN(powerW: number, peripheralSpeedMs: number): number {
  return powerW / peripheralSpeedMs;
}

/** Removal rate per mm of wheel width Q'_w, mm³/(mm·s) = mm²/s: removal rate ÷ wheel thickness. */
export function removalPerWidthMm2S(removalMm3S: number, wheelThicknessMm: number): number {
  return removalMm3S / wheelThicknessMm;
}

/** Equivalent chip thickness h_eq, µm: Q'_w (mm²/s) ÷ v_s (m/s), the factor 10⁻³ mm = 1 µm cancelling (see the file's header). */
export function equivalentChipThicknessUm(removalMm3S: number, wheelThicknessMm: number, peripheralSpeedMs: number): number {
  return removalPerWidthMm2S(removalMm3S, wheelThicknessMm) / peripheralSpeedMs;
}

/** Cutting power at one depth of the cut. */
export interface PowerPoint {
  /** Depth from the entry point, mm. */
  depthMm: number;
  /** Cutting power at that depth, W. */
  powerW: number;
}

/** The power and heat figures of a cut at the scope's largest size. */
export interface CutPower {
  /** Specific cutting energy of the scope's material group (lab setting), J/mm³; null when the lab has none for it. */
  specificEnergyJMm3: number | null;
  /** Cutting power along the cut (the depths of the removal profile); null without a specific energy. */
  powerProfile: PowerPoint[] | null;
  /** Largest cutting power along the cut, W; null without a specific energy. */
  peakPowerW: number | null;
  /** Tangential force at the peak, N; null without a specific energy or a peripheral speed. */
  peakTangentialForceN: number | null;
  /** Largest removal rate per mm of wheel width Q'_w, mm²/s. */
  peakRemovalPerWidthMm2S: number | null;
  /** Equivalent chip thickness at the peak, µm; null without a peripheral speed. */
  peakChipThicknessUm: number | null;
  /** The machine's motor power, W; null when the machine record does not give it. */
  motorPowerW: number | null;
  /** Peak cutting power as a share of the motor's power, %; null when either is unknown. */
  motorSharePct: number | null;
  /** Share of the motor's power above which the check warns (lab setting), %. */
  warningSharePct: number;
}

export interface CutPowerInputs {
  /** J/mm³, or null when the lab gives none for the group. */
  specificEnergyJMm3: number | null;
  /** Peripheral speed at the wheel's new diameter, m/s, or null (no rpm yet). */
  peripheralSpeedMs: number | null;
  /** Wheel thickness b, mm (positive). */
  wheelThicknessMm: number;
  /** Motor power, kW, or null. */
  motorPowerKw: number | null;
  /** Warning share of the motor's power, %. */
  warningSharePct: number;
}

const usable = (n: number | null): n is number => n !== null && Number.isFinite(n) && n > 0;
/** A figure that overflowed (a half-typed speed near 0 divides into ∞) is shown as none. */
const finiteOrNull = (n: number | null): number | null => (n !== null && Number.isFinite(n) ? n : null);

/**
 * Power, force and chip thickness of a cut from its removal profile. Every figure is
 * proportional to the removal rate (u, v_s and b are the same all along the cut), so they
 * all peak where the removal rate peaks.
 */
export function cutPower(profile: readonly ContactPoint[], inputs: CutPowerInputs): CutPower {
  const vs = usable(inputs.peripheralSpeedMs) ? inputs.peripheralSpeedMs : null;
  const b = inputs.wheelThicknessMm;
  const motorW = usable(inputs.motorPowerKw) ? inputs.motorPowerKw * 1000 : null;
  const peakQ = profile.reduce((peak, p) => Math.max(peak, p.removalMm3S), 0);
  const peakPowerW = usable(inputs.specificEnergyJMm3) ? finiteOrNull(cuttingPowerW(peakQ, inputs.specificEnergyJMm3)) : null;
  const u = peakPowerW === null ? null : inputs.specificEnergyJMm3!;
  return {
    specificEnergyJMm3: usable(inputs.specificEnergyJMm3) ? inputs.specificEnergyJMm3 : null,
    powerProfile: u === null ? null : profile.map((p) => ({ depthMm: p.depthMm, powerW: cuttingPowerW(p.removalMm3S, u) })),
    peakPowerW,
    peakTangentialForceN: peakPowerW === null || vs === null ? null : finiteOrNull(tangentialForceN(peakPowerW, vs)),
    peakRemovalPerWidthMm2S: finiteOrNull(removalPerWidthMm2S(peakQ, b)),
    peakChipThicknessUm: vs === null ? null : finiteOrNull(equivalentChipThicknessUm(peakQ, b, vs)),
    motorPowerW: motorW,
    motorSharePct: peakPowerW === null || motorW === null ? null : finiteOrNull((peakPowerW / motorW) * 100),
    warningSharePct: inputs.warningSharePct,
  };
}

/**
 * The peak's share of the motor in words — "41 % of the 5.50 kW motor", "more than the
 * 2.20 kW motor" — or null when either is unknown. One decimal where a whole number would
 * hide that the share is above the lab's (80.4 % against 80 %).
 */
export function motorShareText(p: Pick<CutPower, 'motorSharePct' | 'motorPowerW' | 'warningSharePct'>): string | null {
  if (p.motorSharePct === null || p.motorPowerW === null) return null;
  const motor = formatQuantity(p.motorPowerW, 'power', 'metric');
  if (p.motorSharePct > 100) return `more than the ${motor} motor`;
  const digits = p.motorSharePct > p.warningSharePct && Math.round(p.motorSharePct) <= p.warningSharePct ? 1 : 0;
  return `${p.motorSharePct.toFixed(digits)} % of the ${motor} motor`;
}
