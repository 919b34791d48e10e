import { expect } from 'chai';
import fc from 'fast-check';
import { CHECK_IDS, runChecks, worstSeverity, type CheckResult, type CheckSeverity } from '../../../../shared/recipe-checks';
import { computeRecipe } from '../../../../shared/recipe-computations';
import { contentLeafPaths } from '../../../../shared/recipe-compare';
import { content as fixtureContent } from '../fixtures';
import { parseWheelSpec } from '../../../../shared/wheel-spec';
import { halfTypedContent, oddText, RUNS_HEAVY, staleChoiceContent, validContent, validContext } from './arbitraries';

const RANK: Record<CheckSeverity, number> = { blocker: 0, warning: 1, note: 2 };
/** The content's field paths (and the hardness window whole), where a check may point. */
const FIELD_PATHS = new Set(contentLeafPaths(fixtureContent()));

function expectWellFormed(results: CheckResult[]): void {
  for (let i = 0; i < results.length; i++) {
    const r = results[i]!;
    expect(CHECK_IDS as readonly string[]).to.include(r.id);
    expect(r.message).to.be.a('string').and.not.equal('');
    expect(r.reason).to.be.a('string').and.not.equal('');
    expect(`${r.message} ${r.reason}`, r.id).not.to.match(/\bNaN\b|\bundefined\b|Infinity|\[object /);
    if (r.path !== null) expect(FIELD_PATHS, r.path).to.include(r.path);
    if (i > 0) expect(RANK[r.severity]).to.be.at.least(RANK[results[i - 1]!.severity]);
  }
}

describe('shared/recipe-checks (properties)', () => {
  it('valid content and stock: known ids, messages in words without NaN, field paths, blockers before warnings before notes', () => {
    fc.assert(
      fc.property(validContent, validContext, (c, ctx) => {
        const results = runChecks(c, ctx);
        expectWellFormed(results);
        expect(runChecks(c, ctx, computeRecipe(c, ctx))).to.deep.equal(results);
        const worst = worstSeverity(results);
        expect(worst).to.equal(results.length ? results[0]!.severity : null);
      }),
      { numRuns: RUNS_HEAVY },
    );
  });

  it('flags what its rule says, exactly: missing stock, overspeed, capacity new and worn, hazardous dust dry, cutting power', () => {
    fc.assert(
      fc.property(validContent, validContext, (c, ctx) => {
        const ids = new Set(runChecks(c, ctx).map((r) => r.id));
        const computed = computeRecipe(c, ctx);
        expect(ids.has('machine-missing')).to.equal(ctx.machine === null);
        expect(ids.has('wheel-missing')).to.equal(ctx.wheel === null);
        expect(ids.has('wheel-overspeed')).to.equal(computed.peripheralSpeedMs !== null && computed.peripheralSpeedMs > computed.markedMaxSpeedMs!);
        expect(ids.has('scope-exceeds-capacity')).to.equal(computed.capacityFits === false);
        expect(ids.has('scope-exceeds-worn-capacity')).to.equal(computed.capacityFits === true && computed.wornWheel?.capacityFits === false);
        expect(ids.has('hazardous-dust-dry')).to.equal(ctx.material?.hazardousDust === true && c.coolant.type === 'dry');
        expect(ids.has('clamping-missing')).to.equal(c.clamping.method === null);
        const p = computed.cutPower;
        const powerKnown = ctx.machine !== null && p !== null && p.peakPowerW !== null;
        expect(ids.has('cutting-power-high')).to.equal(powerKnown && p.motorSharePct !== null && p.motorSharePct > p.warningSharePct);
        expect(ids.has('motor-power-unknown')).to.equal(powerKnown && p.motorSharePct === null);
        expect(ids.has('coolant-flow-zero')).to.equal(c.coolant.type !== 'dry' && c.coolant.flowLMin === 0);
        expect(ids.has('clamping-one-side')).to.equal(
          !c.clamping.bothSides && c.clamping.method !== 'adhesive-wax-mount' && !(ctx.wheel?.kind === 'rim' && ctx.machine?.machineClass === 'precision'),
        );
        expect(ids.has('wheel-exits-coating')).to.equal(
          ctx.material?.coated === true && (c.clamping.wheelPath === 'exits-coating' || c.clamping.wheelPath === 'enters-and-exits-coating'),
        );
        expect(ids.has('wheel-marking-unparsed')).to.equal(false); // valid stock: every marking parses
        // A traverse pass is judged by its removal per mm of wheel width, a plunge by the feed ceilings: never both.
        if (c.cutting.cutMotion === 'traverse-pass') expect(ids.has('feed-above-ceiling')).to.equal(false);
        else expect(ids.has('traverse-removal-above-ceiling')).to.equal(false);
        if (c.cutting.cutMotion !== 'straight-plunge') expect(ids.has('long-plunge-contact')).to.equal(false);
        expect(ids.has('wheel-bond-too-hard') && ids.has('wheel-bond-too-soft')).to.equal(false);
      }),
      { numRuns: RUNS_HEAVY },
    );
  });

  it('a wheel marking that does not parse is said in a note naming the wheel, and the table checks skip it', () => {
    fc.assert(
      // A marking typed as "NaN" would be quoted as typed: left out, so the well-formedness check stays about computed numbers.
      fc.property(
        validContent,
        validContext,
        oddText.filter((m) => !/NaN|undefined|Infinity|\[object/.test(m)),
        (c, ctx, marking) => {
          fc.pre(ctx.wheel !== null);
          const odd = { ...ctx, wheel: { ...ctx.wheel!, specification: marking } };
          const results = runChecks(c, odd);
          expectWellFormed(results);
          const ids = results.map((r) => r.id);
          const parses = parseWheelSpec(marking).ok;
          expect(ids.includes('wheel-marking-unparsed')).to.equal(!parses);
          if (!parses) {
            expect(results.find((r) => r.id === 'wheel-marking-unparsed')!.message).to.contain(`"${odd.wheel.name}"`);
            expect(ids).to.not.include.members(['wheel-abrasive-unsuited', 'wheel-bond-too-hard', 'wheel-bond-too-soft']);
          }
        },
      ),
      { numRuns: RUNS_HEAVY },
    );
  });

  it('a choice the vocabulary does not know (older stored content) never throws; the messages stay in words', () => {
    fc.assert(
      fc.property(staleChoiceContent, validContext, (c, ctx) => {
        expectWellFormed(runChecks(c, ctx));
      }),
      { numRuns: RUNS_HEAVY },
    );
  });

  it('half-typed content (nulls, NaN, ∞, text or objects in any field) never throws, and what it says is well formed', () => {
    fc.assert(
      fc.property(halfTypedContent, validContext, (c, ctx) => {
        const results = runChecks(c, ctx);
        for (const r of results) expect(CHECK_IDS as readonly string[]).to.include(r.id);
        worstSeverity(results);
      }),
      { numRuns: RUNS_HEAVY },
    );
  });
});
