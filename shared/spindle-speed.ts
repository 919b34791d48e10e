/**
 * The machine's spindle against the wheel's marked maximum speed. Before a wheel is mounted,
 * the spindle speed of the machine is checked so that it cannot exceed the maximum operating
 * speed marked on the wheel (OSHA 29 CFR 1910.215(d)(1); ANSI B7.1; EN 12413 for bonded
 * abrasives, EN 13236 for diamond and CBN). The recipe's own rpm is checked elsewhere; this
 * is about what the machine can do, whatever the recipe says.
 *
 * A wheel's marked maximum is compared in the unit it was marked in, exactly: a marking in
 * rpm against the spindle's rpm, a marking in m/s against the peripheral speed the spindle
 * gives at the wheel's new (largest) diameter.
 */
import type { UnitPreference } from './api-types';
import { peripheralSpeedMs, rpmForSpeed } from './peripheral-speed';
import type { MachineRecord, WheelRecord } from './stock-types';
import { formatQuantity } from './units';

type MarkedWheel = Pick<WheelRecord, 'diameterMm' | 'maxSpeedMarkedIn' | 'maxSpeedMs' | 'maxSpeedRpm'>;
type Spindle = Pick<MachineRecord, 'rpmMax' | 'spindleLimitRpm'>;

/** Whether `rpm` turns the wheel (at its new diameter) above the maximum marked on it. */
export function exceedsMarkedMaximum(wheel: MarkedWheel, rpm: number): boolean {
  return wheel.maxSpeedMarkedIn === 'rpm' ? rpm > wheel.maxSpeedRpm : peripheralSpeedMs(wheel.diameterMm, rpm) > wheel.maxSpeedMs;
}

/**
 * Highest whole rpm at or below the wheel's marked maximum at its new diameter: the marked
 * rpm floored, or n = 60 000·v / (π·D) floored for a marking in m/s. Never rounded up. The
 * tiny tolerance keeps an exact integer (e.g. 3000.0000000001 from floating point) whole.
 */
export function wheelMaxRpm(wheel: MarkedWheel): number {
  const exact = wheel.maxSpeedMarkedIn === 'rpm' ? wheel.maxSpeedRpm : rpmForSpeed(wheel.diameterMm, wheel.maxSpeedMs);
  return Math.floor(exact * (1 + 1e-12));
}

/** The fastest the spindle can turn: its speed limit where one is set, else its top speed. */
export function spindleTopRpm(machine: Spindle): number {
  return machine.spindleLimitRpm ?? machine.rpmMax;
}

export interface SpindleOverspeed {
  /** The fastest the spindle can turn (the limit where one is set), rpm. */
  topRpm: number;
  /** Whether that is a speed limit set on the spindle rather than its top speed. */
  limited: boolean;
  /** The peripheral speed at the wheel's new diameter at `topRpm`, m/s. */
  speedAtTopMs: number;
  /** Highest whole rpm within the wheel's marked maximum. */
  wheelMaxRpm: number;
}

/**
 * The mismatch when the machine can turn the wheel above its marked maximum, or null when
 * it cannot (its top speed, or the limit set on its spindle, is within the marking).
 */
export function spindleOverspeed(machine: Spindle, wheel: MarkedWheel): SpindleOverspeed | null {
  const topRpm = spindleTopRpm(machine);
  if (!exceedsMarkedMaximum(wheel, topRpm)) return null;
  return {
    topRpm,
    limited: typeof machine.spindleLimitRpm === 'number',
    speedAtTopMs: peripheralSpeedMs(wheel.diameterMm, topRpm),
    wheelMaxRpm: wheelMaxRpm(wheel),
  };
}

/**
 * The "never above N rpm on this machine" figure of the bench sheet: the wheel's marked
 * maximum in whole rpm, or the spindle's speed limit where one is set and lower (floored).
 */
export function neverAboveRpm(machine: Pick<MachineRecord, 'spindleLimitRpm'>, wheel: MarkedWheel): number {
  const wheelMax = wheelMaxRpm(wheel);
  return typeof machine.spindleLimitRpm === 'number' ? Math.min(wheelMax, Math.floor(machine.spindleLimitRpm)) : wheelMax;
}

/** A machine and a wheel of the lab that it can turn above the wheel's marked maximum. */
export interface SpeedMismatch extends SpindleOverspeed {
  machineId: number;
  machineName: string;
  wheelId: number;
  wheelName: string;
  wheelDiameterMm: number;
  /** How the wheel's maximum is marked, and the marked figure. */
  markedIn: WheelRecord['maxSpeedMarkedIn'];
  marked: number;
}

/**
 * Every pair of the lab's machines and wheels where the machine can over-speed the wheel.
 * Only wheels the machine takes (diameter within its range) are paired: a wheel that cannot
 * be mounted cannot be over-sped, and the recipe checks refuse it for its size anyway.
 */
export function speedMismatches(
  machines: readonly (Spindle & Pick<MachineRecord, 'id' | 'name' | 'wheelDiameterMinMm' | 'wheelDiameterMaxMm'>)[],
  wheels: readonly (MarkedWheel & Pick<WheelRecord, 'id' | 'name'>)[],
): SpeedMismatch[] {
  const out: SpeedMismatch[] = [];
  for (const m of machines) {
    for (const w of wheels) {
      if (w.diameterMm < m.wheelDiameterMinMm || w.diameterMm > m.wheelDiameterMaxMm) continue;
      const over = spindleOverspeed(m, w);
      if (!over) continue;
      out.push({
        ...over,
        machineId: m.id,
        machineName: m.name,
        wheelId: w.id,
        wheelName: w.name,
        wheelDiameterMm: w.diameterMm,
        markedIn: w.maxSpeedMarkedIn,
        marked: w.maxSpeedMarkedIn === 'rpm' ? w.maxSpeedRpm : w.maxSpeedMs,
      });
    }
  }
  return out;
}

const asMarked = (n: number) => String(Number(n.toFixed(2)));

/**
 * The wheel's maximum operating speed as marked, with the other unit computed from the new
 * diameter beside it: "80 m/s (marked) · 6111 rpm at 250 mm" or "6000 rpm (marked) · 62.8
 * m/s at 200 mm". The marked figure is shown as typed; the rpm is floored (never rounded up).
 */
export function markedMaximumText(wheel: MarkedWheel, units: UnitPreference): string {
  const at = `at ${formatQuantity(wheel.diameterMm, 'length', units)}`;
  return wheel.maxSpeedMarkedIn === 'rpm'
    ? `${asMarked(wheel.maxSpeedRpm)} rpm (marked) · ${formatQuantity(wheel.maxSpeedMs, 'speed', units)} ${at}`
    : `${asMarked(wheel.maxSpeedMs)} m/s (marked) · ${wheelMaxRpm(wheel)} rpm ${at}`;
}
