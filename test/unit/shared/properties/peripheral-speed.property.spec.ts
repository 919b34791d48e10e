import { expect } from 'chai';
import fc from 'fast-check';
import { maxRpmForWheel, peripheralSpeedMs, rpmForSpeed, speedMargin, toFtPerMin } from '../../../../shared/peripheral-speed';
import { ftMinToMs } from '../../../../shared/units';
import { anyNumber, finite, outsidePrimitive, RUNS } from './arbitraries';

/** The schemas' ranges: wheel Ø 10–1000 mm, 1–30 000 rpm, marked maximum 1–200 m/s. */
const diameter = finite(10, 1000);
const rpm = finite(1, 30000);
const maxSpeed = finite(1, 200);

describe('shared/peripheral-speed (properties)', () => {
  it('is finite and positive for every valid diameter and rpm, and inverts through rpmForSpeed', () => {
    fc.assert(
      fc.property(diameter, rpm, (d, n) => {
        const v = peripheralSpeedMs(d, n);
        expect(Number.isFinite(v) && v > 0).to.equal(true);
        expect(rpmForSpeed(d, v)).to.be.closeTo(n, n * 1e-12);
      }),
      { numRuns: RUNS },
    );
  });

  it('is monotone in rpm and in diameter, and proportional to each (v = π·D·n / 60 000)', () => {
    fc.assert(
      fc.property(diameter, diameter, rpm, rpm, (d1, d2, n1, n2) => {
        const [dLo, dHi] = d1 <= d2 ? [d1, d2] : [d2, d1];
        const [nLo, nHi] = n1 <= n2 ? [n1, n2] : [n2, n1];
        expect(peripheralSpeedMs(dLo, n1)).to.be.at.most(peripheralSpeedMs(dHi, n1));
        expect(peripheralSpeedMs(d1, nLo)).to.be.at.most(peripheralSpeedMs(d1, nHi));
        expect(peripheralSpeedMs(2 * d1, n1)).to.be.closeTo(2 * peripheralSpeedMs(d1, n1), 1e-9);
        expect(peripheralSpeedMs(d1, n1)).to.be.closeTo(peripheralSpeedMs(n1, d1), 1e-9);
      }),
      { numRuns: RUNS },
    );
  });

  it('gives the same speed in ft/min as converting m/s (× 60 / 0.3048) and back', () => {
    fc.assert(
      fc.property(diameter, rpm, (d, n) => {
        const v = peripheralSpeedMs(d, n);
        const ftMin = toFtPerMin(v);
        expect(ftMin).to.be.closeTo((v * 60) / 0.3048, v * 1e-9);
        expect(ftMinToMs(ftMin)).to.be.closeTo(v, v * 1e-12);
      }),
      { numRuns: RUNS },
    );
  });

  it('maxRpmForWheel is the highest whole rpm at or below the marked maximum', () => {
    fc.assert(
      fc.property(diameter, maxSpeed, (d, max) => {
        const n = maxRpmForWheel(d, max);
        expect(Number.isInteger(n)).to.equal(true);
        // The tiny tolerance in the function allows at most a hair over the marked speed.
        expect(peripheralSpeedMs(d, n)).to.be.at.most(max * (1 + 1e-9));
        expect(peripheralSpeedMs(d, n + 1)).to.be.above(max);
      }),
      { numRuns: RUNS },
    );
  });

  it('speedMargin: margin + running speed = marked maximum; the share is 100 % at standstill', () => {
    fc.assert(
      fc.property(finite(0, 500), maxSpeed, (v, max) => {
        const m = speedMargin(v, max);
        expect(m.marginMs + v).to.be.closeTo(max, 1e-9);
        expect(Number.isFinite(m.marginPct)).to.equal(true);
        expect(m.marginMs < 0).to.equal(v > max);
        expect(speedMargin(0, max).marginPct).to.equal(100);
      }),
      { numRuns: RUNS },
    );
  });

  it('never throws, whatever numbers or values it is given', () => {
    fc.assert(
      fc.property(fc.oneof(anyNumber, outsidePrimitive), fc.oneof(anyNumber, outsidePrimitive), (a, b) => {
        peripheralSpeedMs(a as number, b as number);
        rpmForSpeed(a as number, b as number);
        maxRpmForWheel(a as number, b as number);
        speedMargin(a as number, b as number);
        toFtPerMin(a as number);
      }),
      { numRuns: RUNS },
    );
  });
});
