import { expect } from 'chai';
import fc from 'fast-check';
import { capacityFit } from '../../../../shared/capacity';
import { peripheralSpeedMs } from '../../../../shared/peripheral-speed';
import type { RecipeContext } from '../../../../shared/recipe-context';
import { computeRecipe } from '../../../../shared/recipe-computations';
import { msToFtMin } from '../../../../shared/units';
import { content as fixtureContent, ctx as fixtureCtx, machine as fixtureMachine } from '../fixtures';
import { halfTypedContent, numbersIn, RUNS, staleChoiceContent, validContent, validContext } from './arbitraries';

/** Every computed number of a result is finite; says which one is not. `hardness.measured` echoes the input window as typed. */
function expectFinite(value: unknown): void {
  for (const [path, n] of numbersIn(value)) if (!path.startsWith('hardness.measured.')) expect(Number.isFinite(n), `${path} = ${n}`).to.equal(true);
}

describe('shared/recipe-computations (properties)', () => {
  it('valid content with valid stock gives only finite numbers, or null where an input is missing', () => {
    fc.assert(
      fc.property(validContent, validContext, (c, ctx) => {
        const r = computeRecipe(c, ctx);
        expectFinite(r);
        expect(r.peripheralSpeedMs === null).to.equal(ctx.wheel === null);
        expect(r.capacityFits === null).to.equal(ctx.wheel === null || ctx.machine === null);
        // No time also where a feed near 5e-324 mm/s (valid: more than 0) would overflow it.
        if (ctx.wheel === null || (c.cutting.feedMmS >= 1e-290 && (c.cutting.entryFeedMmS ?? 1) >= 1e-290))
          expect(r.cutTimeS === null).to.equal(ctx.wheel === null);
        expect(r.profile === null).to.equal(ctx.wheel === null);
        expect(r.hardness === null).to.equal(c.scope.hardness === null && !ctx.material?.hardness);
        expect(r.cutPower === null).to.equal(r.profile === null);
        // Power, force, chip thickness and the motor share are never negative.
        for (const [path, n] of numbersIn(r.cutPower)) expect(n, `cutPower.${path}`).to.be.at.least(0);
      }),
      { numRuns: RUNS },
    );
  });

  it('agrees with the single computations it is made of (speed, ft/min, margin, capacity, peak)', () => {
    fc.assert(
      fc.property(validContent, validContext, (c, ctx) => {
        const r = computeRecipe(c, ctx);
        if (ctx.wheel) {
          expect(r.peripheralSpeedMs).to.equal(peripheralSpeedMs(ctx.wheel.diameterMm, c.cutting.wheelRpm));
          expect(r.peripheralSpeedFtMin).to.equal(msToFtMin(r.peripheralSpeedMs!));
          expect(r.speedMarginMs! + r.peripheralSpeedMs!).to.be.closeTo(ctx.wheel.maxSpeedMs, 1e-9 * ctx.wheel.maxSpeedMs);
          expect(peripheralSpeedMs(ctx.wheel.diameterMm, r.rpmAtMarkedMax!)).to.be.at.most(ctx.wheel.maxSpeedMs * (1 + 1e-9));
          expect(r.peakRemovalMm3S).to.equal(Math.max(0, ...r.profile!.map((p) => p.removalMm3S)));
        }
        if (ctx.wheel && ctx.machine) {
          const fit = capacityFit(c.scope, {
            wheelDiameterMm: ctx.wheel.diameterMm,
            flangeDiameterMm: ctx.machine.flangeDiameterMm,
            feedDirection: ctx.machine.feedDirection,
            motion: c.cutting.cutMotion,
          })!;
          expect(r.capacityFits).to.equal(fit.fits);
          expect(r.capacityMarginMm).to.equal(fit.marginMm);
          expect(r.capacityLimit).to.equal(fit.limit);
        }
        if (r.hardness && r.hardness.minHv !== null && r.hardness.maxHv !== null) expect(r.hardness.minHv).to.be.at.most(r.hardness.maxHv + 1e-9);
        const p = r.cutPower;
        if (p && p.peakPowerW !== null) {
          // P = Q · u at the peak and at every depth (Malkin & Guo, Grinding Technology, 2nd ed.).
          expect(p.peakPowerW).to.equal(r.peakRemovalMm3S! * p.specificEnergyJMm3!);
          expect(p.powerProfile!.map((x) => x.depthMm)).to.deep.equal(r.profile!.map((x) => x.depthMm));
          if (p.peakTangentialForceN !== null) expect(p.peakTangentialForceN).to.equal(p.peakPowerW / r.peripheralSpeedMs!);
        }
        if (p && p.peakChipThicknessUm !== null) expect(p.peakChipThicknessUm).to.equal(p.peakRemovalPerWidthMm2S! / r.peripheralSpeedMs!);
      }),
      { numRuns: RUNS },
    );
  });

  it('the worn wheel: smaller than new, never cuts more, runs slower at the same rpm; the held rpm keeps within every cap', () => {
    fc.assert(
      fc.property(validContent, validContext, (c, ctx) => {
        const r = computeRecipe(c, ctx);
        const w = r.wornWheel;
        expect(w === null).to.equal(ctx.wheel === null);
        if (!ctx.wheel || !w) return;
        expect(r.kerfLossMm).to.equal(ctx.wheel.thicknessMm + ctx.limits.kerfAllowanceMm);
        // Only a rim wheel without its own smallest diameter has none.
        expect(w.diameterMm === null).to.equal(ctx.wheel.kind === 'rim' && ctx.wheel.minUsableDiameterMm === null);
        if (w.diameterMm === null) return;
        expect(w.diameterMm).to.be.below(ctx.wheel.diameterMm);
        expect(w.source).to.equal(ctx.wheel.minUsableDiameterMm === null ? 'lab-default' : 'wheel');
        expect(w.peripheralSpeedMs!).to.be.at.most(r.peripheralSpeedMs!); // below, where the rpm is not so small both are 0
        expect(w.rpmToHoldSpeed!).to.be.closeTo((c.cutting.wheelRpm * ctx.wheel.diameterMm) / w.diameterMm, 1e-9 * w.rpmToHoldSpeed!);
        expect(w.heldRpm!).to.be.at.most(w.rpmToHoldSpeed! * (1 + 1e-12));
        // Never above the marked maximum at the worn diameter, nor the machine's top speed or limit.
        if (w.heldRpm! >= 1) expect(w.heldSpeedMs!).to.be.at.most(ctx.wheel.maxSpeedMs * (1 + 1e-9));
        if (ctx.machine && w.heldRpm! >= 1) {
          expect(w.heldRpm!).to.be.at.most(ctx.machine.rpmMax);
          if (ctx.machine.spindleLimitRpm !== null) expect(w.heldRpm!).to.be.at.most(ctx.machine.spindleLimitRpm);
        }
        if (r.capacityFits !== null) {
          expect(w.cuttableSizeMm!).to.be.at.most(r.cuttableSizeMm! + 1e-9);
          if (w.capacityFits) expect(r.capacityFits).to.equal(true);
        }
      }),
      { numRuns: RUNS },
    );
  });

  it('a faster spindle never lowers the peripheral speed nor raises the margin', () => {
    fc.assert(
      fc.property(validContent, fc.double({ min: 1, max: 2, noNaN: true }), (c, factor) => {
        const ctx = fixtureCtx();
        const slow = computeRecipe(c, ctx);
        const fast = computeRecipe({ ...c, cutting: { ...c.cutting, wheelRpm: c.cutting.wheelRpm * factor } }, ctx);
        expect(fast.peripheralSpeedMs!).to.be.at.least(slow.peripheralSpeedMs!);
        expect(fast.speedMarginMs!).to.be.at.most(slow.speedMarginMs!);
      }),
      { numRuns: RUNS },
    );
  });

  it('a larger specific energy never lowers the power, the force or the motor share, and leaves the chip thickness as it is', () => {
    fc.assert(
      fc.property(validContent, fc.double({ min: 0.1, max: 1000, noNaN: true }), fc.double({ min: 1, max: 3, noNaN: true }), (c, u, factor) => {
        const at = (energy: number) =>
          computeRecipe(
            c,
            fixtureCtx({
              machine: fixtureMachine({ motorPowerKw: 5.5 }),
              limits: { ...fixtureCtx().limits, specificEnergyJMm3: { [c.scope.group]: energy } },
            }),
          ).cutPower!;
        const low = at(u);
        const high = at(u * factor);
        expect(high.peakPowerW!).to.be.at.least(low.peakPowerW!);
        // A peripheral speed too small to divide by (5e-324 rpm) gives no force at either energy.
        expect(high.peakTangentialForceN === null).to.equal(low.peakTangentialForceN === null);
        if (low.peakTangentialForceN !== null) expect(high.peakTangentialForceN!).to.be.at.least(low.peakTangentialForceN);
        expect(high.motorSharePct!).to.be.at.least(low.motorSharePct!);
        expect(high.peakChipThicknessUm).to.equal(low.peakChipThicknessUm);
        high.powerProfile!.forEach((x, i) => expect(x.powerW).to.be.at.least(low.powerProfile![i]!.powerW));
      }),
      { numRuns: RUNS },
    );
  });

  // Beyond ±1e6 a half-typed number may overflow (1e308 rpm is ∞ m/s; 1e308 mm × a 5e-324 feed is
  // ∞ × 0 = NaN in the plot): the form refuses those values, and no throw is the promise there.
  it('half-typed content (nulls, NaN, ∞, text or objects in any field) never throws; up to ±1e6 the numbers stay finite or null', () => {
    fc.assert(
      fc.property(halfTypedContent, validContext, (c, ctx) => {
        const r = computeRecipe(c, ctx);
        if (numbersIn(c).every(([, n]) => !(Math.abs(n) > 1e6))) expectFinite(r);
      }),
      { numRuns: RUNS },
    );
  });

  it('a feed just above 0 (valid, more than 0 mm/s) gives no time rather than ∞ (regression)', () => {
    const r = computeRecipe(fixtureContent({ cutting: { feedMmS: Number.MIN_VALUE } }), fixtureCtx());
    expect(r.cutTimeS).to.equal(null);
    expect(r.peripheralSpeedMs).to.be.a('number');
  });

  it('a choice the vocabulary does not know (shape, motion, group: older stored content) gives null or finite values, never NaN', () => {
    fc.assert(
      fc.property(staleChoiceContent, validContext, (c, ctx) => {
        expectFinite(computeRecipe(c, ctx));
      }),
      { numRuns: RUNS },
    );
  });

  it('a pass count outside 1–500 gives no time rather than a frozen editor (regression: 1e9 passes looped 1e9 times)', () => {
    fc.assert(
      fc.property(fc.oneof(fc.double({ min: 501, max: Number.MAX_VALUE, noNaN: true }), fc.constantFrom(0, -1, 2.5, NaN, Infinity)), (passes) => {
        const r = computeRecipe(fixtureContent({ cutting: { cutMotion: 'traverse-pass', passes } }), fixtureCtx());
        expect(r.cutTimeS).to.equal(null);
        expect(r.profile).to.equal(null);
        expect(r.peripheralSpeedMs).to.be.a('number');
      }),
      { numRuns: 50 },
    );
  });

  it('stock records holding odd numbers (0, NaN, ∞, negative) give null or finite values, never a throw', () => {
    const odd = fc.constantFrom(0, -1, NaN, Infinity, -Infinity, Number.MIN_VALUE);
    fc.assert(
      fc.property(
        validContent,
        validContext,
        fc.record({ diameterMm: odd, thicknessMm: odd, maxSpeedMs: odd }, { requiredKeys: [] }),
        fc.record({ flangeDiameterMm: odd }, { requiredKeys: [] }),
        (c, ctx, w, m) => {
          const odd: RecipeContext = { ...ctx, wheel: ctx.wheel && { ...ctx.wheel, ...w }, machine: ctx.machine && { ...ctx.machine, ...m } };
          const r = computeRecipe(c, odd);
          for (const [path, n] of numbersIn(r)) expect(Number.isNaN(n), `${path} = ${n}`).to.equal(false);
        },
      ),
      { numRuns: RUNS },
    );
  });
});
