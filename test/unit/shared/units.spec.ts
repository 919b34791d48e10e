import { expect } from 'chai';
import { unit } from 'mathjs';
import {
  formatQuantity,
  ftMinToMs,
  inMinToMmS,
  inToMm,
  mm3SToIn3Min,
  mmMinToMmS,
  mmSToInMin,
  mmSToMmMin,
  mmToIn,
  msToFtMin,
  nToLbf,
  wToHp,
} from '../../../shared/units';

describe('shared/units', () => {
  describe('conversions agree with mathjs (general reference library, a devDependency)', () => {
    const cases: [string, (v: number) => number, string, string][] = [
      ['mm → in', mmToIn, 'mm', 'inch'],
      ['in → mm', inToMm, 'inch', 'mm'],
      ['mm/s → in/min', mmSToInMin, 'mm/s', 'inch/min'],
      ['in/min → mm/s', inMinToMmS, 'inch/min', 'mm/s'],
      ['m/s → ft/min', msToFtMin, 'm/s', 'ft/min'],
      ['ft/min → m/s', ftMinToMs, 'ft/min', 'm/s'],
      ['mm/s → mm/min', mmSToMmMin, 'mm/s', 'mm/min'],
      ['mm/min → mm/s', mmMinToMmS, 'mm/min', 'mm/s'],
      ['mm³/s → in³/min', mm3SToIn3Min, 'mm^3/s', 'inch^3/min'],
      ['W → hp', wToHp, 'W', 'hp'],
      ['N → lbf', nToLbf, 'N', 'lbf'],
    ];
    for (const [name, fn, from, to] of cases) {
      it(name, () => {
        for (const v of [0.005, 0.3, 1, 39.27, 1234.5]) {
          // mathjs 15.2.0, unit().toNumber()
          expect(fn(v)).to.be.closeTo(unit(v, from).toNumber(to), 1e-9 * Math.max(1, Math.abs(fn(v))));
        }
      });
    }
  });

  describe('exact factors', () => {
    it('match the exact conversion factors (inch = 25.4 mm, foot = 0.3048 m, 1959 international yard and pound; minute = 60 s)', () => {
      expect(mmToIn(25.4)).to.equal(1); // inch = 25.4 mm exactly (1959 international yard and pound agreement; NIST SP 811, Appendix B)
      expect(mmSToMmMin(1)).to.equal(60); // minute = 60 s (ISO 80000-3; NIST SP 811)
      expect(mmSToInMin(1)).to.be.closeTo(2.362204724, 1e-9); // 60/25.4, computed by hand from the exact inch
      expect(inMinToMmS(1)).to.be.closeTo(0.4233333, 1e-7); // 25.4/60, computed by hand from the exact inch
      expect(msToFtMin(1)).to.be.closeTo(196.8503937, 1e-7); // 60/0.3048, computed by hand from the exact foot
      expect(ftMinToMs(1)).to.be.closeTo(0.00508, 1e-15); // 0.3048/60 = 0.00508 exactly, computed by hand from the exact foot
      expect(nToLbf(4.4482216152605)).to.be.closeTo(1, 1e-15); // lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N exactly (NIST SP 811, Appendix B)
      expect(wToHp(745.6998715822702)).to.be.closeTo(1, 1e-15); // hp = 550 ft·lbf/s = 550 × 0.3048 × 4.4482216152605 W = 745.69987 W (NIST SP 811, Appendix B)
    });
    it('round-trip without drift', () => {
      expect(inToMm(mmToIn(37.3))).to.be.closeTo(37.3, 1e-12);
      expect(ftMinToMs(msToFtMin(44.7))).to.be.closeTo(44.7, 1e-12);
    });
  });

  describe('formatQuantity', () => {
    it('feed with imperial beside metric', () => {
      expect(formatQuantity(0.3, 'feed', 'metric+imperial')).to.equal('0.30 mm/s (0.71 in/min)'); // 0.3 × 60/25.4 = 0.709, computed by hand
      expect(formatQuantity(0.3, 'feed', 'metric')).to.equal('0.30 mm/s');
      expect(formatQuantity(0.01, 'feed', 'metric')).to.equal('0.010 mm/s');
    });
    it('speed, length, rpm, removal, time', () => {
      expect(formatQuantity(39.2699, 'speed', 'metric+imperial')).to.equal('39.3 m/s (7730 ft/min)'); // Ø250 at 3000 rpm: π·250·3000/60 000 m/s × 60/0.3048 = 7730.3 ft/min, computed by hand
      expect(formatQuantity(40, 'length', 'metric+imperial')).to.equal('40.0 mm (1.575 in)'); // 40/25.4 = 1.5748, computed by hand
      expect(formatQuantity(250, 'length', 'metric+imperial')).to.equal('250 mm (9.843 in)'); // 250/25.4 = 9.8425, computed by hand
      expect(formatQuantity(3183.099, 'rpm', 'metric+imperial')).to.equal('3183 rpm');
      expect(formatQuantity(30, 'removal', 'metric')).to.equal('30.0 mm³/s');
      expect(formatQuantity(96, 'time', 'metric')).to.equal('1 min 36 s');
      expect(formatQuantity(42, 'time', 'metric')).to.equal('42 s');
      expect(formatQuantity(3725, 'time', 'metric')).to.equal('1 h 02 min');
    });
    it('power, force and chip thickness (the cutting power figures)', () => {
      expect(formatQuantity(2250, 'power', 'metric')).to.equal('2.25 kW');
      expect(formatQuantity(2250, 'power', 'metric+imperial')).to.equal('2.25 kW (3.02 hp)'); // 2250 / 745.7 = 3.017, computed by hand
      expect(formatQuantity(360, 'power', 'metric')).to.equal('360 W');
      expect(formatQuantity(9, 'power', 'metric')).to.equal('9.0 W');
      expect(formatQuantity(43.85, 'force', 'metric+imperial')).to.equal('43.9 N (9.86 lbf)'); // 43.85 / 4.448 = 9.858, computed by hand
      expect(formatQuantity(0.5847, 'chip-thickness', 'metric+imperial')).to.equal('0.585 µm');
      expect(formatQuantity(0.0095, 'chip-thickness', 'metric')).to.equal('0.0095 µm');
      expect(formatQuantity(1.0698, 'chip-thickness', 'metric')).to.equal('1.07 µm');
    });
    it('shows a dash for missing values', () => {
      expect(formatQuantity(null, 'feed', 'metric')).to.equal('—');
      expect(formatQuantity(Number.NaN, 'speed', 'metric+imperial')).to.equal('—');
    });
  });
});
