import { expect } from 'chai';
import type { RecipeContext } from '../../../shared/recipe-context';
import { CHECK_IDS, changeReasonMissing, runChecks, worstSeverity, type CheckResult } from '../../../shared/recipe-checks';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import type { FeedCeiling } from '../../../shared/schemas/lab-settings';
import { selectionRowsWithWheels } from '../../../shared/selection-table';
import { NO_LAB_LIMITS, type LabLimits, type SelectionRowWheel } from '../../../shared/stock-types';
import { matchesStarterWheel, STARTER_SELECTION } from '../../../shared/wheel-suggestion';
import { DEMO_WHEELS } from '../../../seeds/data/demo-stock';
import { content, ctx, machine, material, precisionMachine, rimWheel, wheel } from './fixtures';

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
    it('a CBN rim wheel on soft steel: the message describes loading, not wear (soft ductile metal loads CBN; common practice)', () => {
      const cbn = precisionCtx({ wheel: rimWheel({ specification: 'B126M' }) });
      const r = find(precision({ scope: { group: 'plain-low-alloy-steel' } }), cbn, 'rim-wheel-on-metal')!;
      expect(r.message)
        .to.contain('CBN')
        .and.match(/loads \(clogs\)/);
      expect(`${r.message} ${r.reason}`).to.not.match(/wear/);
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

  describe("feed-above-ceiling (warning): the lab's ceiling for group × hardness band × machine class (common practice: abrasive cut-off 0.05–1.0 mm/s, precision 0.005–0.2 mm/s, harder material lower)", () => {
    const plain = (machineClass: FeedCeiling['machineClass'], band: FeedCeiling['hardness'], maxFeedMmS: number): FeedCeiling => ({
      group: 'plain-low-alloy-steel',
      hardness: band,
      machineClass,
      maxFeedMmS,
    });
    const soft = { min: 80, max: 345, scale: 'HV' } as const;
    const mid = { min: 35, max: 50, scale: 'HRC' } as const;
    const hard = { min: 50, max: 68, scale: 'HRC' } as const;
    const limits: LabLimits = {
      ...NO_LAB_LIMITS,
      feedCeilings: [
        plain('bench-abrasive', soft, 0.6),
        plain('bench-abrasive', mid, 0.4),
        plain('bench-abrasive', hard, 0.25),
        plain('precision', soft, 0.1),
        plain('precision', hard, 0.05),
        { group: 'copper', hardness: null, machineClass: 'bench-abrasive', maxFeedMmS: 0.1 },
      ],
    };
    const at = (value: number, scale: 'HRC' | 'HV' = 'HRC') => ctx({ limits, material: material({ hardness: { value, scale } }) });

    it('takes the band the hardness lies in (30 HRC = 302 HV, ASTM E140 Table 1: the soft band, 0.6 mm/s)', () => {
      expect(ids(content({ cutting: { feedMmS: 0.5 } }), at(30))).to.not.include('feed-above-ceiling');
      const r = find(content({ cutting: { feedMmS: 0.5 } }), at(45), 'feed-above-ceiling')!;
      expect(r).to.deep.include({ severity: 'warning', path: 'cutting.feedMmS' });
      expect(r.message).to.contain('0.4 mm/s').and.contain('35–50 HRC').and.contain('bench abrasive');
      expect(ids(content({ cutting: { feedMmS: 0.4 } }), at(45))).to.not.include('feed-above-ceiling'); // at the ceiling: no warning
    });
    it('a hardness on a band edge or a window across bands takes the lowest ceiling that applies', () => {
      // 35 HRC = 345 HV (ASTM E140, Table 1): in the soft band and the 35–50 HRC band, so 0.4 mm/s
      expect(find(content({ cutting: { feedMmS: 0.5 } }), at(35), 'feed-above-ceiling')!.message).to.contain('0.4 mm/s');
      const window = content({ scope: { hardness: { min: 45, max: 55, scale: 'HRC' } }, cutting: { feedMmS: 0.3 } });
      expect(find(window, at(30), 'feed-above-ceiling')!.message)
        .to.contain('0.25 mm/s')
        .and.contain('50–68 HRC');
    });
    it('without a hardness, or outside every band, the lowest ceiling of the group on that machine class applies (the cautious reading)', () => {
      const none = ctx({ limits, material: material({ hardness: null }) });
      expect(find(content({ cutting: { feedMmS: 0.3 } }), none, 'feed-above-ceiling')!.message)
        .to.contain('0.25 mm/s')
        .and.contain('no hardness given');
      expect(find(content({ cutting: { feedMmS: 0.3 } }), at(70), 'feed-above-ceiling')!.message)
        .to.contain('0.25 mm/s')
        .and.contain('none of the lab');
    });
    it('precision saws have their own, far lower ceilings', () => {
      const x = precisionCtx({ limits, material: material({ hardness: { value: 60, scale: 'HRC' } }) });
      const c = precision({ scope: { materialId: 1, group: 'plain-low-alloy-steel' }, cutting: { feedMmS: 0.1 } });
      expect(find(c, x, 'feed-above-ceiling')!.message)
        .to.contain('0.05 mm/s')
        .and.contain('precision');
      expect(ids({ ...c, cutting: { ...c.cutting, feedMmS: 0.05 } }, x)).to.not.include('feed-above-ceiling');
    });
    it('no row for the group and class, or a traverse pass (judged by its removal per mm of wheel width instead): no warning', () => {
      expect(
        ids(content({ cutting: { feedMmS: 0.5 } }), ctx({ limits: { ...NO_LAB_LIMITS, feedCeilings: [plain('floor-abrasive', null, 0.1)] } })),
      ).to.not.include('feed-above-ceiling');
      const traverse = content({ cutting: { feedMmS: 2, cutMotion: 'traverse-pass', passes: 4 } });
      expect(ids(traverse, at(45))).to.not.include('feed-above-ceiling');
    });
  });

  describe('orientation-rule-missing (warning): a coated part must say where the wheel enters and leaves; a case-hardened one needs its orientation rule', () => {
    it('coated: the structured wheel path is needed, the free text alone is not enough', () => {
      const coated = ctx({ material: material({ coated: true }) });
      const r = find(content({ clamping: { orientationRule: 'Wheel enters through the coating.' } }), coated, 'orientation-rule-missing')!;
      expect(r).to.deep.include({ severity: 'warning', path: 'clamping.wheelPath' });
      expect(r.message).to.contain('enters and leaves');
      for (const wheelPath of ['enters-coating', 'not-applicable'] as const)
        expect(ids(content({ clamping: { wheelPath } }), coated), wheelPath).to.not.include('orientation-rule-missing');
    });
    it('content stored before the wheel path existed (no key) reads as not given, and every other check still runs', () => {
      const coated = ctx({ material: material({ coated: true }) });
      const stored = content();
      delete (stored.clamping as Partial<RecipeContent['clamping']>).wheelPath;
      expect('wheelPath' in stored.clamping).to.equal(false);
      expect(runChecks(stored, coated)).to.deep.equal(runChecks(content({ clamping: { wheelPath: null } }), coated));
      expect(find(stored, coated, 'orientation-rule-missing')!.path).to.equal('clamping.wheelPath');
      expect(ids(stored, ctx())).to.deep.equal([]);
    });
    it('case-hardened: the orientation rule, as before', () => {
      expect(find(content(), ctx({ material: material({ caseHardened: true, caseDepthMm: 0.8 }) }), 'orientation-rule-missing')).to.deep.include({
        path: 'clamping.orientationRule',
      });
      expect(find(content(), ctx({ material: material({ caseHardened: true, caseDepthMm: 0.8 }) }), 'orientation-rule-missing')!.message).to.contain(
        'case 0.8 mm',
      );
      expect(
        ids(
          content({ clamping: { orientationRule: 'Wheel enters at the tooth tip.' } }),
          ctx({ material: material({ caseHardened: true, caseDepthMm: 0.8 }) }),
        ),
      ).to.not.include('orientation-rule-missing');
      expect(ids(content(), ctx())).to.not.include('orientation-rule-missing');
    });
  });

  describe('rim-wheel-low-rpm (note): well below what the rim wheel could run at, on abrasive cut-off machines only', () => {
    // A rim wheel Ø150, 40 m/s on the bench saw (rpm 1000–4000): ceiling min(4000, floor(60 000·40/(π·150)) = 5092) = 4000; 75 % = 3000; computed by hand
    const bench = ctx({ material: null, wheel: rimWheel() });
    const c = (wheelRpm: number) => precision({ cutting: { machineId: 1, wheelRpm } });
    it('fires on an abrasive saw, with the numbers', () => {
      const r = find(c(2000), bench, 'rim-wheel-low-rpm')!;
      expect(r.severity).to.equal('note');
      expect(r.message).to.contain('4000 rpm').and.contain('consumable');
      expect(ids(c(3000), bench)).to.not.include('rim-wheel-low-rpm');
    });
    it('never on a precision saw, which turns rim wheels slowly by design (common practice: a gentle cut for brittle and delicate specimens)', () => {
      expect(ids(precision({ cutting: { wheelRpm: 300 } }), precisionCtx())).to.not.include('rim-wheel-low-rpm');
      expect(find(c(2000), bench, 'rim-wheel-low-rpm')!.reason).to.contain('precision saws');
    });
    it('never for a bonded wheel: lowering the rpm is the remedy there', () => {
      expect(ids(content({ cutting: { wheelRpm: 1000 } }), ctx())).to.not.include('rim-wheel-low-rpm');
    });
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

  describe('the wheel against the lab selection table (abrasive: common practice, ASTM E3 from memory; bond: harder material → softer bond, common practice; grades A soft … Z hard after ISO 525)', () => {
    const row = (
      id: number,
      group: SelectionRowWheel['group'],
      hardness: SelectionRowWheel['hardness'],
      kind: 'bonded' | 'rim',
      specification: string,
    ): SelectionRowWheel => ({
      id,
      group,
      hardness,
      wheelId: id,
      note: '',
      wheel: { kind, specification },
    });
    // The starting table's shape: steel banded at about 35 and 50 HRC (from memory), SiC for aluminium and titanium, diamond for ceramics.
    const TABLE = [
      row(1, 'plain-low-alloy-steel', { min: 80, max: 345, scale: 'HV' }, 'bonded', 'A60P5B'),
      row(2, 'plain-low-alloy-steel', { min: 35, max: 50, scale: 'HRC' }, 'bonded', 'A46M5B'),
      row(3, 'plain-low-alloy-steel', { min: 50, max: 68, scale: 'HRC' }, 'bonded', 'A36K5B'),
      row(4, 'aluminium-magnesium', null, 'bonded', 'C80P5B'),
      row(5, 'titanium', null, 'bonded', 'C80N5B'),
      row(6, 'ceramic-glass', null, 'rim', 'D126N100M'),
    ];
    const withTable = (over: Parameters<typeof ctx>[0] = {}) => ctx({ selectionRows: TABLE, wheel: wheel({ specification: 'A60P5B' }), ...over });
    const hrc = (value: number) => material({ hardness: { value, scale: 'HRC' } });

    it('the clean setup against the table raises nothing', () => {
      expect(runChecks(content(), withTable())).to.deep.equal([]);
    });

    describe('wheel-abrasive-unsuited (warning)', () => {
      it('silicon carbide on steel, where the table gives aluminium oxide', () => {
        const r = find(content(), withTable({ wheel: wheel({ specification: 'C60P5B' }) }), 'wheel-abrasive-unsuited')!;
        expect(r).to.deep.include({ severity: 'warning', path: 'cutting.wheelId' });
        expect(r.message).to.contain('silicon carbide wheel').and.contain('gives aluminium oxide');
      });
      it('alumina on aluminium or titanium, where the table gives silicon carbide', () => {
        for (const group of ['aluminium-magnesium', 'titanium'] as const) {
          const r = find(content({ scope: { materialId: null, group } }), withTable({ material: null }), 'wheel-abrasive-unsuited')!;
          expect(r.message, group).to.contain('aluminium oxide wheel').and.contain('gives silicon carbide');
        }
        expect(
          ids(content({ scope: { materialId: null, group: 'titanium' } }), withTable({ material: null, wheel: wheel({ specification: 'C80N5B' }) })),
        ).to.not.include('wheel-abrasive-unsuited');
      });
      it('a rim wheel against the rim rows: CBN on ceramics, where the table gives diamond; rim wheels on metal are left to rim-wheel-on-metal', () => {
        const cbn = precisionCtx({ selectionRows: TABLE, wheel: rimWheel({ specification: 'B126M' }) });
        expect(find(precision(), cbn, 'wheel-abrasive-unsuited')!.message).to.contain('cubic boron nitride');
        expect(ids(precision(), precisionCtx({ selectionRows: TABLE }))).to.not.include('wheel-abrasive-unsuited');
        expect(ids(precision({ scope: { group: 'plain-low-alloy-steel' } }), precisionCtx({ selectionRows: TABLE }))).to.not.include('wheel-abrasive-unsuited');
      });
      it('no verdict where the table has no row for the group and kind', () => {
        expect(ids(content({ scope: { materialId: null, group: 'copper' } }), withTable({ material: null }))).to.not.include('wheel-abrasive-unsuited');
        expect(ids(content({ scope: { materialId: null, group: 'ceramic-glass' } }), withTable({ material: null }))).to.not.include('wheel-abrasive-unsuited');
        expect(ids(content(), ctx({ wheel: wheel({ specification: 'C60P5B' }) }))).to.not.include('wheel-abrasive-unsuited');
      });
    });

    describe('wheel-bond-too-hard / wheel-bond-too-soft (warnings), from the bands of the table', () => {
      it('a hard bond (grade P) on hardened low-alloy steel at 45 HRC, where the table gives a medium bond', () => {
        const r = find(content(), withTable({ material: hrc(45) }), 'wheel-bond-too-hard')!;
        expect(r).to.deep.include({ severity: 'warning', path: 'cutting.wheelId' });
        expect(r.message).to.contain('grade P').and.contain('a medium bond').and.contain('at 45 HRC').and.contain('glazes');
        expect(ids(content(), withTable({ material: hrc(45), wheel: wheel({ specification: 'A46M5B' }) }))).to.not.include.members([
          'wheel-bond-too-hard',
          'wheel-bond-too-soft',
        ]);
      });
      it('a soft bond (grade K) on soft steel at 30 HRC (= 302 HV, ASTM E140 Table 1: the 80–345 HV band, hard bond)', () => {
        const r = find(content(), withTable({ wheel: wheel({ specification: 'A60K5B' }) }), 'wheel-bond-too-soft')!;
        expect(r.message).to.contain('grade K').and.contain('a hard bond').and.contain('wears fast');
      });
      it('on a band edge both bands count: 35 HRC = 345 HV takes hard and medium, 50 HRC takes medium and soft', () => {
        const at35 = withTable({ material: hrc(35) });
        for (const spec of ['A60P5B', 'A60M5B'])
          expect(ids(content(), { ...at35, wheel: wheel({ specification: spec }) }), spec).to.not.include('wheel-bond-too-hard');
        expect(ids(content(), { ...at35, wheel: wheel({ specification: 'A60K5B' }) })).to.include('wheel-bond-too-soft');
        const at50 = withTable({ material: hrc(50) });
        expect(ids(content(), at50)).to.include('wheel-bond-too-hard');
        expect(ids(content(), { ...at50, wheel: wheel({ specification: 'A60K5B' }) })).to.not.include('wheel-bond-too-soft');
      });
      it("the scope's window wins over the material's reading; without any hardness every band of the group counts (no verdict)", () => {
        expect(ids(content({ scope: { hardness: { min: 52, max: 60, scale: 'HRC' } } }), withTable())).to.include('wheel-bond-too-hard');
        const unknown = withTable({ material: hrc(45) });
        unknown.material = material({ hardness: null });
        for (const spec of ['A60P5B', 'A60K5B'])
          expect(ids(content(), { ...unknown, wheel: wheel({ specification: spec }) }), spec).to.not.include.members([
            'wheel-bond-too-hard',
            'wheel-bond-too-soft',
          ]);
      });
      it('a coated part: a bond the table gives either layer is accepted; a coating above every band takes the hardest band (1150 HV > 940 HV = 68 HRC, ASTM E140 Table 1)', () => {
        const coated = material({ coated: true, coatingHardness: { value: 1150, scale: 'HV' } });
        const soft = wheel({ specification: 'A60J5B' });
        expect(ids(content({ clamping: { wheelPath: 'enters-coating' } }), withTable({ material: coated, wheel: soft }))).to.not.include('wheel-bond-too-soft');
        expect(ids(content({ clamping: { wheelPath: 'enters-coating' } }), withTable({ material: coated }))).to.not.include('wheel-bond-too-hard');
        // The same reading on a part that is not coated does not count.
        expect(ids(content(), withTable({ material: material({ coatingHardness: { value: 1150, scale: 'HV' } }), wheel: soft }))).to.include(
          'wheel-bond-too-soft',
        );
      });
      it('rim wheels and superabrasive markings have no ISO 525 grade band to compare', () => {
        expect(ids(content(), withTable({ material: hrc(45), wheel: wheel({ specification: 'B151N100B' }) }))).to.not.include('wheel-bond-too-hard');
        expect(ids(precision({ scope: { group: 'plain-low-alloy-steel' } }), precisionCtx({ selectionRows: TABLE }))).to.not.include.members([
          'wheel-bond-too-hard',
          'wheel-bond-too-soft',
        ]);
      });
    });

    it('wheel-marking-unparsed (note): a marking the parser cannot read is named, and the table checks skip that wheel', () => {
      const odd = withTable({ wheel: wheel({ name: 'Mystery wheel', specification: 'XZ-99' }) });
      const r = find(content(), odd, 'wheel-marking-unparsed')!;
      expect(r).to.deep.include({ severity: 'note', path: 'cutting.wheelId' });
      expect(r.message).to.contain('"XZ-99"').and.contain('"Mystery wheel"').and.contain('skip');
      expect(ids(content(), odd)).to.not.include.members(['wheel-abrasive-unsuited', 'wheel-bond-too-hard', 'wheel-bond-too-soft']);
      expect(ids(content(), withTable({ wheel: wheel({ specification: 'A60P5RF' }) }))).to.not.include('wheel-marking-unparsed'); // reinforced rubber now parses
    });

    it("the starting table is consistent with these rules: each banded row's wheel, at its band's middle, raises no abrasive or bond warning (the demo wheels)", () => {
      const demoWheels = DEMO_WHEELS.map((w, i) => wheel({ id: i + 1, name: w.name, kind: w.kind, specification: w.specification }));
      const rows = STARTER_SELECTION.flatMap((r, i) =>
        demoWheels.filter((w) => matchesStarterWheel(r.wheel, w)).map((w) => ({ id: i + 1, group: r.group, hardness: r.hardness, wheelId: w.id, note: '' })),
      );
      const table = selectionRowsWithWheels(rows, demoWheels);
      for (const r of rows) {
        const w = demoWheels.find((x) => x.id === r.wheelId)!;
        const hardness = r.hardness
          ? { min: (r.hardness.min + r.hardness.max) / 2, max: (r.hardness.min + r.hardness.max) / 2, scale: r.hardness.scale }
          : null;
        const c = content({ scope: { materialId: null, group: r.group, hardness } });
        const found = ids(c, ctx({ material: null, wheel: w, selectionRows: table }));
        expect(found, `${r.group} ${JSON.stringify(r.hardness)} ${w.specification}`).to.not.include.members([
          'wheel-abrasive-unsuited',
          'wheel-bond-too-hard',
          'wheel-bond-too-soft',
        ]);
      }
    });
  });

  describe("traverse-removal-above-ceiling (warning): removal per mm of wheel width, Q'w = removal rate / wheel thickness (Malkin & Guo, Grinding Technology — from memory)", () => {
    // A 40 mm high block in 4 passes: a = 10 mm; at 2 mm/s over a 1.5 mm wheel Q = 2 · 1.5 · 10 = 30 mm³/s, Q'w = 30 / 1.5 = 20 mm³/s per mm; computed by hand
    const traverse = content({
      scope: { shape: 'rectangular', sizeMinMm: 10, sizeMaxMm: 40, widthMm: 30 },
      cutting: { feedMmS: 2, cutMotion: 'traverse-pass', passes: 4 },
    });
    const limit = (q: number) => ctx({ limits: { ...NO_LAB_LIMITS, traverseRemovalCeilings: { 'plain-low-alloy-steel': q } } });
    it('fires above the ceiling, with the numbers', () => {
      const r = find(traverse, limit(16), 'traverse-removal-above-ceiling')!;
      expect(r).to.deep.include({ severity: 'warning', path: 'cutting.feedMmS' });
      expect(r.message).to.contain('20.0 mm³/s per mm').and.contain('30.0 mm³/s').and.contain('16 mm³/s per mm');
    });
    it('not at the ceiling, not without one, not for a plunge', () => {
      expect(ids(traverse, limit(20))).to.not.include('traverse-removal-above-ceiling');
      expect(ids(traverse, ctx())).to.not.include('traverse-removal-above-ceiling');
      expect(ids({ ...traverse, cutting: { ...traverse.cutting, cutMotion: 'straight-plunge', passes: null } }, limit(1))).to.not.include(
        'traverse-removal-above-ceiling',
      );
    });
  });

  describe("long-plunge-contact (note): a straight plunge through more than the lab's length (common practice: pulse, rock, step or traverse large sections)", () => {
    const long = (limitMm: number | null) => ctx({ limits: { ...NO_LAB_LIMITS, longContactMm: limitMm } });
    it('a 60 mm bar meets 60 mm of material at its middle (chord 2·√(30·30)), above 50 mm', () => {
      const r = find(content({ scope: { sizeMaxMm: 60 } }), long(50), 'long-plunge-contact')!;
      expect(r).to.deep.include({ severity: 'note', path: 'cutting.cutMotion' });
      expect(r.message).to.contain('60.0 mm').and.contain('50 mm').and.contain('rocking');
    });
    it('a rectangular section meets its width all the way down', () => {
      expect(find(content({ scope: { shape: 'rectangular', sizeMaxMm: 30, widthMm: 80 } }), long(50), 'long-plunge-contact')!.message).to.contain('80.0 mm');
    });
    it('not at the length itself, not for other motions, not without a lab length', () => {
      expect(ids(content({ scope: { sizeMaxMm: 50 } }), long(50))).to.not.include('long-plunge-contact');
      expect(ids(content({ scope: { sizeMaxMm: 60 }, cutting: { cutMotion: 'pulsed-plunge' } }), long(50))).to.not.include('long-plunge-contact');
      expect(ids(content({ scope: { sizeMaxMm: 60 } }), long(null))).to.not.include('long-plunge-contact');
    });
  });

  describe('clamping-one-side (warning): the offcut can pinch the wheel (common practice: clamp both sides of the cut)', () => {
    it('fires when the part is clamped on one side only', () => {
      expect(find(content({ clamping: { bothSides: false } }), ctx(), 'clamping-one-side')).to.deep.include({
        severity: 'warning',
        path: 'clamping.bothSides',
      });
      expect(
        find(
          precision({ clamping: { method: 'small-part-gripper', bothSides: false }, cutting: { machineId: 1 } }),
          ctx({ material: null, wheel: rimWheel() }),
          'clamping-one-side',
        ),
      ).to.not.equal(undefined); // a rim wheel on an abrasive saw
    });
    it('not where one side is the usual way: a wax or adhesive mount, a rim wheel on a precision saw; not when both sides are clamped', () => {
      expect(ids(precision({ clamping: { bothSides: false } }), precisionCtx())).to.not.include('clamping-one-side');
      expect(ids(precision({ clamping: { method: 'small-part-gripper', bothSides: false } }), precisionCtx())).to.not.include('clamping-one-side');
      expect(ids(content({ clamping: { method: 'adhesive-wax-mount', bothSides: false } }), ctx())).to.not.include('clamping-one-side');
      expect(ids(content(), ctx())).to.not.include('clamping-one-side');
    });
  });

  it('coolant-flow-zero (warning): a coolant chosen with no flow runs the cut dry (common practice)', () => {
    expect(find(content({ coolant: { flowLMin: 0 } }), ctx(), 'coolant-flow-zero')).to.deep.include({ severity: 'warning', path: 'coolant.flowLMin' });
    expect(find(content({ coolant: { type: 'oil', concentrationPct: null, flowLMin: 0 } }), ctx(), 'coolant-flow-zero')!.message).to.contain('Cutting oil');
    for (const flowLMin of [null, 0.1, 10]) expect(ids(content({ coolant: { flowLMin } }), ctx()), String(flowLMin)).to.not.include('coolant-flow-zero');
    expect(ids(content({ coolant: { type: 'dry', concentrationPct: null, flowLMin: null } }), ctx())).to.not.include('coolant-flow-zero');
  });

  describe('wheel-exits-coating (warning): the wheel must press the coating on, not peel it off (common practice)', () => {
    const coated = ctx({ material: material({ name: 'Sprayed shaft', coated: true }) });
    it('fires when the wheel leaves through the coating', () => {
      const r = find(content({ clamping: { wheelPath: 'exits-coating' } }), coated, 'wheel-exits-coating')!;
      expect(r).to.deep.include({ severity: 'warning', path: 'clamping.wheelPath' });
      expect(r.message).to.contain('Sprayed shaft').and.contain('peels').and.contain('enters through the coating');
      expect(find(content({ clamping: { wheelPath: 'enters-and-exits-coating' } }), coated, 'wheel-exits-coating')!.message).to.contain('both sides');
    });
    it('not when it enters through the coating, not when the cut does not cross it, not on an uncoated material', () => {
      for (const wheelPath of ['enters-coating', 'not-applicable', null] as const)
        expect(ids(content({ clamping: { wheelPath } }), coated)).to.not.include('wheel-exits-coating');
      expect(ids(content({ clamping: { wheelPath: 'exits-coating' } }), ctx())).to.not.include('wheel-exits-coating');
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
