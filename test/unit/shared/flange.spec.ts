/**
 * Flange diameter against a cut-off wheel: at least one-fourth of the wheel diameter (Type 1
 * cutting-off wheels: Cal. Code Regs. tit. 8 §3579(a) exception 9(A), following ANSI B7.1;
 * OSHA 29 CFR 1910.215(c)(1) asks one-third of most other wheels). Worked by hand.
 */
import { expect } from 'chai';
import { CUTOFF_FLANGE_MIN_SHARE, flangeTooSmall, minFlangeDiameterMm } from '../../../shared/flange';

describe('shared/flange', () => {
  it('the share is one-fourth, not the one-third of other abrasive wheels', () => {
    expect(CUTOFF_FLANGE_MIN_SHARE).to.equal(0.25);
  });
  it('minimum flange: 350 mm → 87.5 mm, 250 mm → 62.5 mm, 200 mm → 50 mm', () => {
    expect(minFlangeDiameterMm(350)).to.equal(87.5);
    expect(minFlangeDiameterMm(250)).to.equal(62.5);
    expect(minFlangeDiameterMm(200)).to.equal(50);
  });
  it('a 100 mm flange holds a 350 mm wheel; a 70 mm flange a 250 mm wheel (the demo saws)', () => {
    expect(flangeTooSmall(100, 350)).to.equal(false);
    expect(flangeTooSmall(70, 250)).to.equal(false);
  });
  it('the exact boundary: a 50 mm flange is enough for a 200 mm wheel, 49.9 mm is not, nor 50 mm for 200.1 mm', () => {
    expect(flangeTooSmall(50, 200)).to.equal(false);
    expect(flangeTooSmall(49.9, 200)).to.equal(true);
    expect(flangeTooSmall(50, 200.1)).to.equal(true);
  });
  it('a third-size flange on a 150 mm wheel (50 mm) passes, and 62.5 mm is exactly a quarter of 250 mm', () => {
    expect(flangeTooSmall(50, 150)).to.equal(false);
    expect(flangeTooSmall(62.5, 250)).to.equal(false);
    expect(flangeTooSmall(62.4, 250)).to.equal(true);
  });
});
