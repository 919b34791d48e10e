/**
 * The safety rules on wheel, machine and coolant: the machine's top speed against the wheel's
 * marked maximum, the spindle limit, the flange, wet-use-only wheels cut dry, the marked
 * figure compared in its own unit, and the right wheel standard for bonded and rim wheels.
 * Worked examples by hand; sources named on each block.
 */
import { expect } from 'chai';
import { markedSpeedPair } from '../../../shared/peripheral-speed';
import type { RecipeContext } from '../../../shared/recipe-context';
import { CHECK_IDS, runChecks, type CheckResult } from '../../../shared/recipe-checks';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import type { WheelRecord } from '../../../shared/stock-types';
import { content, ctx, machine, precisionMachine, rimWheel, wheel } from './fixtures';

const ids = (c: RecipeContent, x: RecipeContext) => runChecks(c, x).map((r) => r.id);
const find = (c: RecipeContent, x: RecipeContext, id: string): CheckResult | undefined => runChecks(c, x).find((r) => r.id === id);

/** Ceramic on the precision saw with a rim wheel, at 4000 rpm. */
const precision = (over: Parameters<typeof content>[0] = {}) =>
  content({
    ...over,
    scope: { materialId: null, group: 'ceramic-glass', ...over.scope },
    cutting: { machineId: 2, wheelId: 2, wheelRpm: 4000, feedMmS: 0.05, ...over.cutting },
    clamping: { method: 'adhesive-wax-mount', ...over.clamping },
  });
const precisionCtx = (over: Partial<RecipeContext> = {}) => ctx({ material: null, wheel: rimWheel(), machine: precisionMachine(), ...over });
/** The 200 mm blade marked 50 m/s: 60 000·50/(π·200) = 4774.6 rpm. */
const blade200 = (over: Partial<WheelRecord> = {}) => rimWheel({ diameterMm: 200, maxSpeedMs: 50, ...over });
const rpmWheel = (diameterMm: number, rpm: number, over: Partial<WheelRecord> = {}): WheelRecord =>
  rimWheel({ diameterMm, maxSpeedMarkedIn: 'rpm', ...markedSpeedPair(diameterMm, 'rpm', rpm), ...over });

describe('shared/recipe-checks: safety of wheel, machine and coolant', () => {
  it('lists the new rule ids', () => {
    expect(CHECK_IDS).to.include.members(['machine-can-overspeed-wheel', 'rpm-above-spindle-limit', 'flange-too-small', 'wet-use-only-dry']);
  });

  describe('machine-can-overspeed-wheel (blocker; OSHA 29 CFR 1910.215(d)(1), ANSI B7.1)', () => {
    it('a saw reaching 5000 rpm with a 200 mm blade marked 50 m/s: 52.4 m/s at the rim, above 50 m/s (4774 rpm), whatever the recipe rpm', () => {
      const r = find(precision(), precisionCtx({ wheel: blade200() }), 'machine-can-overspeed-wheel')!;
      expect(r).to.deep.include({ severity: 'blocker', path: 'cutting.wheelId' });
      expect(r.message).to.contain('reaches 5000 rpm').and.contain('52.4 m/s').and.contain('50 m/s').and.contain('4774 rpm');
      expect(r.message).to.contain('spindle speed limit');
      expect(r.reason).to.contain('1910.215(d)(1)').and.contain('ANSI B7.1').and.contain('EN 13236');
      // The recipe's own 4000 rpm (41.9 m/s) is within the marking: only the machine is at fault.
      expect(ids(precision(), precisionCtx({ wheel: blade200() }))).to.not.include('wheel-overspeed');
    });
    it('is absent when the machine cannot reach the marking (the 150 mm fixture blade: 40 m/s = 5093 rpm > 5000)', () => {
      expect(ids(precision(), precisionCtx())).to.not.include('machine-can-overspeed-wheel');
    });
    it('the limit exception: a spindle limit at or below the marking (4500 rpm, set by maintenance) clears it', () => {
      const limited = precisionMachine({ spindleLimitRpm: 4500, spindleLimitSetBy: 'Maintenance, work order 2291' });
      expect(ids(precision(), precisionCtx({ wheel: blade200(), machine: limited }))).to.not.include('machine-can-overspeed-wheel');
    });
    it('a limit above the marking does not clear it, and the message names the limit and who set it', () => {
      const limited = precisionMachine({ spindleLimitRpm: 4800, spindleLimitSetBy: 'Maintenance, work order 7' });
      const r = find(precision(), precisionCtx({ wheel: blade200(), machine: limited }), 'machine-can-overspeed-wheel')!;
      expect(r.message).to.contain('limited to 4800 rpm').and.contain('Maintenance, work order 7');
    });
    it('the exact boundary, marked in m/s: a limit of 4774 rpm (49.993 m/s) passes, 4775 rpm (50.004 m/s) does not', () => {
      const at = (limit: number) => precisionMachine({ spindleLimitRpm: limit, spindleLimitSetBy: 'Maintenance' });
      expect(ids(precision(), precisionCtx({ wheel: blade200(), machine: at(4774) }))).to.not.include('machine-can-overspeed-wheel');
      expect(ids(precision(), precisionCtx({ wheel: blade200(), machine: at(4775) }))).to.include('machine-can-overspeed-wheel');
    });
    it('the exact boundary, marked in rpm: 5000 rpm on the saw is within a 5000 rpm marking, over a 4999 rpm one', () => {
      expect(ids(precision(), precisionCtx({ wheel: rpmWheel(150, 5000) }))).to.not.include('machine-can-overspeed-wheel');
      const r = find(precision(), precisionCtx({ wheel: rpmWheel(150, 4999) }), 'machine-can-overspeed-wheel')!;
      expect(r.message).to.contain('reaches 5000 rpm, above the 4999 rpm marked');
    });
    it('cites EN 12413 for a bonded wheel (a 250 mm wheel marked 50 m/s, 3819 rpm, on a 4000 rpm bench saw)', () => {
      const r = find(content(), ctx({ wheel: wheel({ maxSpeedMs: 50 }) }), 'machine-can-overspeed-wheel')!;
      expect(r.message).to.contain('3819 rpm');
      expect(r.reason).to.contain('EN 12413').and.not.contain('EN 13236');
    });
  });

  describe('rpm-above-spindle-limit (blocker; the machine record)', () => {
    const limited = precisionMachine({ spindleLimitRpm: 4500, spindleLimitSetBy: 'Maintenance, work order 2291' });
    it('4600 rpm on a saw limited to 4500 rpm is refused, naming who set the limit', () => {
      const r = find(precision({ cutting: { wheelRpm: 4600 } }), precisionCtx({ machine: limited }), 'rpm-above-spindle-limit')!;
      expect(r).to.deep.include({ severity: 'blocker', path: 'cutting.wheelRpm' });
      expect(r.message).to.contain('4500 rpm').and.contain('work order 2291');
    });
    it('exactly 4500 rpm passes; without a limit nothing is said', () => {
      expect(ids(precision({ cutting: { wheelRpm: 4500 } }), precisionCtx({ machine: limited }))).to.not.include('rpm-above-spindle-limit');
      expect(ids(precision({ cutting: { wheelRpm: 4600 } }), precisionCtx())).to.not.include('rpm-above-spindle-limit');
    });
  });

  describe('flange-too-small (blocker; cut-off wheels at least a quarter of the diameter, ANSI B7.1 / OSHA 29 CFR 1910.215(c))', () => {
    it('a 60 mm flange under a 250 mm wheel (needs 62.5 mm)', () => {
      const r = find(content(), ctx({ machine: machine({ flangeDiameterMm: 60 }) }), 'flange-too-small')!;
      expect(r).to.deep.include({ severity: 'blocker', path: 'cutting.wheelId' });
      expect(r.message).to.contain('60 mm').and.contain('62.5 mm');
      expect(r.reason).to.contain('one-fourth').and.contain('1910.215(c)(1)');
    });
    it('the exact boundary: 62.5 mm passes; the fixtures (80 mm flange, 250 mm wheel) pass', () => {
      expect(ids(content(), ctx({ machine: machine({ flangeDiameterMm: 62.5 }) }))).to.not.include('flange-too-small');
      expect(ids(content(), ctx())).to.not.include('flange-too-small');
    });
    it('a rim wheel: 40 mm under a 200 mm blade is too small (needs 50 mm), and the reason points to the maker and EN 13236', () => {
      const r = find(
        precision(),
        precisionCtx({ wheel: blade200(), machine: precisionMachine({ spindleLimitRpm: 4500, spindleLimitSetBy: 'x' }) }),
        'flange-too-small',
      )!;
      expect(r.message).to.contain('50.0 mm');
      expect(r.reason).to.contain('EN 13236');
    });
  });

  describe('wet-use-only-dry (blocker; a restriction marked on the wheel)', () => {
    it('dry cutting with a wheel marked for wet use only', () => {
      const x = ctx({ wheel: wheel({ restrictions: ['wet-use-only'] }) });
      const r = find(content({ coolant: { type: 'dry', concentrationPct: null } }), x, 'wet-use-only-dry')!;
      expect(r).to.deep.include({ severity: 'blocker', path: 'coolant.type' });
      expect(r.reason).to.contain('EN 12413');
    });
    it('absent when cutting wet with that wheel, or dry with a wheel without the mark (which keeps only the burn warning)', () => {
      expect(ids(content(), ctx({ wheel: wheel({ restrictions: ['wet-use-only'] }) }))).to.not.include('wet-use-only-dry');
      const dryOther = ids(content({ coolant: { type: 'dry', concentrationPct: null } }), ctx({ wheel: wheel({ restrictions: ['no-side-grinding'] }) }));
      expect(dryOther).to.not.include('wet-use-only-dry');
      expect(dryOther).to.include('dry-cut-burn-risk');
    });
    it('cutting oil is not dry', () => {
      expect(ids(content({ coolant: { type: 'oil', concentrationPct: null } }), ctx({ wheel: wheel({ restrictions: ['wet-use-only'] }) }))).to.not.include(
        'wet-use-only-dry',
      );
    });
  });

  describe('wheel-overspeed against the marked figure in its own unit', () => {
    it('a wheel marked 6000 rpm: 6001 rpm is over, 6000 is not (the figure marked, not a converted m/s)', () => {
      const x = precisionCtx({ wheel: rpmWheel(150, 6000), machine: precisionMachine({ rpmMax: 8000 }) });
      const r = find(precision({ cutting: { wheelRpm: 6001 } }), x, 'wheel-overspeed')!;
      expect(r.message).to.contain('above its marked maximum of 6000 rpm').and.contain('Use at most 6000 rpm');
      expect(ids(precision({ cutting: { wheelRpm: 6000 } }), x)).to.not.include('wheel-overspeed');
    });
    it('cites EN 13236 for a diamond or CBN rim wheel and EN 12413 for a bonded one', () => {
      const rim = find(precision({ cutting: { wheelRpm: 5100 } }), precisionCtx({ machine: precisionMachine({ rpmMax: 8000 }) }), 'wheel-overspeed')!;
      expect(rim.reason).to.contain('EN 13236').and.not.contain('EN 12413');
      const bonded = find(
        content({ cutting: { wheelRpm: 3500 } }),
        ctx({ wheel: wheel({ diameterMm: 300, maxSpeedMs: 50 }), machine: machine({ wheelDiameterMaxMm: 300 }) }),
        'wheel-overspeed',
      )!;
      expect(bonded.reason).to.contain('EN 12413').and.not.contain('EN 13236');
    });
  });

  it('wheel-diameter-outside-machine names the standard of the wheel’s kind', () => {
    expect(find(precision(), precisionCtx({ wheel: rimWheel({ diameterMm: 250 }) }), 'wheel-diameter-outside-machine')!.reason).to.contain('EN 13236');
    expect(find(content(), ctx({ wheel: wheel({ diameterMm: 300 }) }), 'wheel-diameter-outside-machine')!.reason).to.contain('EN 12413');
  });
});
