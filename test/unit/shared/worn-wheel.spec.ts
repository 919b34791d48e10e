import { expect } from 'chai';
import { peripheralSpeedMs } from '../../../shared/peripheral-speed';
import {
  capRpm,
  KERFBOOK_KERF_ALLOWANCE_MM,
  KERFBOOK_WORN_DIAMETER_SHARE,
  kerfLossMm,
  markedMaxRpmAt,
  rpmToHoldSpeed,
  wornDiameterOf,
} from '../../../shared/worn-wheel';
import { rimWheel, wheel } from './fixtures';

describe('shared/worn-wheel', () => {
  it("Kerfbook's defaults: a consumable wheel used down to 70 % of its new diameter, a 0.2 mm kerf allowance (common practice)", () => {
    expect(KERFBOOK_WORN_DIAMETER_SHARE).to.equal(0.7);
    expect(KERFBOOK_KERF_ALLOWANCE_MM).to.equal(0.2);
  });

  it("the smallest usable diameter: the wheel's own, else the lab's share of a consumable wheel's new diameter", () => {
    const worn = wornDiameterOf(wheel({ diameterMm: 350 }), 0.7)!;
    expect(worn.source).to.equal('lab-default');
    expect(worn.diameterMm).to.be.closeTo(245, 1e-9); // 0.7 × 350, computed by hand
    expect(wornDiameterOf(wheel({ diameterMm: 350 }), 0.8)!.diameterMm).to.be.closeTo(280, 1e-9); // 0.8 × 350
    expect(wornDiameterOf(wheel({ diameterMm: 350, minUsableDiameterMm: 260 }), 0.7)).to.deep.equal({ diameterMm: 260, source: 'wheel' });
    // A share that is not one (0, 1 or more, NaN) falls back to Kerfbook's default rather than a wheel that never wears or grows.
    for (const share of [0, 1, 1.2, Number.NaN]) expect(wornDiameterOf(wheel({ diameterMm: 350 }), share)!.diameterMm, String(share)).to.be.closeTo(245, 1e-9);
  });

  it('a rim wheel has no worn diameter of its own: its thin rim is spent before the diameter shrinks (common practice), unless its record gives one', () => {
    expect(wornDiameterOf(rimWheel(), 0.7)).to.equal(null);
    expect(wornDiameterOf(rimWheel({ minUsableDiameterMm: 144 }), 0.7)).to.deep.equal({ diameterMm: 144, source: 'wheel' });
  });

  it('holding the new-wheel speed at the worn diameter takes n·D_new/D_worn (v = π·D·n/60 000 held constant)', () => {
    // 350 mm at 2800 rpm = π·350·2800/60 000 = 51.313 m/s; worn to 245 mm: 2800 × 350/245 = 4000 rpm. Computed by hand.
    expect(rpmToHoldSpeed(2800, 350, 245)).to.be.closeTo(4000, 1e-9);
    expect(peripheralSpeedMs(245, 2800)).to.be.closeTo(35.918876, 1e-6); // the worn wheel at the old rpm: π·245·2800/60 000
    expect(peripheralSpeedMs(245, 4000)).to.be.closeTo(peripheralSpeedMs(350, 2800), 1e-9);
  });

  it('the marking caps it: in m/s the rim speed (a smaller wheel may turn faster), in rpm the spindle speed whatever the wear', () => {
    // 80 m/s at 245 mm: 60 000 × 80/(π × 245) = 6236.28, floored. Computed by hand.
    expect(markedMaxRpmAt(wheel({ diameterMm: 350, maxSpeedMs: 80 }), 245)).to.equal(6236);
    expect(markedMaxRpmAt(wheel({ diameterMm: 350, maxSpeedMarkedIn: 'rpm', maxSpeedRpm: 4365.5 }), 245)).to.equal(4365);
  });

  it('caps the wanted rpm at the lowest of the marked maximum and the machine, and says which held it back', () => {
    expect(capRpm(4000, { 'marked-maximum': 6236, 'machine-top-speed': 3000, 'spindle-limit': null })).to.deep.equal({
      rpm: 3000,
      cappedBy: 'machine-top-speed',
    });
    expect(capRpm(4000, { 'marked-maximum': 6236, 'machine-top-speed': 5000, 'spindle-limit': 3500 })).to.deep.equal({ rpm: 3500, cappedBy: 'spindle-limit' });
    expect(capRpm(4000, { 'marked-maximum': 3800, 'machine-top-speed': 5000 })).to.deep.equal({ rpm: 3800, cappedBy: 'marked-maximum' });
    expect(capRpm(4000.9, { 'marked-maximum': 6236, 'machine-top-speed': 5000 })).to.deep.equal({ rpm: 4000, cappedBy: null }); // floored, never rounded up
    expect(capRpm(4000, { 'marked-maximum': Number.NaN, 'machine-top-speed': null })).to.deep.equal({ rpm: 4000, cappedBy: null });
  });

  it('kerf loss = wheel thickness + allowance', () => {
    expect(kerfLossMm(2.5, 0.2)).to.be.closeTo(2.7, 1e-12);
    expect(kerfLossMm(0.5, 0)).to.equal(0.5);
  });
});
