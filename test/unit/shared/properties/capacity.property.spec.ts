import { expect } from 'chai';
import fc from 'fast-check';
import {
  capacityFit,
  capacityLimitOf,
  chordDepthMm,
  CUT_CLEARANCE_MM,
  cuttingDepthMm,
  smallestWheelDiameterMm,
  type CapacityPart,
  type CapacitySetup,
} from '../../../../shared/capacity';
import type { CutMotion, FeedDirection, Shape } from '../../../../shared/vocabulary';
import { anyNumber, feedDirection, finite, motion, outsidePrimitive, realistic, RUNS, shape } from './arbitraries';

const diameter = finite(10, 1000);
const flange = finite(5, 500);
const size = finite(0, 2000);

/** A part of any shape with the dimensions its shape needs (a tube's wall below its radius). */
const part: fc.Arbitrary<CapacityPart> = fc
  .record({ shape, sizeMaxMm: realistic(0.001, 2000), widthMm: realistic(0, 2000), wallShare: finite(0.001, 0.499) })
  .map(({ shape: s, sizeMaxMm, widthMm, wallShare }) => ({
    shape: s,
    sizeMaxMm,
    widthMm: s === 'rectangular' ? widthMm : null,
    wallMm: s === 'tube' ? wallShare * sizeMaxMm : null,
  }));
const setup: fc.Arbitrary<CapacitySetup> = fc.record({ wheelDiameterMm: diameter, flangeDiameterMm: flange, feedDirection, motion });

describe('shared/capacity (properties)', () => {
  it('the depth is never negative, never more than the wheel radius beyond the flange, and finite', () => {
    fc.assert(
      fc.property(diameter, flange, (d, f) => {
        const depth = cuttingDepthMm(d, f);
        expect(Number.isFinite(depth)).to.equal(true);
        expect(depth).to.be.at.least(0);
        expect(depth).to.be.at.most(Math.max(0, (d - f) / 2));
        if (d - f > 2 * CUT_CLEARANCE_MM) expect(depth + CUT_CLEARANCE_MM).to.be.closeTo((d - f) / 2, 1e-9);
      }),
      { numRuns: RUNS },
    );
  });

  it('a larger wheel or a smaller flange never cuts less', () => {
    fc.assert(
      fc.property(diameter, diameter, flange, flange, (d1, d2, f1, f2) => {
        expect(cuttingDepthMm(Math.max(d1, d2), f1)).to.be.at.least(cuttingDepthMm(Math.min(d1, d2), f1));
        expect(cuttingDepthMm(d1, Math.min(f1, f2))).to.be.at.least(cuttingDepthMm(d1, Math.max(f1, f2)));
      }),
      { numRuns: RUNS },
    );
  });

  it('a wider section never cuts deeper, and the corners never reach deeper than a thin section (chord ≤ radius)', () => {
    fc.assert(
      fc.property(diameter, flange, size, size, (d, f, w1, w2) => {
        const narrow = chordDepthMm(d, f, Math.min(w1, w2));
        expect(narrow).to.be.at.least(chordDepthMm(d, f, Math.max(w1, w2)));
        expect(narrow).to.be.at.most(cuttingDepthMm(d, f) + 1e-9);
        expect(chordDepthMm(d, f, 0)).to.be.closeTo(cuttingDepthMm(d, f), 1e-9);
      }),
      { numRuns: RUNS },
    );
  });

  it('which limit applies: turned round parts by their centre or wall, a rectangle coming down by its corners, the rest by the radius', () => {
    fc.assert(
      fc.property(motion, shape, feedDirection, (m, s, fd) => {
        const limit = capacityLimitOf(m, s, fd);
        if (m === 'turning-specimen' && s !== 'rectangular') expect(limit).to.equal(s === 'tube' ? 'turned-through-wall' : 'turned-to-centre');
        else expect(limit).to.equal(s === 'rectangular' && fd === 'wheel-down' && m !== 'traverse-pass' ? 'chord' : 'radius');
      }),
      { numRuns: RUNS },
    );
  });

  it('fits exactly when the margin is not negative; the margin is cuttable − the part; a smaller part fits wherever a larger one does', () => {
    fc.assert(
      fc.property(part, setup, (p, s) => {
        const fit = capacityFit(p, s)!;
        expect(fit.fits).to.equal(fit.marginMm >= 0);
        expect(fit.marginMm).to.equal(fit.cuttableSizeMm - fit.partMm);
        expect(fit.partMm).to.equal(fit.limit === 'turned-through-wall' ? p.wallMm : p.sizeMaxMm);
        expect(fit.depthMm).to.equal(cuttingDepthMm(s.wheelDiameterMm, s.flangeDiameterMm));
        for (const n of [fit.depthMm, fit.cuttableSizeMm, fit.marginMm]) expect(Number.isFinite(n)).to.equal(true);
        const half = { ...p, sizeMaxMm: p.sizeMaxMm / 2, wallMm: p.wallMm === null ? null : p.wallMm / 2 };
        if (fit.fits) expect(capacityFit(half, s)!.fits).to.equal(true);
        // The part horizontal never cuts less than the wheel coming down.
        if (fit.fits && s.feedDirection === 'wheel-down') expect(capacityFit(p, { ...s, feedDirection: 'part-horizontal' })!.fits).to.equal(true);
      }),
      { numRuns: RUNS },
    );
  });

  it('the smallest wheel for a part cuts it exactly, and any larger wheel cuts it too', () => {
    fc.assert(
      fc.property(part, setup, finite(0, 500), (p, s, extra) => {
        const { wheelDiameterMm: _unused, ...rest } = s;
        const d = smallestWheelDiameterMm(p, rest)!;
        expect(Number.isFinite(d)).to.equal(true);
        const at = capacityFit(p, { ...s, wheelDiameterMm: d })!;
        expect(at.marginMm).to.be.closeTo(0, 1e-9 * Math.max(1, d));
        expect(capacityFit(p, { ...s, wheelDiameterMm: d * (1 + 1e-9) + extra })!.fits).to.equal(true);
      }),
      { numRuns: RUNS },
    );
  });

  it('never throws, whatever numbers, motions, shapes or directions it is given', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(anyNumber, outsidePrimitive), { minLength: 8, maxLength: 8 }), ([a, b, c, d, e, f, g, h]) => {
        cuttingDepthMm(a as number, b as number, c as number);
        chordDepthMm(a as number, b as number, c as number, d as number);
        capacityLimitOf(d as CutMotion, e as Shape, f as FeedDirection);
        const p = { shape: e as Shape, sizeMaxMm: a as number, widthMm: g as number, wallMm: h as number };
        const s = {
          wheelDiameterMm: b as number,
          flangeDiameterMm: c as number,
          feedDirection: f as FeedDirection,
          motion: d as CutMotion,
          clearanceMm: h as number,
        };
        capacityFit(p, s);
        smallestWheelDiameterMm(p, s);
      }),
      { numRuns: RUNS },
    );
  });
});
