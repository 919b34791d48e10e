import { expect } from 'chai';
import type { RecipeContext } from '../../../shared/recipe-context';
import { CHECK_IDS, changeReasonMissing, runChecks, worstSeverity, type CheckResult } from '../../../shared/recipe-checks';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { content, ctx, limits as labLimits, machine, material, precisionMachine, rimWheel, wheel } from './fixtures';

const ids = (c: RecipeContent, x: RecipeContext) => runChecks(c, x).map((r) => r.id);
const find = (c: RecipeContent, x: RecipeContext, id: string): CheckResult | undefined => runChecks(c, x).find((r) => r.id === id);

/** A precision setup that passes: rim wheel Ø150, 40 m/s, at 4000 rpm (31.4 m/s) on a ceramic. */
const precision = (over: Parameters<typeof content>[0] = {}) =>
  content({
    ...over,
    scope: { materialId: null, group: 'ceramic-glass', ...over.scope },
    cutting: { machineId: 2, wheelId: 2, wheelRpm: 4000, feedMmS: 0.05, ...over.cutting },
    clamping: { method: 'adhesive-wax-mount', ...over.clamping },
  });
const precisionCtx = (over: Partial<RecipeContext> = {}) => ctx({ material: null, wheel: rimWheel(), machine: precisionMachine(), ...over });

describe('shared/recipe-checks', () => {
  it('clean fixtures raise nothing', () => {
    expect(runChecks(content(), ctx())).to.deep.equal([]);
    expect(runChecks(precision(), precisionCtx())).to.deep.equal([]);
  });

  it('every result carries id, severity, message, reason and path; ids are listed in CHECK_IDS', () => {
    const all = runChecks(
      content({ clamping: { method: null }, coolant: { type: 'dry', concentrationPct: null } }),
      ctx({ wheel: wheel({ archived: true }), material: material({ coated: true, hazardousDust: true }) }),
    );
    expect(all.length).to.be.greaterThan(3);
    for (const r of all) {
      expect(CHECK_IDS as readonly string[]).to.include(r.id);
      expect(['blocker', 'warning', 'note']).to.include(r.severity);
      expect(r.message).to.be.a('string').and.not.equal('');
      expect(r.reason).to.be.a('string').and.not.equal('');
    }
    // blockers first, then warnings, then notes
    const ranks = all.map((r) => ['blocker', 'warning', 'note'].indexOf(r.severity));
    expect(ranks).to.deep.equal([...ranks].sort((a, b) => a - b));
  });

  it('machine-missing / wheel-missing (blockers)', () => {
    expect(find(content(), ctx({ machine: null }), 'machine-missing')).to.deep.include({ severity: 'blocker', path: 'cutting.machineId' });
    expect(find(content(), ctx({ wheel: null }), 'wheel-missing')).to.deep.include({ severity: 'blocker', path: 'cutting.wheelId' });
    expect(ids(content(), ctx())).to.not.include.members(['machine-missing', 'wheel-missing']);
  });

  describe('wheel-overspeed (blocker; ANSI B7.1 / EN 12413 / OSHA 29 CFR 1910.215(d)(1))', () => {
    it('fires above the marked maximum, with the numbers', () => {
      // Ø300 at 3500 rpm = π·300·3500/60 000 = 54.98 m/s > 50 m/s; n_max = 60 000·50/(π·300) = 3183.1, floored; computed by hand
      const x = ctx({ wheel: wheel({ diameterMm: 300, maxSpeedMs: 50 }), machine: machine({ wheelDiameterMaxMm: 300 }) });
      const r = find(content({ cutting: { wheelRpm: 3500 } }), x, 'wheel-overspeed')!;
      expect(r).to.deep.include({ severity: 'blocker', path: 'cutting.wheelRpm' });
      expect(r.message).to.contain('55.0 m/s').and.contain('50.0 m/s').and.contain('3183 rpm');
      expect(r.reason).to.contain('ANSI B7.1').and.contain('EN 12413').and.contain('1910.215');
    });
    it('does not fire at exactly the maximum whole rpm', () => {
      const x = ctx({ wheel: wheel({ diameterMm: 300, maxSpeedMs: 50 }), machine: machine({ wheelDiameterMaxMm: 300 }) });
      expect(ids(content({ cutting: { wheelRpm: 3183 } }), x)).to.not.include('wheel-overspeed');
    });
  });

  it('rpm-outside-machine (blocker)', () => {
    expect(find(content({ cutting: { wheelRpm: 4500 } }), ctx(), 'rpm-outside-machine')!.message).to.contain('1000–4000 rpm');
    expect(
      find(content({ cutting: { wheelRpm: 2000 } }), ctx({ machine: machine({ rpmMin: 2950, rpmMax: 2950 }) }), 'rpm-outside-machine')!.message,
    ).to.contain('fixed 2950 rpm');
    expect(ids(content({ cutting: { wheelRpm: 4000 } }), ctx())).to.not.include('rpm-outside-machine');
  });

  it('feed-outside-machine and entry-feed-outside-machine (blockers)', () => {
    expect(find(content({ cutting: { feedMmS: 3 } }), ctx(), 'feed-outside-machine')).to.deep.include({ severity: 'blocker', path: 'cutting.feedMmS' });
    expect(find(content({ cutting: { feedMmS: 0.01 } }), ctx(), 'feed-outside-machine')).to.not.equal(undefined);
    expect(find(content({ cutting: { entryFeedMmS: 0.01, entryLengthMm: 2 } }), ctx(), 'entry-feed-outside-machine')).to.deep.include({
      path: 'cutting.entryFeedMmS',
    });
    expect(ids(content({ cutting: { feedMmS: 2, entryFeedMmS: 0.02, entryLengthMm: 2 } }), ctx())).to.not.include.members([
      'feed-outside-machine',
      'entry-feed-outside-machine',
    ]);
  });

  it('wheel-diameter-outside-machine (blocker)', () => {
    expect(find(content(), ctx({ wheel: wheel({ diameterMm: 300 }) }), 'wheel-diameter-outside-machine')!.message).to.contain('200–250 mm');
    expect(ids(content(), ctx({ wheel: wheel({ diameterMm: 200 }) }))).to.not.include('wheel-diameter-outside-machine');
  });

  it('scope-exceeds-capacity (blocker): (250 − 80)/2 − 5 = 80 mm, computed by hand', () => {
    const r = find(content({ scope: { sizeMaxMm: 81 } }), ctx(), 'scope-exceeds-capacity')!;
    expect(r).to.deep.include({ severity: 'blocker', path: 'scope.sizeMaxMm' });
    expect(r.message).to.contain('80.0 mm');
    expect(ids(content({ scope: { sizeMaxMm: 80 } }), ctx())).to.not.include('scope-exceeds-capacity');
  });

  describe('scope-exceeds-capacity by the true cutting geometry (geometry, computed by hand; clearance common practice)', () => {
    /** The floor saw of the worked example: a 350 mm wheel between 100 mm flanges. */
    const floor = (over: Parameters<typeof machine>[0] = {}) =>
      ctx({
        wheel: wheel({ diameterMm: 350, thicknessMm: 2.5 }),
        machine: machine({ wheelDiameterMinMm: 300, wheelDiameterMaxMm: 350, flangeDiameterMm: 100, rpmMax: 3000, ...over }),
      });
    const blockScope = (height: number, width: number) => ({ shape: 'rectangular' as const, sizeMinMm: 10, sizeMaxMm: height, widthMm: width });

    it('a 120 mm high, 200 mm wide block under a 350 mm wheel coming down: √(175² − 100²) − 50 − 5 = 88.6 mm, blocked (it used to pass as 120 mm)', () => {
      const r = find(content({ scope: blockScope(120, 200), cutting: { wheelRpm: 2800 } }), floor(), 'scope-exceeds-capacity')!;
      expect(r).to.deep.include({ severity: 'blocker', path: 'scope.sizeMaxMm' });
      expect(r.message).to.contain('120 mm high, 200 mm wide');
      expect(r.message).to.contain('88.6 mm');
      expect(r.message).to.contain('at least 404 mm'); // 2·√((120 + 50 + 5)² + 100²) = 403.1, rounded up
      expect(r.reason).to.contain('√(R² − (W/2)²)');
      expect(ids(content({ scope: blockScope(88, 200), cutting: { wheelRpm: 2800 } }), floor())).to.not.include('scope-exceeds-capacity');
    });

    it('the same block fed horizontally into the wheel fits: its width lies along the feed (H ≤ 175 − 50 − 5 = 120 mm)', () => {
      const horizontal = floor({ feedDirection: 'part-horizontal' });
      expect(ids(content({ scope: blockScope(120, 200), cutting: { wheelRpm: 2800 } }), horizontal)).to.not.include('scope-exceeds-capacity');
      const r = find(content({ scope: blockScope(121, 200), cutting: { wheelRpm: 2800 } }), horizontal, 'scope-exceeds-capacity')!;
      expect(r.message).to.contain('120.0 mm');
      expect(r.reason).to.contain('fed horizontally');
    });

    it('a 200 mm tube with a 5 mm wall turned on a 250 mm wheel passes: only the wall must be within the 80 mm depth', () => {
      const turning = ctx({ machine: machine({ cutMotions: ['straight-plunge', 'turning-specimen'] }) });
      const tube = content({ scope: { shape: 'tube', sizeMinMm: 150, sizeMaxMm: 200, wallMm: 5 }, cutting: { cutMotion: 'turning-specimen' } });
      expect(runChecks(tube, turning).filter((r) => r.id.startsWith('scope-exceeds'))).to.deep.equal([]);
      // A 200 mm bar turned on the same wheel needs its radius within the depth: 100 > 80, blocked.
      const bar = find(content({ scope: { sizeMaxMm: 200 }, cutting: { cutMotion: 'turning-specimen' } }), turning, 'scope-exceeds-capacity')!;
      expect(bar.message).to.contain('160.0 mm'); // 2 × 80
      // A wall deeper than the depth points at the wall.
      const thick = content({ scope: { shape: 'tube', sizeMinMm: 190, sizeMaxMm: 200, wallMm: 85 }, cutting: { cutMotion: 'turning-specimen' } });
      expect(find(thick, turning, 'scope-exceeds-capacity')).to.deep.include({ path: 'scope.wallMm' });
    });
  });

  describe('scope-exceeds-worn-capacity (warning): the scope must still be cut with the wheel worn to its smallest usable diameter', () => {
    it('a 45 mm bar fits the new 250 mm wheel (80 mm) but not the wheel worn to 175 mm (70 %): (175 − 80)/2 − 5 = 42.5 mm', () => {
      const r = find(content({ scope: { sizeMaxMm: 45 } }), ctx(), 'scope-exceeds-worn-capacity')!;
      expect(r).to.deep.include({ severity: 'warning', path: 'scope.sizeMaxMm' });
      expect(r.message).to.contain('175.0 mm (70 % of the new diameter');
      expect(r.message).to.contain('42.5 mm');
      expect(r.message).to.contain('wears below 180 mm'); // 2·(45 + 5) + 80
      expect(r.reason).to.contain('warns rather than blocks');
      expect(ids(content({ scope: { sizeMaxMm: 42.5 } }), ctx())).to.not.include('scope-exceeds-worn-capacity');
    });

    it("uses the wheel's own smallest usable diameter, and never doubles up with the blocker", () => {
      expect(ids(content({ scope: { sizeMaxMm: 45 } }), ctx({ wheel: wheel({ minUsableDiameterMm: 200 }) }))).to.not.include('scope-exceeds-worn-capacity'); // (200 − 80)/2 − 5 = 55
      const own = find(content({ scope: { sizeMaxMm: 45 } }), ctx({ wheel: wheel({ minUsableDiameterMm: 160 }) }), 'scope-exceeds-worn-capacity')!;
      expect(own.message).to.contain("160.0 mm (the wheel's record)");
      expect(ids(content({ scope: { sizeMaxMm: 81 } }), ctx())).to.deep.equal(['scope-exceeds-capacity']);
    });

    it('a rim wheel keeps its diameter: no worn-capacity warning', () => {
      expect(ids(precision({ scope: { sizeMaxMm: 50 } }), precisionCtx())).to.not.include('scope-exceeds-worn-capacity'); // (150 − 40)/2 − 5 = 50
    });
  });

  it('clamping-missing, clamping-unsupported, cut-motion-unsupported (blockers)', () => {
    expect(find(content({ clamping: { method: null } }), ctx(), 'clamping-missing')).to.deep.include({ severity: 'blocker', path: 'clamping.method' });
    expect(find(content({ clamping: { method: 'top-clamp' } }), ctx(), 'clamping-unsupported')!.message).to.contain('top clamp');
    expect(find(content({ cutting: { cutMotion: 'traverse-pass', passes: 4 } }), ctx(), 'cut-motion-unsupported')).to.deep.include({
      path: 'cutting.cutMotion',
    });
    expect(ids(content({ clamping: { method: 'v-block' }, cutting: { cutMotion: 'rocking' } }), ctx())).to.not.include.members([
      'clamping-missing',
      'clamping-unsupported',
      'cut-motion-unsupported',
    ]);
  });

  describe('rim wheels on metal (warning) and the dressing note (electronics)', () => {
    it('a diamond rim wheel on steel warns, with the dressing advice', () => {
      const r = find(precision({ scope: { group: 'plain-low-alloy-steel' } }), precisionCtx(), 'rim-wheel-on-metal')!;
      expect(r.severity).to.equal('warning');
      expect(r.message).to.contain('diamond').and.contain('dress');
    });
    it('a CBN rim wheel on hardened steel does not (CBN for hardened steels that dull diamond: common practice; ASTM E3 from memory), on copper it does', () => {
      const cbn = precisionCtx({ wheel: rimWheel({ specification: 'B126M' }) });
      expect(ids(precision({ scope: { group: 'hardened-tool-steel' } }), cbn)).to.not.include('rim-wheel-on-metal');
      expect(ids(precision({ scope: { group: 'copper' } }), cbn)).to.include('rim-wheel-on-metal');
    });
    it('electronics and mixed assemblies get a note with dressing advice, not a warning', () => {
      const r = runChecks(precision({ scope: { group: 'electronics-mixed' } }), precisionCtx());
      expect(r.map((x) => [x.id, x.severity])).to.deep.equal([['rim-wheel-dressing', 'note']]);
      expect(r[0]!.message).to.match(/alumina or silicon carbide stick/);
    });
    it('no warning on ceramics', () => {
      expect(ids(precision(), precisionCtx())).to.not.include.members(['rim-wheel-on-metal', 'rim-wheel-dressing']);
    });
  });

  it('bonded-wheel-on-hard-brittle (warning)', () => {
    const r = find(content({ scope: { group: 'cemented-carbide' } }), ctx(), 'bonded-wheel-on-hard-brittle')!;
    expect(r.severity).to.equal('warning');
    expect(r.message).to.contain('aluminium oxide');
    expect(
      find(content({ scope: { group: 'ceramic-glass' } }), ctx({ wheel: wheel({ specification: 'C120M5R' }) }), 'bonded-wheel-on-hard-brittle')!.message,
    ).to.contain('silicon carbide');
    expect(ids(content({ scope: { group: 'plain-low-alloy-steel' } }), ctx())).to.not.include('bonded-wheel-on-hard-brittle');
  });

  it('dry-cut-burn-risk (warning): bonded wheel, or a wheel that does not allow dry cutting', () => {
    const dry = { coolant: { type: 'dry' as const, concentrationPct: null } };
    expect(find(content(dry), ctx(), 'dry-cut-burn-risk')).to.deep.include({ severity: 'warning', path: 'coolant.type' });
    expect(find(content(dry), ctx({ wheel: wheel({ dryAllowed: true }) }), 'dry-cut-burn-risk')!.message).to.contain('consumable');
    expect(find(precision(dry), precisionCtx(), 'dry-cut-burn-risk')!.message).to.contain('does not allow');
    expect(ids(precision(dry), precisionCtx({ wheel: rimWheel({ dryAllowed: true }) }))).to.not.include('dry-cut-burn-risk');
    expect(ids(content(), ctx())).to.not.include('dry-cut-burn-risk');
  });

  it("feed-above-ceiling (warning): the lab's ceiling for the group", () => {
    const limits = labLimits({ feedCeilingsMmS: { 'plain-low-alloy-steel': 0.4 } });
    expect(find(content(), ctx({ limits }), 'feed-above-ceiling')!.message).to.contain('0.4 mm/s');
    expect(ids(content({ cutting: { feedMmS: 0.4 } }), ctx({ limits }))).to.not.include('feed-above-ceiling');
    expect(ids(content(), ctx({ limits: labLimits({ feedCeilingsMmS: { copper: 0.1 } }) }))).to.not.include('feed-above-ceiling');
  });

  it('orientation-rule-missing (warning): coated or case-hardened without an orientation rule', () => {
    expect(find(content(), ctx({ material: material({ coated: true }) }), 'orientation-rule-missing')).to.deep.include({
      severity: 'warning',
      path: 'clamping.orientationRule',
    });
    expect(find(content(), ctx({ material: material({ caseHardened: true, caseDepthMm: 0.8 }) }), 'orientation-rule-missing')!.message).to.contain(
      'case 0.8 mm',
    );
    expect(ids(content({ clamping: { orientationRule: 'Wheel enters through the coating.' } }), ctx({ material: material({ coated: true }) }))).to.not.include(
      'orientation-rule-missing',
    );
    expect(ids(content(), ctx())).to.not.include('orientation-rule-missing');
  });

  it('rim-wheel-low-rpm (note): well below what the rim wheel could run at', () => {
    // Ceiling: min(machine 5000, floor(60 000·40/(π·150)) = 5092) = 5000; 75 % = 3750; computed by hand
    const r = find(precision({ cutting: { wheelRpm: 3000 } }), precisionCtx(), 'rim-wheel-low-rpm')!;
    expect(r.severity).to.equal('note');
    expect(r.message).to.contain('5000 rpm').and.contain('consumable');
    expect(ids(precision({ cutting: { wheelRpm: 3750 } }), precisionCtx())).to.not.include('rim-wheel-low-rpm');
    expect(ids(content({ cutting: { wheelRpm: 1000 } }), ctx())).to.not.include('rim-wheel-low-rpm'); // bonded wheel: lowering rpm is the remedy
  });

  it("heat-sensitive-high-feed (warning; 0.25 mm/s on abrasive saws, the low end of the usual feed range: Kerfbook's threshold, common practice)", () => {
    const hot = ctx({ material: material({ heatSensitive: true }) });
    expect(find(content({ cutting: { feedMmS: 0.5 } }), hot, 'heat-sensitive-high-feed')!.message).to.contain('0.25 mm/s');
    expect(ids(content({ cutting: { feedMmS: 0.2 } }), hot)).to.not.include('heat-sensitive-high-feed');
    expect(ids(content({ cutting: { feedMmS: 0.5 } }), ctx())).to.not.include('heat-sensitive-high-feed');
  });

  it('hazardous-dust-dry (blocker: hazardous dusts are cut wet and enclosed, common practice; OSHA PEL for beryllium 0.2 µg/m³)', () => {
    const dusty = ctx({ material: material({ hazardousDust: true }) });
    const r = find(content({ coolant: { type: 'dry', concentrationPct: null } }), dusty, 'hazardous-dust-dry')!;
    expect(r.severity).to.equal('blocker');
    expect(r.reason).to.contain('wet and enclosed');
    expect(ids(content(), dusty)).to.not.include('hazardous-dust-dry');
  });

  it('coolant-concentration (note): outside 2–5 % (common practice)', () => {
    expect(find(content({ coolant: { concentrationPct: 8 } }), ctx(), 'coolant-concentration')).to.deep.include({
      severity: 'note',
      path: 'coolant.concentrationPct',
    });
    expect(find(content({ coolant: { concentrationPct: 1.5 } }), ctx(), 'coolant-concentration')).to.not.equal(undefined);
    expect(ids(content({ coolant: { concentrationPct: 2 } }), ctx())).to.not.include('coolant-concentration');
    expect(ids(content({ coolant: { concentrationPct: 5 } }), ctx())).to.not.include('coolant-concentration');
    expect(ids(content({ coolant: { type: 'oil', concentrationPct: 100 } }), ctx())).to.not.include('coolant-concentration');
  });

  it('stock-archived (warning) for each archived record, with its path', () => {
    const r = runChecks(
      content(),
      ctx({ material: material({ archived: true }), wheel: wheel({ archived: true }), machine: machine({ archived: true }) }),
    ).filter((x) => x.id === 'stock-archived');
    expect(r.map((x) => x.path)).to.deep.equal(['scope.materialId', 'cutting.wheelId', 'cutting.machineId']);
    expect(r.every((x) => x.severity === 'warning')).to.equal(true);
  });

  describe("cutting power against the motor (P = Q · u, Malkin & Guo, Grinding Technology, 2nd ed.; the lab's share, common practice)", () => {
    // The fixture cuts a Ø40 bar with a 1.5 mm wheel at 0.5 mm/s: Q = 0.5 × 1.5 × 40 = 30 mm³/s at the centre;
    // at 40 J/mm³, P = 30 × 40 = 1200 W — computed by hand.
    const limits = (powerWarningPct: number) => ({ ...ctx().limits, specificEnergyJMm3: { 'plain-low-alloy-steel': 40 }, powerWarningPct });
    const on = (motorPowerKw: number | null, pct = 80) => ctx({ machine: machine({ motorPowerKw }), limits: limits(pct) });

    it('cutting-power-high (warning): present just above the share, absent at it (1200 W of a 1.5 kW motor = 80 %)', () => {
      expect(ids(content(), on(1.5))).to.not.include('cutting-power-high');
      expect(ids(content(), on(1.5, 79.9))).to.include('cutting-power-high');
      const high = find(content(), on(1.49), 'cutting-power-high')!; // 1200 / 1490 = 80.5 %
      expect(high).to.deep.include({ severity: 'warning', path: 'cutting.feedMmS' });
      expect(high.message).to.contain('1.20 kW at 40 J/mm³').and.contain('81 % of the 1.49 kW motor').and.contain('above 80 %');
      expect(high.reason).to.contain('Malkin & Guo').and.contain('order-of-magnitude');
      // A lower feed brings it under the share: 0.4 × 1.5 × 40 × 40 = 960 W = 64 %.
      expect(ids(content({ cutting: { feedMmS: 0.4 } }), on(1.49))).to.not.include('cutting-power-high');
    });

    it('says when the estimate is above the motor itself (1200 W on a 1 kW motor)', () => {
      expect(find(content(), on(1), 'cutting-power-high')!.message).to.contain('more than the 1.00 kW motor');
    });

    it('motor-power-unknown (note) instead of silence when the machine does not give its motor power', () => {
      const note = find(content(), on(null), 'motor-power-unknown')!;
      expect(note).to.deep.include({ severity: 'note', path: 'cutting.machineId' });
      expect(note.message).to.contain('Bench saw').and.contain('1.20 kW');
      expect(ids(content(), on(null))).to.not.include('cutting-power-high');
      expect(ids(content(), on(5.5))).to.not.include('motor-power-unknown');
    });

    it('neither when no specific energy is set for the group (nothing to check)', () => {
      const none = ctx({ machine: machine({ motorPowerKw: null }) });
      expect(ids(content(), none)).to.not.include('motor-power-unknown');
      expect(ids(content(), ctx({ machine: machine({ motorPowerKw: 0.5 }) }))).to.not.include('cutting-power-high');
    });
  });

  it('never throws on half-typed content', () => {
    const empty = { scope: undefined, cutting: undefined, clamping: undefined, coolant: undefined } as unknown as RecipeContent;
    expect(() => runChecks(empty, ctx())).to.not.throw();
    expect(ids(empty, ctx())).to.include('clamping-missing');
  });

  it('worstSeverity', () => {
    const r = (severity: CheckResult['severity']): CheckResult => ({ id: 'x', severity, message: 'm', reason: 'r', path: null });
    expect(worstSeverity([])).to.equal(null);
    expect(worstSeverity([r('note')])).to.equal('note');
    expect(worstSeverity([r('note'), r('warning')])).to.equal('warning');
    expect(worstSeverity([r('warning'), r('blocker'), r('note')])).to.equal('blocker');
  });
});

describe('changeReasonMissing', () => {
  // Common practice in change control: a revision says why it was made (ISO 9001:2015 §7.5.3.2 asks that changes be controlled).
  it('asks for a reason from version 2 on', () => {
    expect(changeReasonMissing(2, '')).to.match(/required from version 2/);
    expect(changeReasonMissing(3, '   ')).to.match(/required from version 2/);
  });
  it('lets version 1 and any version with a reason pass', () => {
    expect(changeReasonMissing(1, '')).to.equal(null);
    expect(changeReasonMissing(2, 'Feed lowered after burn marks.')).to.equal(null);
  });
});
