import { expect } from 'chai';
import { capacityFit, cuttableSizeMm, cuttingDepthMm, CUT_CLEARANCE_MM } from '../../../shared/capacity';

describe('shared/capacity', () => {
  it('depth = (D − flange)/2 − clearance (the flanges cannot enter the cut; the 5 mm clearance is common practice)', () => {
    expect(CUT_CLEARANCE_MM).to.equal(5);
    expect(cuttingDepthMm(250, 80)).to.equal(80); // hand-computed: (250 − 80)/2 − 5
    expect(cuttingDepthMm(350, 100)).to.equal(120); // hand-computed: (350 − 100)/2 − 5
    expect(cuttingDepthMm(250, 80, 0)).to.equal(85); // hand-computed: (250 − 80)/2
    expect(cuttingDepthMm(100, 95)).to.equal(0); // never negative
  });

  it('a turning specimen roughly doubles the cuttable diameter of round parts only (Kerfbook model: the wheel only has to reach the centre)', () => {
    expect(cuttableSizeMm(80, 'straight-plunge', 'round-bar')).to.equal(80);
    expect(cuttableSizeMm(80, 'turning-specimen', 'round-bar')).to.equal(160);
    expect(cuttableSizeMm(80, 'turning-specimen', 'tube')).to.equal(160);
    expect(cuttableSizeMm(80, 'turning-specimen', 'rectangular')).to.equal(80);
  });

  it('says whether the size window fits, with the margin', () => {
    expect(capacityFit(40, 250, 80, 'straight-plunge', 'round-bar')).to.deep.equal({ depthMm: 80, cuttableSizeMm: 80, fits: true, marginMm: 40 }); // hand-computed: 80 − 40
    expect(capacityFit(80, 250, 80, 'straight-plunge', 'round-bar').fits).to.equal(true); // exactly at capacity
    expect(capacityFit(81, 250, 80, 'straight-plunge', 'round-bar').fits).to.equal(false);
    expect(capacityFit(120, 250, 80, 'turning-specimen', 'round-bar').fits).to.equal(true); // 120 ≤ 2 × 80 (Kerfbook model)
  });
});
