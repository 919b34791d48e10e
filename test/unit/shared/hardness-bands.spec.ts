import { expect } from 'chai';
import { describeWindow, hardestBandRows, isAbove, overlapsBand, pointWindow, usableWindow } from '../../../shared/hardness-bands';
import type { HardnessWindow } from '../../../shared/schemas/stock';

const w = (min: number, max: number, scale: HardnessWindow['scale']): HardnessWindow => ({ min, max, scale });

describe('shared/hardness-bands', () => {
  it('compares on the band scale; ends touch (35 HRC = 345 HV, ASTM E140 Table 1)', () => {
    expect(overlapsBand(w(25, 35, 'HRC'), w(35, 50, 'HRC'), 'plain-low-alloy-steel')).to.equal(true);
    expect(overlapsBand(w(25, 34.9, 'HRC'), w(35, 50, 'HRC'), 'plain-low-alloy-steel')).to.equal(false);
    expect(overlapsBand(pointWindow({ value: 35, scale: 'HRC' }), w(80, 345, 'HV'), 'plain-low-alloy-steel')).to.equal(true);
    expect(overlapsBand(pointWindow({ value: 36, scale: 'HRC' }), w(80, 345, 'HV'), 'plain-low-alloy-steel')).to.equal(false);
  });

  it('falls back to HV where the band scale has no value (170 HBW is below Table 1, 170 HV by Table 2 from memory)', () => {
    // 170–230 HBW → HRC fails at 170; in HV: 170–242 against 345–513 (35–50 HRC)
    expect(overlapsBand(w(170, 230, 'HBW'), w(35, 50, 'HRC'), 'plain-low-alloy-steel')).to.equal(false);
    expect(overlapsBand(w(170, 230, 'HBW'), w(80, 345, 'HV'), 'plain-low-alloy-steel')).to.equal(true);
  });

  it('cannot tell across scales where the group has no table (ASTM E140 Tables 1–2 are for steels only)', () => {
    expect(overlapsBand(w(30, 40, 'HRC'), w(300, 400, 'HV'), 'nickel-cobalt')).to.equal(null);
    expect(overlapsBand(w(300, 320, 'HV'), w(300, 400, 'HV'), 'nickel-cobalt')).to.equal(true);
    expect(isAbove(w(30, 40, 'HRC'), w(300, 400, 'HV'), 'titanium')).to.equal(null);
  });

  it('isAbove: wholly above (1150 HV is above 50–68 HRC = 513–940 HV, ASTM E140 Table 1)', () => {
    expect(isAbove(pointWindow({ value: 1150, scale: 'HV' }), w(50, 68, 'HRC'), 'plain-low-alloy-steel')).to.equal(true);
    expect(isAbove(pointWindow({ value: 900, scale: 'HV' }), w(50, 68, 'HRC'), 'plain-low-alloy-steel')).to.equal(false);
  });

  it('hardestBandRows: only for a hardness above every band, and only the band that reaches highest (touching bands included)', () => {
    const rows = [
      { id: 1, group: 'plain-low-alloy-steel' as const, hardness: w(80, 345, 'HV') },
      { id: 2, group: 'plain-low-alloy-steel' as const, hardness: w(35, 50, 'HRC') },
      { id: 3, group: 'plain-low-alloy-steel' as const, hardness: w(50, 68, 'HRC') },
      { id: 4, group: 'plain-low-alloy-steel' as const, hardness: null },
      { id: 5, group: 'copper' as const, hardness: w(50, 300, 'HV') },
    ];
    expect(hardestBandRows(rows, 'plain-low-alloy-steel', pointWindow({ value: 1150, scale: 'HV' })).map((r) => r.id)).to.deep.equal([3]);
    expect(hardestBandRows(rows, 'plain-low-alloy-steel', pointWindow({ value: 60, scale: 'HRC' }))).to.deep.equal([]);
    expect(hardestBandRows(rows, 'ceramic-glass', pointWindow({ value: 1500, scale: 'HV' }))).to.deep.equal([]);
  });

  it('half-typed windows are not usable and compare as "cannot tell"', () => {
    for (const bad of [
      null,
      { min: NaN, max: 3, scale: 'HV' },
      { min: 5, max: 3, scale: 'HV' },
      { min: 0, max: 3, scale: 'HV' },
      { min: 1, max: 3, scale: 'X' },
    ]) {
      expect(usableWindow(bad as HardnessWindow | null), JSON.stringify(bad)).to.equal(false);
      if (bad) expect(overlapsBand(bad as HardnessWindow, w(1, 10, 'HV'), 'copper')).to.equal(null);
    }
    expect(describeWindow(w(25, 35, 'HRC'))).to.equal('25–35 HRC');
    expect(describeWindow(w(30, 30, 'HRC'))).to.equal('30 HRC');
  });
});
