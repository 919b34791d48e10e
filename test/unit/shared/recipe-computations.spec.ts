import { expect } from 'chai';
import { computeRecipe } from '../../../shared/recipe-computations';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { content, ctx, machine, material, precisionMachine, rimWheel, wheel } from './fixtures';

describe('shared/recipe-computations', () => {
  it('combines speed, margin, capacity, profile, time and hardness', () => {
    const c = computeRecipe(content(), ctx());
    expect(c.peripheralSpeedMs).to.be.closeTo(39.269908, 1e-6); // Ø250 at 3000 rpm: π·250·3000/60 000, computed by hand
    expect(c.peripheralSpeedFtMin).to.be.closeTo(7730.297, 1e-3); // × 60/0.3048, computed by hand
    expect(c.markedMaxSpeedMs).to.equal(80);
    expect(c.speedMarginMs).to.be.closeTo(80 - 39.269908, 1e-6);
    expect(c.speedMarginPct).to.be.closeTo(((80 - 39.269908) / 80) * 100, 1e-5);
    expect(c.rpmAtMarkedMax).to.equal(6111); // 60 000·80/(π·250) = 6111.55, floored; computed by hand
    expect(c.cuttingDepthMm).to.equal(80); // (250 − 80)/2 − 5, computed by hand
    expect(c.cuttableSizeMm).to.equal(80);
    expect(c.capacityFits).to.equal(true);
    expect(c.capacityMarginMm).to.equal(40); // 80 − 40
    expect(c.profile).to.have.length(41);
    expect(c.peakRemovalMm3S).to.equal(0.5 * 1.5 * 40); // feed × thickness × Ø40 chord at the centre, computed by hand
    expect(c.cutTimeS).to.equal(80); // 40 mm / 0.5 mm/s, computed by hand
    expect(c.hardness).to.deep.include({ minHv: 302, maxHv: 302, applies: true, reason: null }); // ASTM E140 Table 1: 30 HRC = 302 HV
  });

  it('uses the scope hardness window when given, and says why not for other groups', () => {
    const steel = computeRecipe(content({ scope: { hardness: { min: 40, max: 50, scale: 'HRC' } } }), ctx());
    expect(steel.hardness).to.deep.include({ minHv: 392, maxHv: 513 }); // ASTM E140, Table 1
    expect(steel.hardness!.caveats.length).to.be.greaterThan(0);
    const alu = computeRecipe(content({ scope: { group: 'aluminium-magnesium', hardness: { min: 60, max: 90, scale: 'HBW' } } }), ctx({ material: null }));
    expect(alu.hardness).to.deep.include({ applies: false, minHv: null, maxHv: null });
    expect(alu.hardness!.reason).to.be.a('string');
    const offTable = computeRecipe(content({ scope: { hardness: { min: 10, max: 30, scale: 'HRC' } } }), ctx());
    expect(offTable.hardness).to.deep.include({ minHv: null, maxHv: 302 }); // 10 HRC is below Table 1; 30 HRC = 302 HV (ASTM E140, Table 1)
    expect(offTable.hardness!.reason).to.match(/outside/);
  });

  it('an entry feed and a turning specimen change time and capacity', () => {
    const c = computeRecipe(
      content({
        scope: { sizeMaxMm: 150 },
        cutting: { machineId: 2, wheelId: 2, wheelRpm: 4000, feedMmS: 0.1, cutMotion: 'turning-specimen', entryFeedMmS: 0.05, entryLengthMm: 5 },
        clamping: { method: 'adhesive-wax-mount' },
      }),
      ctx({ wheel: rimWheel(), machine: precisionMachine() }),
    );
    expect(c.cuttingDepthMm).to.equal(50); // (150 − 40)/2 − 5, computed by hand
    expect(c.cuttableSizeMm).to.equal(100); // doubled by the turning specimen (Kerfbook model)
    expect(c.capacityFits).to.equal(false);
    expect(c.cutTimeS).to.be.closeTo(5 / 0.05 + 70 / 0.1, 1e-9); // to the centre of Ø150: 75 mm travel, 5 mm of it at the entry feed; computed by hand
  });

  it("cutting power, tangential force and equivalent chip thickness along the cut (P = Q·u, F_t = P/v_s, h_eq = Q'_w/v_s: Malkin & Guo, Grinding Technology, 2nd ed.)", () => {
    // A Ø60 bar, 350 × 2.5 mm wheel at 2800 rpm, 0.5 mm/s, 40 J/mm³, on a 5.5 kW motor; computed by hand:
    // v_s = π·350·2800/60 000 = 51.313 m/s; Q = 0.5 × 2.5 × 60 = 75 mm³/s at the centre; P = 75 × 40 = 3000 W;
    // F_t = 3000 / 51.313 = 58.47 N; Q'_w = 75 / 2.5 = 30 mm²/s; h_eq = 30 / 51.313 = 0.5847 µm; 3000 / 5500 = 54.5 %.
    const c = computeRecipe(
      content({ scope: { sizeMaxMm: 60 }, cutting: { wheelRpm: 2800 } }),
      ctx({
        wheel: wheel({ diameterMm: 350, thicknessMm: 2.5 }),
        machine: machine({ wheelDiameterMaxMm: 350, motorPowerKw: 5.5 }),
        limits: { ...ctx().limits, specificEnergyJMm3: { 'plain-low-alloy-steel': 40 } },
      }),
    );
    const p = c.cutPower!;
    expect(c.peakRemovalMm3S).to.equal(75);
    expect(p.specificEnergyJMm3).to.equal(40);
    expect(p.peakPowerW).to.equal(3000);
    expect(p.peakTangentialForceN).to.be.closeTo(58.47, 0.005);
    expect(p.peakRemovalPerWidthMm2S).to.equal(30);
    expect(p.peakChipThicknessUm).to.be.closeTo(0.5847, 0.00005);
    expect(p.motorSharePct).to.be.closeTo(54.55, 0.005);
    expect(p.warningSharePct).to.equal(80);
    // Along the cut at the largest size: the same depths as the removal profile, each Q × u.
    expect(p.powerProfile!.map((x) => x.depthMm)).to.deep.equal(c.profile!.map((x) => x.depthMm));
    p.powerProfile!.forEach((x, i) => expect(x.powerW).to.be.closeTo(c.profile![i]!.removalMm3S * 40, 1e-9));
    // Without a specific energy for the group there is no power (the chip thickness needs none).
    expect(computeRecipe(content(), ctx()).cutPower).to.deep.include({ specificEnergyJMm3: null, peakPowerW: null });
  });

  it('every field is null while its inputs are missing, and nothing throws on half-typed content', () => {
    const none = computeRecipe(content(), ctx({ wheel: null, machine: null, material: null }));
    expect(none.peripheralSpeedMs).to.equal(null);
    expect(none.rpmAtMarkedMax).to.equal(null);
    expect(none.capacityFits).to.equal(null);
    expect(none.profile).to.equal(null);
    expect(none.cutTimeS).to.equal(null);
    expect(none.hardness).to.equal(null);
    expect(none.cutPower).to.equal(null);

    const typing = computeRecipe(content({ cutting: { wheelRpm: Number.NaN, feedMmS: 0 } }), ctx());
    expect(typing.peripheralSpeedMs).to.equal(null);
    expect(typing.rpmAtMarkedMax).to.equal(6111);
    expect(typing.profile).to.equal(null);
    expect(typing.capacityFits).to.equal(true);

    const rectNoWidth = computeRecipe(content({ scope: { shape: 'rectangular', widthMm: null } }), ctx());
    expect(rectNoWidth.profile).to.equal(null);

    const empty = { scope: undefined, cutting: undefined, clamping: undefined, coolant: undefined } as unknown as RecipeContent;
    expect(() => computeRecipe(empty, ctx({ material: material({ hardness: null }) }))).to.not.throw();
  });
});
