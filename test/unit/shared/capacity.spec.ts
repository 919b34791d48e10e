import { expect } from 'chai';
import {
  capacityFit,
  capacityLimitOf,
  chordDepthMm,
  cuttingDepthMm,
  CUT_CLEARANCE_MM,
  smallestWheelDiameterMm,
  type CapacityPart,
  type CapacitySetup,
} from '../../../shared/capacity';

const bar = (sizeMaxMm: number): CapacityPart => ({ shape: 'round-bar', sizeMaxMm, widthMm: null, wallMm: null });
const tube = (sizeMaxMm: number, wallMm: number): CapacityPart => ({ shape: 'tube', sizeMaxMm, widthMm: null, wallMm });
const block = (heightMm: number, widthMm: number): CapacityPart => ({ shape: 'rectangular', sizeMaxMm: heightMm, widthMm, wallMm: null });
/** The floor saw of the worked example: a 350 mm wheel between 100 mm flanges, coming down into the part. */
const floorSaw = (over: Partial<CapacitySetup> = {}): CapacitySetup => ({
  wheelDiameterMm: 350,
  flangeDiameterMm: 100,
  feedDirection: 'wheel-down',
  motion: 'straight-plunge',
  ...over,
});

describe('shared/capacity', () => {
  it('depth = (D − flange)/2 − clearance (the flanges cannot enter the cut; the 5 mm clearance is common practice)', () => {
    expect(CUT_CLEARANCE_MM).to.equal(5);
    expect(cuttingDepthMm(250, 80)).to.equal(80); // hand-computed: (250 − 80)/2 − 5
    expect(cuttingDepthMm(350, 100)).to.equal(120); // hand-computed: (350 − 100)/2 − 5
    expect(cuttingDepthMm(250, 80, 0)).to.equal(85); // hand-computed: (250 − 80)/2
    expect(cuttingDepthMm(100, 95)).to.equal(0); // never negative
  });

  describe('a wheel coming down into a wide section (geometry, computed by hand)', () => {
    it('the 350 mm wheel with 100 mm flanges cuts a 200 mm wide block only up to √(175² − 100²) − 50 − 5 = 88.6 mm, not the 120 mm of a thin section', () => {
      // √(30 625 − 10 000) = √20 625 = 143.614 066; − 50 (flange radius) = 93.614 066; − 5 (clearance) = 88.614 066.
      expect(chordDepthMm(350, 100, 200)).to.be.closeTo(88.614066, 1e-6);
      expect(chordDepthMm(350, 100, 200, 0)).to.be.closeTo(93.614066, 1e-6); // before the clearance
      const fit = capacityFit(block(120, 200), floorSaw())!;
      expect(fit).to.deep.include({ limit: 'chord', depthMm: 120, partMm: 120, fits: false });
      expect(fit.cuttableSizeMm).to.be.closeTo(88.614066, 1e-6);
      expect(fit.marginMm).to.be.closeTo(88.614066 - 120, 1e-6);
      expect(capacityFit(block(88, 200), floorSaw())!.fits).to.equal(true);
      expect(capacityFit(block(89, 200), floorSaw())!.fits).to.equal(false);
    });

    it('a section of no width gives the thin-section depth; one as wide as the wheel cannot be cut through', () => {
      expect(chordDepthMm(350, 100, 0)).to.equal(120); // √(175²) − 50 − 5
      expect(chordDepthMm(350, 100, 350)).to.equal(0); // the edge at ±175 mm is level with the centre
      expect(chordDepthMm(350, 100, 340)).to.equal(0); // √(175² − 170²) = 41.5 mm, below flange radius + clearance: nothing
    });

    it('every motion that comes down into a rectangle is judged by its corners, rocking included (no credit for the stroke); a traverse pass is not', () => {
      for (const motion of ['straight-plunge', 'pulsed-plunge', 'stepped-depth', 'rocking', 'turning-specimen'] as const)
        expect(capacityLimitOf(motion, 'rectangular', 'wheel-down'), motion).to.equal('chord');
      // The last traverse pass runs the rim along the whole bottom: only the height counts, (350 − 100)/2 − 5 = 120 mm.
      expect(capacityFit(block(120, 200), floorSaw({ motion: 'traverse-pass' }))).to.deep.include({ limit: 'radius', cuttableSizeMm: 120, fits: true });
    });

    it('a round bar keeps (D − flange)/2 − clearance: by the distance of centres its widest point is inside the wheel', () => {
      // Ø120 bar, centre s below the wheel's: rim reaches the bottom when s + 60 ≤ 175, flange clears the top
      // when s − 60 ≥ 50 + 5; s = 115 satisfies both, exactly: 120 = 175 − 50 − 5. Computed by hand.
      expect(capacityFit(bar(120), floorSaw())).to.deep.include({ limit: 'radius', cuttableSizeMm: 120, fits: true, marginMm: 0 });
      expect(capacityFit(bar(121), floorSaw())!.fits).to.equal(false);
      expect(capacityFit(tube(120, 3), floorSaw())).to.deep.include({ limit: 'radius', cuttableSizeMm: 120, partMm: 120, fits: true });
    });

    it('needs the width: without it the capacity is not known', () => {
      expect(capacityFit(block(50, null as unknown as number), floorSaw())).to.equal(null);
      expect(smallestWheelDiameterMm({ shape: 'rectangular', sizeMaxMm: 50, widthMm: null, wallMm: null }, floorSaw())).to.equal(null);
    });
  });

  it('a part fed horizontally into the wheel: the width lies along the feed and does not limit the height, H ≤ R − r_f − c', () => {
    const fit = capacityFit(block(120, 200), floorSaw({ feedDirection: 'part-horizontal' }))!;
    expect(fit).to.deep.include({ limit: 'radius', depthMm: 120, cuttableSizeMm: 120, fits: true, marginMm: 0 }); // 175 − 50 − 5, computed by hand
    expect(capacityFit(block(120, 1000), floorSaw({ feedDirection: 'part-horizontal' }))!.fits).to.equal(true); // however long along the feed
    expect(capacityFit(block(121, 10), floorSaw({ feedDirection: 'part-horizontal' }))!.fits).to.equal(false);
  });

  describe('turning specimen (geometry, computed by hand)', () => {
    it('a turned round bar is cut through when the rim reaches its centre: d ≤ 2·depth', () => {
      expect(capacityFit(bar(160), { ...floorSaw(), wheelDiameterMm: 250, flangeDiameterMm: 80, motion: 'turning-specimen' })).to.deep.include({
        limit: 'turned-to-centre',
        depthMm: 80, // (250 − 80)/2 − 5
        cuttableSizeMm: 160, // 2 × 80
        fits: true,
      });
      expect(capacityFit(bar(161), { ...floorSaw(), wheelDiameterMm: 250, flangeDiameterMm: 80, motion: 'turning-specimen' })!.fits).to.equal(false);
    });

    it('a 200 mm tube with a 5 mm wall turned on a 250 mm wheel fits: only the wall must be within the depth (it was blocked as a 200 mm bar)', () => {
      const fit = capacityFit(tube(200, 5), { ...floorSaw(), wheelDiameterMm: 250, flangeDiameterMm: 80, motion: 'turning-specimen' })!;
      // depth (250 − 80)/2 − 5 = 80 mm; wall 5 mm ≤ 80 mm, 75 mm to spare. Computed by hand.
      expect(fit).to.deep.equal({ limit: 'turned-through-wall', depthMm: 80, cuttableSizeMm: 80, partMm: 5, fits: true, marginMm: 75 });
      expect(capacityFit(tube(200, 81), { ...floorSaw(), wheelDiameterMm: 250, flangeDiameterMm: 80, motion: 'turning-specimen' })!.fits).to.equal(false);
      expect(capacityFit({ ...tube(200, 5), wallMm: null }, { ...floorSaw(), motion: 'turning-specimen' })).to.equal(null);
    });

    it('the feed direction does not change a turned part: the rim reaches in radially either way', () => {
      for (const feedDirection of ['wheel-down', 'part-horizontal'] as const) {
        expect(capacityLimitOf('turning-specimen', 'round-bar', feedDirection)).to.equal('turned-to-centre');
        expect(capacityLimitOf('turning-specimen', 'tube', feedDirection)).to.equal('turned-through-wall');
      }
      expect(capacityLimitOf('turning-specimen', 'rectangular', 'part-horizontal')).to.equal('radius'); // a turned rectangle is a plunge
    });
  });

  it('the smallest wheel that still cuts the part: each limit solved for D (computed by hand)', () => {
    expect(smallestWheelDiameterMm(block(120, 200), floorSaw())).to.be.closeTo(403.112887, 1e-6); // 2·√((120 + 50 + 5)² + 100²) = 2·√40 625
    expect(smallestWheelDiameterMm(bar(60), floorSaw())).to.equal(230); // 2·(60 + 5) + 100
    expect(smallestWheelDiameterMm(bar(240), floorSaw({ motion: 'turning-specimen' }))).to.equal(350); // 240 + 100 + 2·5
    expect(smallestWheelDiameterMm(tube(200, 5), floorSaw({ flangeDiameterMm: 80, motion: 'turning-specimen' }))).to.equal(100); // 2·(5 + 5) + 80
    // And each is exactly at capacity.
    for (const [part, setup] of [
      [block(120, 200), floorSaw()],
      [bar(60), floorSaw()],
      [bar(240), floorSaw({ motion: 'turning-specimen' })],
    ] as const) {
      const d = smallestWheelDiameterMm(part, setup)!;
      expect(capacityFit(part, { ...setup, wheelDiameterMm: d })!.marginMm).to.be.closeTo(0, 1e-9);
    }
  });
});
