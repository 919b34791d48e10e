/**
 * The machine's spindle against the wheel's marked maximum (OSHA 29 CFR 1910.215(d)(1): the
 * spindle speed is checked before mounting so that it does not exceed the maximum operating
 * speed marked on the wheel; ANSI B7.1). Worked examples computed by hand with
 * n = 60 000·v / (π·D) and v = π·D·n / 60 000.
 */
import { expect } from 'chai';
import { markedSpeedPair } from '../../../shared/peripheral-speed';
import { machineBody, wheelBody } from '../../../shared/schemas/stock';
import {
  exceedsMarkedMaximum,
  markedMaximumText,
  neverAboveRpm,
  speedMismatches,
  spindleOverspeed,
  spindleTopRpm,
  wheelMaxRpm,
} from '../../../shared/spindle-speed';
import type { MachineRecord, WheelRecord } from '../../../shared/stock-types';
import { DEMO_MACHINES, DEMO_WHEELS } from '../../../seeds/data/demo-stock';
import { machine, precisionMachine, rimWheel, wheel } from './fixtures';

/** A wheel marked in rpm, its m/s computed from the diameter as the server stores it. */
const rpmWheel = (diameterMm: number, rpm: number, over: Partial<WheelRecord> = {}): WheelRecord =>
  rimWheel({ diameterMm, maxSpeedMarkedIn: 'rpm', ...markedSpeedPair(diameterMm, 'rpm', rpm), ...over });

describe('shared/spindle-speed', () => {
  describe('wheelMaxRpm: the marked maximum in whole rpm, floored', () => {
    it('a 200 mm wheel marked 50 m/s: 60 000·50/(π·200) = 4774.6 → 4774 rpm', () => {
      expect(wheelMaxRpm(rimWheel({ diameterMm: 200, maxSpeedMs: 50 }))).to.equal(4774);
    });
    it('a 250 mm wheel marked 80 m/s: 6111.5 → 6111 rpm', () => {
      expect(wheelMaxRpm(wheel())).to.equal(6111);
    });
    it('a wheel marked in rpm keeps the marked figure (6000 rpm), floored when it has a fraction', () => {
      expect(wheelMaxRpm(rpmWheel(150, 6000))).to.equal(6000);
      expect(wheelMaxRpm(rpmWheel(150, 6000.7))).to.equal(6000);
    });
  });

  describe('exceedsMarkedMaximum compares in the unit marked, exactly', () => {
    it('m/s marking: 300 mm at 50 m/s allows 3183 rpm (49.99 m/s), not 3184 (50.01 m/s)', () => {
      const w = wheel({ diameterMm: 300, maxSpeedMs: 50 });
      expect(exceedsMarkedMaximum(w, 3183)).to.equal(false);
      expect(exceedsMarkedMaximum(w, 3184)).to.equal(true);
    });
    it('rpm marking: 6000 rpm is within a 6000 rpm marking, 6000.5 rpm is not', () => {
      const w = rpmWheel(150, 6000);
      expect(exceedsMarkedMaximum(w, 6000)).to.equal(false);
      expect(exceedsMarkedMaximum(w, 6000.5)).to.equal(true);
    });
  });

  describe('spindleOverspeed: the machine against the wheel', () => {
    const blade = rimWheel({ diameterMm: 200, maxSpeedMs: 50 });

    it('a saw reaching 5000 rpm over-speeds a 200 mm blade marked 50 m/s: 52.36 m/s at the rim, 4774 rpm allowed', () => {
      const over = spindleOverspeed(precisionMachine(), blade)!;
      expect(over).to.not.equal(null);
      expect(over.topRpm).to.equal(5000);
      expect(over.limited).to.equal(false);
      expect(over.speedAtTopMs).to.be.closeTo(52.36, 0.005);
      expect(over.wheelMaxRpm).to.equal(4774);
    });
    it('a spindle limit at or below the marking removes the mismatch (4500 rpm, and 4774 rpm: 49.99 m/s)', () => {
      expect(spindleOverspeed(precisionMachine({ spindleLimitRpm: 4500, spindleLimitSetBy: 'Maintenance' }), blade)).to.equal(null);
      expect(spindleOverspeed(precisionMachine({ spindleLimitRpm: 4774, spindleLimitSetBy: 'Maintenance' }), blade)).to.equal(null);
      expect(spindleTopRpm(precisionMachine({ spindleLimitRpm: 4500, spindleLimitSetBy: 'Maintenance' }))).to.equal(4500);
    });
    it('a limit above the marking does not: 4775 rpm gives 50.004 m/s', () => {
      const over = spindleOverspeed(precisionMachine({ spindleLimitRpm: 4775, spindleLimitSetBy: 'Maintenance' }), blade)!;
      expect(over).to.deep.include({ topRpm: 4775, limited: true, wheelMaxRpm: 4774 });
      expect(over.speedAtTopMs).to.be.closeTo(50.004, 0.0005);
    });
    it('a wheel marked in rpm: a 5000 rpm saw is within a 5000 rpm marking and over a 4999 rpm one', () => {
      expect(spindleOverspeed(precisionMachine(), rpmWheel(150, 5000))).to.equal(null);
      expect(spindleOverspeed(precisionMachine(), rpmWheel(150, 4999))).to.deep.include({ topRpm: 5000, wheelMaxRpm: 4999 });
    });
  });

  describe('neverAboveRpm: the bench sheet line, floored', () => {
    const blade = rimWheel({ diameterMm: 200, maxSpeedMs: 50 });
    it('the wheel’s marked maximum in whole rpm without a spindle limit (4774)', () => {
      expect(neverAboveRpm(precisionMachine(), blade)).to.equal(4774);
    });
    it('the spindle limit where it is lower (4500), floored (4500.9 → 4500); the wheel where the limit is higher', () => {
      expect(neverAboveRpm({ spindleLimitRpm: 4500 }, blade)).to.equal(4500);
      expect(neverAboveRpm({ spindleLimitRpm: 4500.9 }, blade)).to.equal(4500);
      expect(neverAboveRpm({ spindleLimitRpm: 4800 }, blade)).to.equal(4774);
    });
  });

  describe('speedMismatches: every machine and wheel of the lab', () => {
    it('pairs only wheels the machine takes, and names both', () => {
      const machines: MachineRecord[] = [machine({ rpmMax: 4000 }), precisionMachine()];
      const wheels: WheelRecord[] = [
        wheel({ id: 1, diameterMm: 250, maxSpeedMs: 80 }), // 6111 rpm: neither machine exceeds it
        wheel({ id: 3, name: 'Alumina 250 slow', diameterMm: 250, maxSpeedMs: 50 }), // 3819 rpm < 4000: the bench saw over-speeds it
        rimWheel({ id: 4, name: 'Rim 200', diameterMm: 200, maxSpeedMs: 50 }), // 4774 rpm: both machines take 200 mm; only the precision saw exceeds it
      ];
      const found = speedMismatches(machines, wheels).map((m) => `${m.machineName} / ${m.wheelName} / ${m.topRpm} > ${m.wheelMaxRpm}`);
      expect(found).to.deep.equal(['Bench saw / Alumina 250 slow / 4000 > 3819', 'Precision saw / Rim 200 / 5000 > 4774']);
    });

    // The demo stock once had this mismatch: a 200 mm blade marked 50 m/s (4774 rpm) on a
    // precision saw reaching 5000 rpm. The saw's spindle limit now keeps it within the marking.
    const demoMachines = () => DEMO_MACHINES.map((m, i) => ({ ...machineBody.parse(m), id: i + 1, archived: false, updatedAt: '' }) satisfies MachineRecord);
    const demoWheels = () =>
      DEMO_WHEELS.map((raw, i) => {
        const w = wheelBody.parse(raw);
        const speed = markedSpeedPair(w.diameterMm, w.maxSpeedMarkedIn, w.maxSpeedMarkedIn === 'm/s' ? w.maxSpeedMs! : w.maxSpeedRpm!);
        return { ...w, ...speed, id: i + 1, archived: false, updatedAt: '' } satisfies WheelRecord;
      });

    it('finds no mismatch in the demo stock', () => {
      expect(speedMismatches(demoMachines(), demoWheels())).to.deep.equal([]);
    });
    it('finds the demo’s old mismatch again when the precision saw’s spindle limit is taken away', () => {
      const machines = demoMachines().map((m) => ({ ...m, spindleLimitRpm: null, spindleLimitSetBy: '' }));
      const found = speedMismatches(machines, demoWheels()).map((m) => `${m.machineName} / ${m.wheelName} / ${m.topRpm} > ${m.wheelMaxRpm}`);
      expect(found).to.deep.equal(['Clean-room precision saw / Diamond rim 200 metal bond / 5000 > 4774']);
    });
  });

  describe('markedMaximumText: which unit was marked, the other computed from the new diameter', () => {
    it('"80 m/s (marked) · 6111 rpm at 250 mm"', () => {
      expect(markedMaximumText(wheel(), 'metric')).to.equal('80 m/s (marked) · 6111 rpm at 250 mm');
    });
    it('"6000 rpm (marked) · 62.8 m/s at 200 mm" (π·200·6000/60 000 = 62.83 m/s), with ft/min and inches for metric + imperial', () => {
      expect(markedMaximumText(rpmWheel(200, 6000), 'metric')).to.equal('6000 rpm (marked) · 62.8 m/s at 200 mm');
      // 62.83 m/s × 60/0.3048 = 12368 ft/min; 200 mm / 25.4 = 7.874 in (exact factors).
      expect(markedMaximumText(rpmWheel(200, 6000), 'metric+imperial')).to.equal('6000 rpm (marked) · 62.8 m/s (12368 ft/min) at 200 mm (7.874 in)');
    });
  });
});
