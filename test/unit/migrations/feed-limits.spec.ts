/**
 * The data migration that turns the per-group feed ceilings into feed limits by group ×
 * hardness band × machine class: the starting values, and a lab's own values carried over.
 * Starting values are common practice (abrasive cut-off 0.05–1.0 mm/s, precision saw
 * 0.005–0.2 mm/s, the low end for hard work); the band limits are from memory.
 */
import { expect } from 'chai';
import { DEFAULT_FEED_CEILINGS_MM_S } from '../../../migrations/20261201222730_insert_default_feed_ceilings';
import { feedLimitsFrom, STARTER_PLUNGE_FEEDS, TRAVERSE_REFERENCE_SECTION_MM } from '../../../migrations/20261205183803_insert_feed_limits';
import { feedCeiling } from '../../../shared/schemas/lab-settings';
import { MACHINE_CLASSES, MATERIAL_GROUPS } from '../../../shared/vocabulary';

describe('migration: feed limits from the per-group ceilings', () => {
  it('every group, every machine class, every row valid for the settings schema', () => {
    const { plunge, traverseRemoval } = feedLimitsFrom({});
    for (const group of MATERIAL_GROUPS) {
      for (const machineClass of MACHINE_CLASSES) expect(plunge.some((c) => c.group === group && c.machineClass === machineClass), `${group} ${machineClass}`).to.equal(true);
      expect(traverseRemoval[group], group).to.be.above(0);
    }
    for (const c of plunge) expect(feedCeiling.safeParse(c).success, JSON.stringify(c)).to.equal(true);
  });

  it('the old default ceilings give the starting values: the softest band of the abrasive saws keeps the old number', () => {
    const { plunge } = feedLimitsFrom(DEFAULT_FEED_CEILINGS_MM_S);
    expect(feedLimitsFrom(DEFAULT_FEED_CEILINGS_MM_S)).to.deep.equal(feedLimitsFrom({}));
    for (const [group, old] of Object.entries(DEFAULT_FEED_CEILINGS_MM_S)) {
      const softest = STARTER_PLUNGE_FEEDS[group]![0]!.hardness;
      const floor = plunge.find((c) => c.group === group && c.machineClass === 'floor-abrasive' && JSON.stringify(c.hardness) === JSON.stringify(softest))!;
      expect(floor.maxFeedMmS, group).to.equal(old);
    }
  });

  it('precision saws get far lower ceilings, and harder bands lower ones (common practice)', () => {
    const { plunge } = feedLimitsFrom({});
    const of = (group: string, machineClass: string) => plunge.filter((c) => c.group === group && c.machineClass === machineClass).map((c) => c.maxFeedMmS);
    for (const group of MATERIAL_GROUPS) {
      const floor = of(group, 'floor-abrasive');
      const precision = of(group, 'precision');
      precision.forEach((p, i) => expect(p, group).to.be.below(floor[i]!));
      for (let i = 1; i < floor.length; i++) expect(floor[i], group).to.be.below(floor[i - 1]!);
      expect(Math.max(...precision), group).to.be.at.most(0.2);
      expect(Math.min(...precision), group).to.be.at.least(0.005);
    }
    expect(of('plain-low-alloy-steel', 'bench-abrasive')).to.deep.equal([0.6, 0.4, 0.25]);
    expect(of('plain-low-alloy-steel', 'precision')).to.deep.equal([0.1, 0.08, 0.05]);
  });

  it("a lab's own ceiling is carried over: its softest band, harder bands in the starting ratio, precision never above it", () => {
    // Plain steel lowered to 0.3 mm/s: bands 0.3, 0.3·0.4/0.6 = 0.2, 0.3·0.25/0.6 = 0.125; precision min(0.1, 0.3), min(0.08, 0.2), min(0.05, 0.125); computed by hand
    const { plunge, traverseRemoval } = feedLimitsFrom({ 'plain-low-alloy-steel': 0.3, copper: 0.05, titanium: 'x', 'cast-iron': -1 });
    const of = (group: string, machineClass: string) => plunge.filter((c) => c.group === group && c.machineClass === machineClass).map((c) => c.maxFeedMmS);
    expect(of('plain-low-alloy-steel', 'large-traverse')).to.deep.equal([0.3, 0.2, 0.125]);
    expect(of('plain-low-alloy-steel', 'precision')).to.deep.equal([0.1, 0.08, 0.05]);
    expect(of('copper', 'bench-abrasive')).to.deep.equal([0.05]);
    expect(of('copper', 'precision')).to.deep.equal([0.05]);
    // Not a positive number: the starting value.
    expect(of('titanium', 'floor-abrasive')).to.deep.equal([0.3]);
    expect(of('cast-iron', 'floor-abrasive')).to.deep.equal([0.6]);
    // Traverse: what a plunge at the ceiling removes through the reference section, Q'w = feed × contact = 0.3 × 40 = 12 mm³/s per mm
    expect(TRAVERSE_REFERENCE_SECTION_MM).to.equal(40);
    expect(traverseRemoval['plain-low-alloy-steel']).to.equal(12);
    expect(traverseRemoval.copper).to.equal(2);
  });
});
