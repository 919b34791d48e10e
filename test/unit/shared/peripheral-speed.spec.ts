import { expect } from 'chai';
import { markedSpeedPair, maxRpmForWheel, peripheralSpeedMs, rpmForSpeed, speedMargin, toFtPerMin } from '../../../shared/peripheral-speed';

describe('shared/peripheral-speed', () => {
  // Worked examples computed by hand: v = π·D·n / 60 000 m/s, then × 60 / 0.3048 for ft/min.
  const examples: [number, number, number, number][] = [
    [250, 3000, 39.269908, 7730.297],
    [300, 2850, 44.767695, 8812.538],
    [150, 300, 2.356194, 463.818],
  ];
  for (const [d, n, v, ftMin] of examples) {
    it(`Ø${d} mm at ${n} rpm → ${v} m/s, ${ftMin} ft/min (π·D·n/60 000 and × 60/0.3048, computed by hand)`, () => {
      expect(peripheralSpeedMs(d, n)).to.be.closeTo(v, 1e-6);
      expect(toFtPerMin(peripheralSpeedMs(d, n))).to.be.closeTo(ftMin, 1e-3);
    });
  }

  it('n_max for 50 m/s on Ø300 is 3183.099, floored to 3183 (60 000·50/(π·300), computed by hand)', () => {
    expect(rpmForSpeed(300, 50)).to.be.closeTo(3183.099, 1e-3);
    expect(maxRpmForWheel(300, 50)).to.equal(3183);
    expect(peripheralSpeedMs(300, maxRpmForWheel(300, 50))).to.be.at.most(50);
    expect(toFtPerMin(50)).to.be.closeTo(9842.52, 1e-3); // 50 × 60/0.3048, computed by hand
  });

  it('never floors an exact result one below (hand check: 60 000·π·250·3000/60 000/(π·250) = 3000)', () => {
    expect(maxRpmForWheel(250, peripheralSpeedMs(250, 3000))).to.equal(3000);
  });

  it('margin to the marked maximum, in m/s and % (hand-computed: 80 − 39.27 = 40.73 m/s, 50.9 %)', () => {
    const m = speedMargin(peripheralSpeedMs(250, 3000), 80);
    expect(m.marginMs).to.be.closeTo(40.730092, 1e-6);
    expect(m.marginPct).to.be.closeTo(50.9126, 1e-4);
    expect(speedMargin(90, 80).marginMs).to.be.below(0);
  });
});

describe('markedSpeedPair', () => {
  // n = 60 000·v / (π·D) and its inverse, computed by hand: 300 mm at 50 m/s → 3183.099 rpm.
  it('gives the rpm of a wheel marked in m/s at its new diameter', () => {
    const pair = markedSpeedPair(300, 'm/s', 50);
    expect(pair.maxSpeedMs).to.equal(50);
    expect(pair.maxSpeedRpm).to.be.closeTo(3183.0989, 1e-4);
  });
  // v = π·D·n / 60 000, computed by hand: 250 mm at 3000 rpm → 39.2699 m/s.
  it('gives the m/s of a wheel marked in rpm', () => {
    const pair = markedSpeedPair(250, 'rpm', 3000);
    expect(pair.maxSpeedRpm).to.equal(3000);
    expect(pair.maxSpeedMs).to.be.closeTo(39.26991, 1e-5);
  });
  it('round-trips: the computed figure gives back the marked one', () => {
    const { maxSpeedRpm } = markedSpeedPair(230, 'm/s', 63);
    expect(markedSpeedPair(230, 'rpm', maxSpeedRpm).maxSpeedMs).to.be.closeTo(63, 1e-9);
  });
});
