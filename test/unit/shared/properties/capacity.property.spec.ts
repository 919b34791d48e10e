import { expect } from 'chai';
import fc from 'fast-check';
import { capacityFit, CUT_CLEARANCE_MM, cuttableSizeMm, cuttingDepthMm } from '../../../../shared/capacity';
import type { CutMotion, Shape } from '../../../../shared/vocabulary';
import { anyNumber, finite, motion, outsidePrimitive, RUNS, shape } from './arbitraries';

const diameter = finite(10, 1000);
const flange = finite(5, 500);
const size = finite(0, 2000);

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

  it('the cuttable size is the depth, or twice it only when a round part turns', () => {
    fc.assert(
      fc.property(finite(0, 1000), motion, shape, (depth, m, s) => {
        const cuttable = cuttableSizeMm(depth, m, s);
        expect(cuttable).to.equal(m === 'turning-specimen' && s !== 'rectangular' ? 2 * depth : depth);
      }),
      { numRuns: RUNS },
    );
  });

  it('fits exactly when the margin is not negative, and the margin is cuttable size − largest size', () => {
    fc.assert(
      fc.property(size, diameter, flange, motion, shape, (sizeMax, d, f, m, s) => {
        const fit = capacityFit(sizeMax, d, f, m, s);
        expect(fit.fits).to.equal(fit.marginMm >= 0);
        expect(fit.marginMm).to.equal(fit.cuttableSizeMm - sizeMax);
        expect(fit.depthMm).to.equal(cuttingDepthMm(d, f));
        for (const n of [fit.depthMm, fit.cuttableSizeMm, fit.marginMm]) expect(Number.isFinite(n)).to.equal(true);
        // A smaller part fits wherever a larger one does.
        if (fit.fits) expect(capacityFit(sizeMax / 2, d, f, m, s).fits).to.equal(true);
      }),
      { numRuns: RUNS },
    );
  });

  it('never throws, whatever numbers, motions or shapes it is given', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(anyNumber, outsidePrimitive), { minLength: 6, maxLength: 6 }), ([a, b, c, d, e, f]) => {
        cuttingDepthMm(a as number, b as number, c as number);
        cuttableSizeMm(a as number, d as CutMotion, e as Shape);
        capacityFit(a as number, b as number, c as number, d as CutMotion, e as Shape, f as number);
      }),
      { numRuns: RUNS },
    );
  });
});
