import { expect } from 'chai';
import {
  circleChordMm,
  contactLengthMm,
  contactMeasureOf,
  contactProfile,
  cutTravelMm,
  estimateCutTimeS,
  peakRemovalMm3S,
  removalRateMm3S,
  ROCKING_CONTACT_FACTOR,
  sectionChordMm,
  traverseContactMm,
  type CutSection,
  type CutSetup,
} from '../../../shared/contact-length';

const bar40: CutSection = { shape: 'round-bar', sizeMm: 40, widthMm: null, wallMm: null };
const tube40: CutSection = { shape: 'tube', sizeMm: 40, widthMm: null, wallMm: 5 };
const rect40x25: CutSection = { shape: 'rectangular', sizeMm: 40, widthMm: 25, wallMm: null };
const setup = (over: Partial<CutSetup> = {}): CutSetup => ({
  motion: 'straight-plunge',
  feedMmS: 0.5,
  entryFeedMmS: null,
  entryLengthMm: null,
  passes: null,
  wheelThicknessMm: 1.5,
  wheelDiameterMm: 250,
  ...over,
});

/** Trapezoid rule over a profile: ∫ y dx. */
function integrate(points: { depthMm: number }[], y: (p: never) => number): number {
  let sum = 0;
  for (let i = 1; i < points.length; i++) sum += ((points[i]!.depthMm - points[i - 1]!.depthMm) * (y(points[i] as never) + y(points[i - 1] as never))) / 2;
  return sum;
}

describe('shared/contact-length', () => {
  describe('section chords (hand-computed geometry)', () => {
    it('round bar Ø40: chord 2√(x(D−x))', () => {
      expect(circleChordMm(40, 20)).to.equal(40); // at the centre the chord is the diameter
      expect(circleChordMm(40, 4)).to.equal(24); // 2√(4·36) = 24
      expect(sectionChordMm(bar40, 36)).to.equal(24); // symmetric
      expect(sectionChordMm(bar40, 0)).to.equal(0);
      expect(sectionChordMm(bar40, 40)).to.equal(0);
      expect(sectionChordMm(bar40, 41)).to.equal(0);
    });
    it('tube Ø40 × 5: outer chord minus the bore chord', () => {
      expect(sectionChordMm(tube40, 4)).to.equal(24); // still in the wall: 2√(4·36)
      expect(sectionChordMm(tube40, 20)).to.equal(10); // 40 − 30 = the two walls
      expect(sectionChordMm(tube40, 10)).to.be.closeTo(2 * Math.sqrt(10 * 30) - 2 * Math.sqrt(5 * 25), 1e-12); // 34.641 − 22.361
    });
    it('rectangular 40 × 25: the width all the way', () => {
      expect(sectionChordMm(rect40x25, 0)).to.equal(25);
      expect(sectionChordMm(rect40x25, 40)).to.equal(25);
    });
    it('the chords integrate to the section area (geometry: πD²/4; π(D²−d²)/4)', () => {
      const area = (s: CutSection) => integrate(contactProfile(s, setup(), 20001), (p: { contactMm: number }) => p.contactMm);
      expect(area(bar40)).to.be.closeTo((Math.PI * 40 ** 2) / 4, 0.5);
      expect(area(tube40)).to.be.closeTo((Math.PI * (40 ** 2 - 30 ** 2)) / 4, 0.5);
      expect(area(rect40x25)).to.be.closeTo(1000, 1e-9);
    });
  });

  describe('cut motions (models)', () => {
    it('plunge, pulsed plunge and stepped depth use the section chord', () => {
      for (const motion of ['straight-plunge', 'pulsed-plunge', 'stepped-depth'] as const) expect(contactLengthMm(bar40, setup({ motion }), 20)).to.equal(40);
    });
    it('rocking works a shorter arc: ROCKING_CONTACT_FACTOR × chord (Kerfbook model, common practice)', () => {
      expect(ROCKING_CONTACT_FACTOR).to.equal(0.5);
      expect(contactLengthMm(bar40, setup({ motion: 'rocking' }), 20)).to.equal(20);
    });
    it('turning specimen (Kerfbook model): outside in to the centre, effective length 2π·r, removal conserves volume', () => {
      const s = setup({ motion: 'turning-specimen' });
      expect(contactLengthMm(bar40, s, 0)).to.be.closeTo(2 * Math.PI * 20, 1e-12);
      expect(contactLengthMm(bar40, s, 20)).to.equal(0);
      expect(cutTravelMm(bar40, s)).to.equal(20); // to the centre
      expect(cutTravelMm(tube40, s)).to.equal(5); // through the wall
      // Volume removed = ∫ removal dt = ∫ removal dx / feed = kerf width × section area (geometry).
      const volume = integrate(contactProfile(bar40, s, 20001), (p: { removalMm3S: number }) => p.removalMm3S) / s.feedMmS;
      expect(volume).to.be.closeTo(1.5 * Math.PI * 20 ** 2, 0.5);
      const tubeVolume = integrate(contactProfile(tube40, s, 20001), (p: { removalMm3S: number }) => p.removalMm3S) / s.feedMmS;
      expect(tubeVolume).to.be.closeTo(1.5 * Math.PI * (20 ** 2 - 15 ** 2), 0.5);
    });
    it("a turning part's length figure is an effective removal length per turn, not a contact arc; every other motion's is a contact length", () => {
      expect(contactMeasureOf('round-bar', 'turning-specimen')).to.equal('removal-length-per-turn');
      expect(contactMeasureOf('tube', 'turning-specimen')).to.equal('removal-length-per-turn');
      expect(contactMeasureOf('rectangular', 'turning-specimen')).to.equal('contact-length'); // a turned rectangle is a plunge
      for (const motion of ['straight-plunge', 'pulsed-plunge', 'rocking', 'traverse-pass', 'stepped-depth'] as const)
        expect(contactMeasureOf('round-bar', motion), motion).to.equal('contact-length');
      // Per turn the wheel clears the ring at radius r: at the tube's surface (r = 20 mm) 2π·20 = 125.66 mm, far longer than the Ø40 part.
      expect(contactLengthMm(tube40, setup({ motion: 'turning-specimen' }), 0)).to.be.closeTo(125.663706, 1e-6);
    });
    it('plunge removal also conserves volume (kerf × πD²/4)', () => {
      const s = setup();
      const volume = integrate(contactProfile(bar40, s, 20001), (p: { removalMm3S: number }) => p.removalMm3S) / s.feedMmS;
      expect(volume).to.be.closeTo(1.5 * Math.PI * 400, 0.5);
    });
    it('traverse pass: l = √(a·D_wheel) (Malkin & Guo, Grinding Technology — from memory), removal = feed × thickness × a', () => {
      expect(traverseContactMm(5, 250)).to.be.closeTo(35.35534, 1e-5); // √(5·250) = √1250, computed by hand
      const s = setup({ motion: 'traverse-pass', passes: 8, feedMmS: 2 });
      expect(contactLengthMm(rect40x25, s, 12)).to.be.closeTo(Math.sqrt(5 * 250), 1e-12);
      expect(removalRateMm3S(rect40x25, s, 12)).to.equal(2 * 1.5 * 5); // 15 mm³/s, computed by hand
    });
  });

  describe('removal profile', () => {
    it('samples N depths from entry to the end; peak = feed × thickness × largest chord', () => {
      const pts = contactProfile(bar40, setup(), 41);
      expect(pts).to.have.length(41);
      expect(pts[0]!.depthMm).to.equal(0);
      expect(pts[40]!.depthMm).to.equal(40);
      expect(pts[20]!.contactMm).to.equal(40);
      expect(peakRemovalMm3S(pts)).to.equal(0.5 * 1.5 * 40); // 30 mm³/s, hand-computed
      expect(pts[4]!.depthMm).to.equal(4); // 41 samples over 40 mm → 1 mm steps
      expect(pts[4]!.removalMm3S).to.be.closeTo(0.5 * 1.5 * 24, 1e-12); // chord 24 mm at 4 mm depth
    });
  });

  describe('cutting time (worked examples, hand-computed)', () => {
    it('entry length / entry feed + remaining travel / feed', () => {
      // Ø40 bar, 2 mm at 0.1 mm/s, then 38 mm at 0.5 mm/s: 20 s + 76 s = 96 s
      expect(estimateCutTimeS(bar40, setup({ entryFeedMmS: 0.1, entryLengthMm: 2 }))).to.be.closeTo(96, 1e-9);
      expect(estimateCutTimeS(bar40, setup())).to.equal(80); // 40 mm / 0.5 mm/s
      expect(estimateCutTimeS(bar40, setup({ entryFeedMmS: 0.1, entryLengthMm: 100 }))).to.be.closeTo(400, 1e-9); // entry capped at the travel
    });
    it('stepped depth re-enters the cut kerf at feed: travel H·(N+1)/2', () => {
      expect(cutTravelMm(bar40, setup({ motion: 'stepped-depth', passes: 4 }))).to.equal(100); // 10 + 20 + 30 + 40
      expect(estimateCutTimeS(bar40, setup({ motion: 'stepped-depth', passes: 4 }))).to.equal(200);
    });
    it('turning specimen travels to the centre only', () => {
      expect(estimateCutTimeS(bar40, setup({ motion: 'turning-specimen' }))).to.equal(40); // 20 mm / 0.5 mm/s
    });
    it('traverse pass: per pass, the part width plus √(a·D)', () => {
      const s = setup({ motion: 'traverse-pass', passes: 8, feedMmS: 2 });
      const perPass = 25 + Math.sqrt(5 * 250);
      expect(cutTravelMm(rect40x25, s)).to.be.closeTo(8 * perPass, 1e-9);
      expect(estimateCutTimeS(rect40x25, s)).to.be.closeTo((8 * perPass) / 2, 1e-9); // 241.42 s
      // A round bar's widest extent in the middle band is its diameter.
      expect(cutTravelMm(bar40, setup({ motion: 'traverse-pass', passes: 2 }))).to.be.closeTo(2 * (40 + Math.sqrt(20 * 250)), 1e-9);
    });
  });
});
