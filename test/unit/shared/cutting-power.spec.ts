import { expect } from 'chai';
import type { ContactPoint } from '../../../shared/contact-length';
import { cuttingPowerW, cutPower, equivalentChipThicknessUm, motorShareText, removalPerWidthMm2S, tangentialForceN } from '../../../shared/cutting-power';

/**
 * Worked example, computed by hand: a Ø60 mm steel bar cut straight through with a 350 × 2.5 mm
 * wheel at 2800 rpm and 0.5 mm/s. At the centre the chord is 60 mm, so
 * Q = 0.5 mm/s × 2.5 mm × 60 mm = 75 mm³/s; v_s = π·350·2800/60 000 = 51.31 m/s (rounded
 * to 51.3 m/s below).
 */
describe('shared/cutting-power', () => {
  it('cutting power P = Q · u: 75 mm³/s × 40 J/mm³ = 3000 W (Malkin & Guo, Grinding Technology, 2nd ed.: specific energy)', () => {
    // J/mm³ × mm³/s = J/s = W, computed by hand.
    expect(cuttingPowerW(75, 40)).to.equal(3000);
    expect(cuttingPowerW(0, 40)).to.equal(0);
  });

  it('tangential force F_t = P / v_s: 3000 W ÷ 51.3 m/s = 58.5 N (power = force × speed; Malkin & Guo)', () => {
    // W ÷ (m/s) = (N·m/s) ÷ (m/s) = N; 3000 / 51.3 = 58.48, computed by hand.
    expect(tangentialForceN(3000, 51.3)).to.be.closeTo(58.48, 0.005);
  });

  it("equivalent chip thickness h_eq = Q'_w / v_s: 30 mm²/s ÷ 51.3 m/s = 0.585 µm (Malkin & Guo; Marinescu et al., Handbook of Machining with Grinding Wheels)", () => {
    // Q'_w = Q / b = 75 mm³/s ÷ 2.5 mm = 30 mm²/s, computed by hand.
    expect(removalPerWidthMm2S(75, 2.5)).to.equal(30);
    // The unit factor by hand: mm²/s ÷ m/s = mm²/s ÷ (1000 mm/s) = 10⁻³ mm = 1 µm.
    const hEqMm = 30 / (51.3 * 1000);
    const hEqUm = hEqMm * 1000;
    expect(hEqUm).to.be.closeTo(0.5848, 0.00005);
    expect(equivalentChipThicknessUm(75, 2.5, 51.3)).to.be.closeTo(hEqUm, 1e-12);
    // A thinner wheel at the same removal rate carries a thicker chip: 75 ÷ 1.5 = 50 mm²/s → 50 / 51.3 = 0.975 µm.
    expect(equivalentChipThicknessUm(75, 1.5, 51.3)).to.be.closeTo(0.9747, 0.00005);
  });

  describe('cutPower along a profile', () => {
    // Three depths of the Ø60 bar: entry, centre (the 60 mm chord), exit; Q = 0.5 × 2.5 × chord.
    const profile: ContactPoint[] = [
      { depthMm: 0, contactMm: 0, removalMm3S: 0 },
      { depthMm: 30, contactMm: 60, removalMm3S: 75 },
      { depthMm: 60, contactMm: 0, removalMm3S: 0 },
    ];
    const inputs = { specificEnergyJMm3: 40, peripheralSpeedMs: 51.3, wheelThicknessMm: 2.5, motorPowerKw: 5.5, warningSharePct: 80 };

    it('gives the peaks of the worked example and the motor share: 3000 W of 5500 W = 54.5 %', () => {
      const p = cutPower(profile, inputs);
      expect(p.specificEnergyJMm3).to.equal(40);
      expect(p.peakPowerW).to.equal(3000);
      expect(p.peakTangentialForceN).to.be.closeTo(58.48, 0.005);
      expect(p.peakRemovalPerWidthMm2S).to.equal(30);
      expect(p.peakChipThicknessUm).to.be.closeTo(0.5848, 0.00005);
      expect(p.motorPowerW).to.equal(5500);
      expect(p.motorSharePct).to.be.closeTo(54.545, 0.001); // 3000 / 5500 × 100, computed by hand
      expect(p.warningSharePct).to.equal(80);
      expect(p.powerProfile).to.deep.equal([
        { depthMm: 0, powerW: 0 },
        { depthMm: 30, powerW: 3000 },
        { depthMm: 60, powerW: 0 },
      ]);
    });

    it('without a specific energy: no power, force or share, but the chip thickness (it needs none)', () => {
      const p = cutPower(profile, { ...inputs, specificEnergyJMm3: null });
      expect(p).to.deep.include({ specificEnergyJMm3: null, powerProfile: null, peakPowerW: null, peakTangentialForceN: null, motorSharePct: null });
      expect(p.peakChipThicknessUm).to.be.closeTo(0.5848, 0.00005);
    });

    it('without a peripheral speed (no rpm yet): power, but no force and no chip thickness', () => {
      const p = cutPower(profile, { ...inputs, peripheralSpeedMs: null });
      expect(p.peakPowerW).to.equal(3000);
      expect(p).to.deep.include({ peakTangentialForceN: null, peakChipThicknessUm: null });
    });

    it('without the motor power: the figures, but no share', () => {
      const p = cutPower(profile, { ...inputs, motorPowerKw: null });
      expect(p.peakPowerW).to.equal(3000);
      expect(p).to.deep.include({ motorPowerW: null, motorSharePct: null });
    });

    it('a speed so small that h_eq overflows gives none rather than ∞', () => {
      const p = cutPower(profile, { ...inputs, peripheralSpeedMs: Number.MIN_VALUE });
      expect(p.peakChipThicknessUm).to.equal(null);
      expect(p.peakTangentialForceN).to.equal(null);
    });
  });

  it('says the share of the motor in words, with a decimal where a whole number would hide the excess', () => {
    expect(motorShareText({ motorSharePct: 40.9, motorPowerW: 5500, warningSharePct: 80 })).to.equal('41 % of the 5.50 kW motor');
    expect(motorShareText({ motorSharePct: 80.4, motorPowerW: 2200, warningSharePct: 80 })).to.equal('80.4 % of the 2.20 kW motor');
    expect(motorShareText({ motorSharePct: 80, motorPowerW: 2200, warningSharePct: 80 })).to.equal('80 % of the 2.20 kW motor');
    expect(motorShareText({ motorSharePct: 136, motorPowerW: 2200, warningSharePct: 80 })).to.equal('more than the 2.20 kW motor');
    expect(motorShareText({ motorSharePct: null, motorPowerW: null, warningSharePct: 80 })).to.equal(null);
  });
});
