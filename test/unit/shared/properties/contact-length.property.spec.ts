import { expect } from 'chai';
import fc from 'fast-check';
import {
  circleChordMm,
  contactLengthMm,
  contactProfile,
  cutDepthMm,
  cutTravelMm,
  estimateCutTimeS,
  peakRemovalMm3S,
  PROFILE_SAMPLES,
  PROFILE_SAMPLES_MAX,
  removalRateMm3S,
  ROCKING_CONTACT_FACTOR,
  sectionChordMm,
  traverseContactMm,
  type CutSection,
  type CutSetup,
} from '../../../../shared/contact-length';
import type { CutMotion } from '../../../../shared/vocabulary';
import { above, anyNumber, finite, motion, orNull, outsidePrimitive, realistic, RUNS, shape } from './arbitraries';

/** A section as recipeScope allows it (size up to 2000 mm, a tube's wall below half its diameter), from `min` mm. */
const sectionFrom = (min: (max: number) => fc.Arbitrary<number>): fc.Arbitrary<CutSection> =>
  fc.tuple(shape, min(2000), min(2000), finite(0.001, 0.499)).map(([s, size, width, wallShare]) => ({
    shape: s,
    sizeMm: size,
    widthMm: s === 'rectangular' ? width : null,
    wallMm: s === 'tube' ? wallShare * size : null,
  }));

/** A setup as recipeCutting and wheelBody allow it. */
const setupFrom = (min: (max: number) => fc.Arbitrary<number>): fc.Arbitrary<CutSetup> =>
  fc.record({
    motion,
    feedMmS: min(50),
    entryFeedMmS: orNull(min(50)),
    entryLengthMm: orNull(min(500)),
    passes: orNull(fc.integer({ min: 1, max: 500 })),
    wheelThicknessMm: finite(0.05, 20),
    wheelDiameterMm: finite(10, 1000),
  });

/** Every size and feed the schemas accept, down to 5e-324 (for finiteness). */
const anySection = sectionFrom((max) => above(0, max));
const anySetup = setupFrom((max) => above(0, max));
/** Sizes from 1 µm and feeds from 0.1 µm/s (for the mathematical properties). */
const section = sectionFrom((max) => realistic(1e-3, max));
const setup = setupFrom((max) => realistic(1e-4, max));

/** Widest the section ever is along the wheel's edge: its diameter, or a rectangle's width. */
const widest = (s: CutSection) => (s.shape === 'rectangular' ? s.widthMm! : s.sizeMm);
const PLUNGES: CutMotion[] = ['straight-plunge', 'pulsed-plunge', 'stepped-depth'];
const slack = (v: number) => v * 1e-9 + 1e-9;

describe('shared/contact-length (properties)', () => {
  it('a circle chord is between 0 and the diameter, symmetric about the centre, and 0 outside', () => {
    fc.assert(
      fc.property(above(0, 2000), finite(-10, 1.1), (d, share) => {
        const x = share * d;
        const c = circleChordMm(d, x);
        expect(c)
          .to.be.at.least(0)
          .and.at.most(d + slack(d));
        if (x <= 0 || x >= d) expect(c).to.equal(0);
        else expect(c).to.be.closeTo(circleChordMm(d, d - x), slack(d) * 1e3);
      }),
      { numRuns: RUNS },
    );
  });

  it('a section chord is never negative nor wider than the section', () => {
    fc.assert(
      fc.property(section, finite(-0.1, 1.1), (s, share) => {
        const c = sectionChordMm(s, share * s.sizeMm);
        expect(c)
          .to.be.at.least(-slack(s.sizeMm))
          .and.at.most(widest(s) + slack(widest(s)));
      }),
      { numRuns: RUNS },
    );
  });

  it('the contact length never exceeds the geometric maximum of its model, and is 0 outside the cut', () => {
    fc.assert(
      fc.property(section, setup, finite(-0.1, 1.1), (s, u, share) => {
        const depth = cutDepthMm(s, u.motion);
        const x = share * depth;
        const l = contactLengthMm(s, u, x);
        expect(Number.isFinite(l)).to.equal(true);
        expect(l).to.be.at.least(-slack(s.sizeMm));
        if (x < 0 || x > depth) return void expect(l).to.equal(0);
        const turning = u.motion === 'turning-specimen' && s.shape !== 'rectangular';
        if (PLUNGES.includes(u.motion) || (u.motion === 'turning-specimen' && !turning)) expect(l).to.equal(sectionChordMm(s, x));
        if (u.motion === 'rocking') expect(l).to.be.closeTo(ROCKING_CONTACT_FACTOR * sectionChordMm(s, x), slack(l));
        // Turning: the ring's circumference, at most the part's (π·D).
        if (turning) expect(l).to.be.at.most(Math.PI * s.sizeMm + slack(s.sizeMm));
        // Traverse: √(a·D) with a pass no deeper than the wheel's diameter is at most that diameter.
        if (u.motion === 'traverse-pass') {
          expect(l).to.equal(traverseContactMm(s.sizeMm / (u.passes ?? 1), u.wheelDiameterMm));
          if (s.sizeMm / (u.passes ?? 1) <= u.wheelDiameterMm) expect(l).to.be.at.most(u.wheelDiameterMm + slack(u.wheelDiameterMm));
        } else expect(l).to.be.at.most(Math.PI * widest(s) + slack(widest(s)));
      }),
      { numRuns: RUNS },
    );
  });

  it('the profile has the asked number of finite, non-negative samples from entry to the end of the cut', () => {
    fc.assert(
      fc.property(section, setup, fc.integer({ min: 2, max: 60 }), (s, u, n) => {
        const points = contactProfile(s, u, n);
        expect(points).to.have.length(n);
        expect(points[0]!.depthMm).to.equal(0);
        expect(points[n - 1]!.depthMm).to.be.closeTo(cutDepthMm(s, u.motion), slack(s.sizeMm));
        for (let i = 0; i < n; i++) {
          const p = points[i]!;
          for (const v of [p.depthMm, p.contactMm, p.removalMm3S]) expect(Number.isFinite(v), JSON.stringify(p)).to.equal(true);
          expect(p.removalMm3S).to.be.at.least(-slack(p.removalMm3S + 1) * 1e3);
          if (i > 0) expect(p.depthMm).to.be.above(points[i - 1]!.depthMm);
          if (u.motion !== 'traverse-pass') expect(p.removalMm3S).to.be.closeTo(u.feedMmS * u.wheelThicknessMm * p.contactMm, slack(p.removalMm3S) * 10);
        }
        expect(peakRemovalMm3S(points)).to.equal(Math.max(0, ...points.map((p) => p.removalMm3S)));
      }),
      { numRuns: RUNS },
    );
  });

  it('every value is finite (the time: above 1e-290 mm/s) and not negative for every section and setup the schemas accept', () => {
    fc.assert(
      fc.property(anySection, anySetup, (s, u) => {
        const values = [cutDepthMm(s, u.motion), cutTravelMm(s, u), ...contactProfile(s, u).flatMap((p) => [p.depthMm, p.contactMm, p.removalMm3S])];
        for (const v of values) expect(Number.isFinite(v) && v >= -slack(s.sizeMm), `${v}`).to.equal(true);
        // travel / feed: a feed near 5e-324 mm/s overflows to +∞ (physically right, feed → 0);
        // never NaN nor negative. computeRecipe shows no time then (its own property).
        const t = estimateCutTimeS(s, u);
        expect(t >= 0, `${t}`).to.equal(true);
        if (u.feedMmS >= 1e-290 && (u.entryFeedMmS ?? 1) >= 1e-290) expect(Number.isFinite(t), `${t}`).to.equal(true);
      }),
      { numRuns: RUNS },
    );
  });

  it('the travel is finite and at least the cut depth (a traverse: each pass run in and out); the time is finite, positive and halves when the feed doubles', () => {
    fc.assert(
      fc.property(section, setup, (s, u) => {
        const travel = cutTravelMm(s, u);
        expect(Number.isFinite(travel)).to.equal(true);
        // Plunges feed through the depth; a traverse feeds across the part, running each pass in and out.
        const passes = u.passes ?? 1;
        if (u.motion === 'traverse-pass') expect(travel).to.be.at.least(passes * traverseContactMm(s.sizeMm / passes, u.wheelDiameterMm) * (1 - 1e-12));
        else expect(travel).to.be.at.least(cutDepthMm(s, u.motion) - slack(s.sizeMm));
        const t = estimateCutTimeS(s, u);
        expect(Number.isFinite(t) && t > 0).to.equal(true);
        const plain = { ...u, entryFeedMmS: null, entryLengthMm: null };
        expect(estimateCutTimeS(s, { ...plain, feedMmS: 2 * u.feedMmS })).to.be.closeTo(estimateCutTimeS(s, plain) / 2, slack(t) * 10);
        // A slower entry never makes the cut quicker.
        if (u.entryFeedMmS !== null && u.entryFeedMmS <= u.feedMmS) expect(t).to.be.at.least(estimateCutTimeS(s, plain) * (1 - 1e-12));
      }),
      { numRuns: RUNS },
    );
  });

  it('the turning-specimen model removes the volume of the part (∫ removal dx / feed ≈ section area × kerf)', () => {
    fc.assert(
      fc.property(realistic(1, 200), finite(0.05, 5), realistic(1e-4, 5), (d, kerf, feed) => {
        const bar: CutSection = { shape: 'round-bar', sizeMm: d, widthMm: null, wallMm: null };
        const u: CutSetup = {
          motion: 'turning-specimen',
          feedMmS: feed,
          entryFeedMmS: null,
          entryLengthMm: null,
          passes: null,
          wheelThicknessMm: kerf,
          wheelDiameterMm: 250,
        };
        const pts = contactProfile(bar, u, 401);
        let volume = 0;
        for (let i = 1; i < pts.length; i++) volume += ((pts[i]!.depthMm - pts[i - 1]!.depthMm) * (pts[i]!.removalMm3S + pts[i - 1]!.removalMm3S)) / 2;
        // The ring model is linear in x, so the trapezoid rule is exact: π·D²/4 · kerf.
        expect(volume / feed).to.be.closeTo((Math.PI * d * d * kerf) / 4, ((Math.PI * d * d * kerf) / 4) * 1e-9);
      }),
      { numRuns: RUNS },
    );
  });

  it('never throws, whatever the fields of the section and setup hold (outside values, NaN, ∞, −0)', () => {
    // Primitives only: computeRecipe builds these objects from checked numbers (an object in
    // arithmetic calls its own valueOf, which may throw).
    const anyField = fc.oneof(anyNumber, outsidePrimitive);
    const hostileSection = fc.record({ shape: fc.oneof(shape, outsidePrimitive), sizeMm: anyField, widthMm: anyField, wallMm: anyField });
    // Passes stay within the schema's 500: the traverse travel is summed pass by pass.
    const hostileSetup = fc.record({
      motion: fc.oneof(motion, outsidePrimitive),
      feedMmS: anyField,
      entryFeedMmS: anyField,
      entryLengthMm: anyField,
      passes: fc.oneof(
        anyNumber.filter((n) => !(n > 500)),
        outsidePrimitive.filter((v) => !(typeof v === 'number' && v > 500)),
      ),
      wheelThicknessMm: anyField,
      wheelDiameterMm: anyField,
    });
    fc.assert(
      fc.property(hostileSection, hostileSetup, anyField, (s, u, x) => {
        const sec = s as unknown as CutSection;
        const set = u as unknown as CutSetup;
        circleChordMm(sec.sizeMm, x as number);
        sectionChordMm(sec, x as number);
        cutDepthMm(sec, set.motion);
        traverseContactMm(sec.sizeMm, x as number);
        contactLengthMm(sec, set, x as number);
        removalRateMm3S(sec, set, x as number);
        peakRemovalMm3S(contactProfile(sec, set, 5));
        cutTravelMm(sec, set);
        estimateCutTimeS(sec, set);
      }),
      { numRuns: RUNS },
    );
  });

  it('the number of profile samples is bounded: any requested count gives a profile of finite length', () => {
    const bar: CutSection = { shape: 'round-bar', sizeMm: 40, widthMm: null, wallMm: null };
    const u: CutSetup = {
      motion: 'straight-plunge',
      feedMmS: 0.5,
      entryFeedMmS: null,
      entryLengthMm: null,
      passes: null,
      wheelThicknessMm: 1.5,
      wheelDiameterMm: 250,
    };
    fc.assert(
      fc.property(fc.oneof(anyNumber, fc.constantFrom(1e9, 1e15, 2 ** 40)), (n) => {
        const points = contactProfile(bar, u, n);
        expect(points.length).to.be.at.least(2).and.at.most(PROFILE_SAMPLES_MAX);
        if (!Number.isFinite(n)) expect(points).to.have.length(PROFILE_SAMPLES);
      }),
      { numRuns: 60 },
    );
  });
});
