import { expect } from 'chai';
import fc from 'fast-check';
import type { UnitPreference } from '../../../../shared/api-types';
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
  NO_VALUE,
  nToLbf,
  wToHp,
  type QuantityKind,
} from '../../../../shared/units';
import { anyNumber, finite, outsidePrimitive, RUNS } from './arbitraries';

const KINDS: QuantityKind[] = ['length', 'feed', 'speed', 'rpm', 'removal', 'time', 'power', 'force', 'chip-thickness'];
const kind = fc.constantFrom(...KINDS);
const pref = fc.constantFrom<UnitPreference>('metric', 'metric+imperial');

/** Each conversion with its inverse (exact factors: inch = 25.4 mm, foot = 0.3048 m by the 1959 international yard and pound agreement; minute = 60 s). */
const PAIRS: [string, (v: number) => number, (v: number) => number][] = [
  ['mm ↔ in', mmToIn, inToMm],
  ['mm/s ↔ in/min', mmSToInMin, inMinToMmS],
  ['m/s ↔ ft/min', msToFtMin, ftMinToMs],
  ['mm/s ↔ mm/min', mmSToMmMin, mmMinToMmS],
];
const ALL = [mmToIn, inToMm, mmSToInMin, inMinToMmS, msToFtMin, ftMinToMs, mmSToMmMin, mmMinToMmS, mm3SToIn3Min, wToHp, nToLbf];

/** Values a lab stores: from a micrometre to far beyond any saw. */
const magnitude = finite(-1e12, 1e12);

describe('shared/units (properties)', () => {
  for (const [name, to, back] of PAIRS) {
    it(`${name} round-trips within 1e-12 relative`, () => {
      fc.assert(
        fc.property(magnitude, (v) => {
          expect(back(to(v))).to.be.closeTo(v, Math.abs(v) * 1e-12 + 1e-300);
          expect(to(back(v))).to.be.closeTo(v, Math.abs(v) * 1e-12 + 1e-300);
        }),
        { numRuns: RUNS },
      );
    });
  }

  it('every conversion is linear (f(a + b) = f(a) + f(b), f(−v) = −f(v)) and increasing (strictly, above underflow)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...ALL), magnitude, magnitude, (f, a, b) => {
        expect(f(a + b)).to.be.closeTo(f(a) + f(b), (Math.abs(f(a)) + Math.abs(f(b))) * 1e-12 + 1e-300);
        expect(f(-a)).to.equal(-f(a));
        if (a < b) expect(f(a)).to.be.at.most(f(b));
        // Strictly only where a and b are more than rounding apart: two doubles a few ulps apart
        // can round to the same result (found at 999999999999.9985 and …9987 ft/min).
        if (b - a > Math.abs(b) * 1e-12 + 1e-290) expect(f(a)).to.be.below(f(b));
      }),
      { numRuns: RUNS },
    );
  });

  it('conversions of a finite value below 1e300 are finite, and never throw on an outside value', () => {
    fc.assert(
      fc.property(fc.constantFrom(...ALL), finite(-1e300, 1e300), outsidePrimitive, (f, v, odd) => {
        expect(Number.isFinite(f(v))).to.equal(true);
        f(odd as number);
      }),
      { numRuns: RUNS },
    );
  });

  it('formatQuantity: a finite value gives its unit text, never "NaN" or "Infinity"', () => {
    const unit: Record<QuantityKind, RegExp> = {
      length: / mm\b/,
      feed: / mm\/s\b/,
      speed: / m\/s\b/,
      rpm: / rpm$/,
      removal: / mm³\/s\b/,
      time: / (s|min|h)\b/,
      power: / k?W\b/,
      force: / N\b/,
      'chip-thickness': / µm$/,
    };
    fc.assert(
      fc.property(finite(-1e15, 1e15), kind, pref, (v, k, p) => {
        const text = formatQuantity(v, k, p);
        expect(text).to.be.a('string').and.match(unit[k]);
        expect(text).not.to.match(/NaN|Infinity|undefined/);
        // The imperial companion only when asked for, and never for rpm, time or chip thickness.
        expect(text.includes('(')).to.equal(p === 'metric+imperial' && k !== 'rpm' && k !== 'time' && k !== 'chip-thickness');
      }),
      { numRuns: RUNS },
    );
  });

  it('formatQuantity: a missing or non-finite value shows the no-value mark', () => {
    fc.assert(
      fc.property(fc.constantFrom(null, undefined, NaN, Infinity, -Infinity), kind, pref, (v, k, p) => {
        expect(formatQuantity(v, k, p)).to.equal(NO_VALUE);
      }),
      { numRuns: RUNS },
    );
  });

  it('formatQuantity never throws, whatever the value, kind or preference', () => {
    fc.assert(
      fc.property(fc.oneof(anyNumber, outsidePrimitive), fc.oneof(kind, outsidePrimitive), fc.oneof(pref, outsidePrimitive), (v, k, p) => {
        const text = formatQuantity(v as number, k as QuantityKind, p as UnitPreference);
        // An unknown kind is outside the type: the switch gives nothing rather than a wrong unit.
        if (KINDS.includes(k as QuantityKind)) expect(text).to.be.a('string');
      }),
      { numRuns: RUNS },
    );
  });

  it('formatQuantity time: whole values from 60 s read as min and s (or h and min) that add back to the value', () => {
    fc.assert(
      fc.property(fc.integer({ min: 60, max: 10_000_000 }), (s) => {
        const text = formatQuantity(s, 'time', 'metric');
        const h = /^(\d+) h (\d{2}) min$/.exec(text);
        const m = /^(\d+) min (\d{2}) s$/.exec(text);
        if (h) expect(Number(h[1]) * 3600 + Number(h[2]) * 60).to.equal(s - (s % 60));
        else if (m) expect(Number(m[1]) * 60 + Number(m[2])).to.equal(s);
        else expect.fail(`unexpected time text "${text}"`);
      }),
      { numRuns: RUNS },
    );
  });
});
