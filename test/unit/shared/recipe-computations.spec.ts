import { expect } from 'chai';
import { computeRecipe } from '../../../shared/recipe-computations';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { content, ctx, limits, machine, material, precisionMachine, rimWheel, wheel } from './fixtures';

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

  describe('cutting geometry: the capacity limit, the worn wheel, the kerf (geometry and v = π·D·n/60 000, computed by hand)', () => {
    it('the fixture: Ø40 bar on the 250 mm bonded wheel at 3000 rpm, bench saw with 80 mm flanges, top speed 4000 rpm', () => {
      const c = computeRecipe(content(), ctx());
      expect(c.capacityLimit).to.equal('radius');
      expect(c.smallestWheelForScopeMm).to.equal(170); // 2·(40 + 5) + 80
      expect(c.profileMeasure).to.equal('contact-length');
      expect(c.kerfLossMm).to.be.closeTo(1.7, 1e-12); // 1.5 mm wheel + 0.2 mm allowance (Kerfbook's default, common practice)
      expect(c.kerfAllowanceMm).to.equal(0.2);
      const w = c.wornWheel!;
      expect(w).to.deep.include({
        source: 'lab-default',
        labShare: 0.7,
        reason: null,
        capacityFits: true,
        heldRpmCappedBy: 'machine-top-speed',
        heldRpm: 4000,
      });
      expect(w.diameterMm).to.be.closeTo(175, 1e-9); // 70 % of 250
      expect(w.cuttingDepthMm).to.be.closeTo(42.5, 1e-9); // (175 − 80)/2 − 5
      expect(w.cuttableSizeMm).to.be.closeTo(42.5, 1e-9);
      expect(w.capacityMarginMm).to.be.closeTo(2.5, 1e-9); // 42.5 − 40
      expect(w.peripheralSpeedMs).to.be.closeTo(27.488936, 1e-6); // π·175·3000/60 000
      expect(w.rpmToHoldSpeed).to.be.closeTo(4285.714286, 1e-6); // 3000 × 250/175; the marking allows 60 000·80/(π·175) = 8730 rpm, the machine 4000
      expect(w.heldSpeedMs).to.be.closeTo(36.651914, 1e-6); // π·175·4000/60 000
    });

    it('the floor saw example: 350 mm wheel at 2800 rpm worn to 245 mm turns 4000 rpm to hold 51.3 m/s, but the saw stops at 3000 rpm', () => {
      const floor = ctx({
        wheel: wheel({ diameterMm: 350, thicknessMm: 2.5 }),
        machine: machine({ wheelDiameterMaxMm: 350, flangeDiameterMm: 100, rpmMax: 3000 }),
        limits: limits({ kerfAllowanceMm: 0.3 }),
      });
      const c = computeRecipe(content({ cutting: { wheelRpm: 2800 } }), floor);
      expect(c.wornWheel!.rpmToHoldSpeed).to.be.closeTo(4000, 1e-9); // 2800 × 350/245
      expect(c.wornWheel).to.deep.include({ heldRpm: 3000, heldRpmCappedBy: 'machine-top-speed' });
      expect(c.wornWheel!.heldSpeedMs).to.be.closeTo(38.48451, 1e-6); // π·245·3000/60 000
      expect(c.kerfLossMm).to.be.closeTo(2.8, 1e-12); // 2.5 + the lab's 0.3
      // A spindle limit below the top speed holds it lower still.
      const limited = computeRecipe(content({ cutting: { wheelRpm: 2800 } }), {
        ...floor,
        machine: { ...floor.machine!, spindleLimitRpm: 2900, spindleLimitSetBy: 'Maintenance' },
      });
      expect(limited.wornWheel).to.deep.include({ heldRpm: 2900, heldRpmCappedBy: 'spindle-limit' });
    });

    it('a rim wheel has no worn diameter and says why; a turning part plots its removal length per turn', () => {
      const c = computeRecipe(
        content({
          scope: { sizeMaxMm: 60 },
          cutting: { machineId: 2, wheelId: 2, wheelRpm: 4000, feedMmS: 0.1, cutMotion: 'turning-specimen' },
          clamping: { method: 'adhesive-wax-mount' },
        }),
        ctx({ wheel: rimWheel(), machine: precisionMachine() }),
      );
      expect(c.wornWheel).to.deep.include({ diameterMm: null, capacityFits: null, heldRpm: null });
      expect(c.wornWheel!.reason).to.contain('keeps its diameter');
      expect(c.capacityLimit).to.equal('turned-to-centre');
      expect(c.profileMeasure).to.equal('removal-length-per-turn');
    });

    it('a rectangular section on a wheel coming down uses the scope width; without the width the capacity is not known yet', () => {
      const c = computeRecipe(content({ scope: { shape: 'rectangular', sizeMaxMm: 40, widthMm: 100 } }), ctx());
      // √(125² − 50²) − 40 − 5 = √13 125 − 45 = 114.564 392 − 45 = 69.564 392
      expect(c.capacityLimit).to.equal('chord');
      expect(c.cuttableSizeMm).to.be.closeTo(69.564392, 1e-6);
      const noWidth = computeRecipe(content({ scope: { shape: 'rectangular', sizeMaxMm: 40, widthMm: null } }), ctx());
      expect(noWidth).to.deep.include({ capacityFits: null, capacityLimit: null, smallestWheelForScopeMm: null });
    });
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
