/** Example tests for the bugs the property specs in this folder found (each fixed in shared/). */
import { expect } from 'chai';
import { contactProfile, cutTravelMm, PROFILE_SAMPLES, PROFILE_SAMPLES_MAX } from '../../../../shared/contact-length';
import { conversionApplies, convertHardness } from '../../../../shared/hardness';
import { runChecks } from '../../../../shared/recipe-checks';
import { computeRecipe } from '../../../../shared/recipe-computations';
import type { MaterialGroup } from '../../../../shared/vocabulary';
import { parseWheelSpec } from '../../../../shared/wheel-spec';
import { content, ctx, material } from '../fixtures';

describe('shared/ regressions found by the property specs', () => {
  it('parseWheelSpec refuses a value that is not text instead of throwing ("input.replace is not a function")', () => {
    for (const v of [null, undefined, 42, false, {}, ['A60K5V']]) {
      const r = parseWheelSpec(v as unknown as string);
      expect(r).to.deep.equal({ ok: false, error: 'Give the wheel marking, e.g. A60K5V.' });
    }
  });

  it('a group named like an Object property gets the plain reason, not Object.prototype', () => {
    for (const g of ['__proto__', 'constructor', 'toString']) {
      const a = conversionApplies(g as MaterialGroup);
      expect(a.applies).to.equal(false);
      if (!a.applies)
        expect(a.reason).to.equal(
          'Kerfbook includes only the conversion tables for non-austenitic steels (ASTM E140, Tables 1 and 2); the standard has tables for some other materials, which Kerfbook does not include, so this material keeps its measured scale.',
        );
      const c = convertHardness(30, 'HRC', 'HV', g as MaterialGroup);
      expect(!c.ok && typeof c.reason).to.equal('string');
    }
  });

  it('contactProfile bounds its sample count (1e15 exhausted the heap) and uses the default for a non-finite one', () => {
    const bar = { shape: 'round-bar' as const, sizeMm: 40, widthMm: null, wallMm: null };
    const setup = {
      motion: 'straight-plunge' as const,
      feedMmS: 0.5,
      entryFeedMmS: null,
      entryLengthMm: null,
      passes: null,
      wheelThicknessMm: 1.5,
      wheelDiameterMm: 250,
    };
    expect(contactProfile(bar, setup, 1e15)).to.have.length(PROFILE_SAMPLES_MAX);
    expect(contactProfile(bar, setup, NaN)).to.have.length(PROFILE_SAMPLES);
    expect(contactProfile(bar, setup, 20001)).to.have.length(20001);
  });

  it('a pass count that is not a number counts as one pass (the text "1e999" made a traverse loop forever and hung the property run)', () => {
    const bar = { shape: 'round-bar' as const, sizeMm: 40, widthMm: null, wallMm: null };
    const setup = { motion: 'stepped-depth' as const, feedMmS: 0.5, entryFeedMmS: null, entryLengthMm: null, wheelThicknessMm: 1.5, wheelDiameterMm: 250 };
    // Stepped depth with one step travels the depth once: 40 mm (no loop, so today's code answers instead of hanging).
    for (const passes of ['1e999', '3', Infinity, NaN]) {
      expect(cutTravelMm(bar, { ...setup, passes: passes as unknown as number })).to.equal(40);
    }
  });

  it('computeRecipe gives no time for 1e9 traverse passes (it summed them one by one: minutes of frozen editor)', () => {
    const r = computeRecipe(content({ cutting: { cutMotion: 'traverse-pass', passes: 1e9 } }), ctx());
    expect(r.cutTimeS).to.equal(null);
    expect(r.profile).to.equal(null);
    expect(computeRecipe(content({ cutting: { cutMotion: 'traverse-pass', passes: 500 } }), ctx()).cutTimeS).to.be.a('number');
  });

  it('computeRecipe gives no time, rather than Infinity, for a feed of 5e-324 mm/s (valid: more than 0)', () => {
    expect(computeRecipe(content({ cutting: { feedMmS: Number.MIN_VALUE } }), ctx()).cutTimeS).to.equal(null);
  });

  it('runChecks takes a half-typed orientation rule that is not text ("trim is not a function")', () => {
    const coated = ctx({ material: material({ coated: true }) });
    for (const rule of [42, NaN, {}, true]) {
      const ids = runChecks(content({ clamping: { orientationRule: rule as unknown as string } }), coated).map((r) => r.id);
      expect(ids).to.include('orientation-rule-missing');
    }
  });
});

describe('shared/ regressions: ids the vocabulary does not know (content stored under an older vocabulary)', () => {
  it('runChecks names an unknown cut motion or clamping method as it is, instead of throwing on its missing label', () => {
    const stale = content({ cutting: { cutMotion: 'band-saw' as never }, clamping: { method: 'magnet' as never } });
    const results = runChecks(stale, ctx());
    expect(results.find((r) => r.id === 'cut-motion-unsupported')!.message).to.equal('Bench saw cannot cut with band-saw.');
    expect(results.find((r) => r.id === 'clamping-unsupported')!.message).to.equal('Bench saw has no magnet.');
  });

  it('runChecks does not read a feed ceiling from an inherited key ("constructor")', () => {
    const results = runChecks(content({ scope: { group: 'constructor' as never } }), ctx({ material: null }));
    expect(results.map((r) => r.id)).to.not.include('feed-above-ceiling');
  });

  it('computeRecipe treats an unknown motion or shape as not chosen: no profile, no time, no NaN', () => {
    for (const over of [{ cutting: { cutMotion: 'band-saw' as never } }, { scope: { shape: 'hexagon' as never } }]) {
      const r = computeRecipe(content(over), ctx());
      expect(r.profile).to.equal(null);
      expect(r.cutTimeS).to.equal(null);
      expect(r.capacityFits).to.equal(null);
      expect(r.peripheralSpeedMs).to.be.a('number');
    }
  });
});
