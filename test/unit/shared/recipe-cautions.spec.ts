/**
 * The cautions a recipe calls for (shown on the sheet and the recipe page only then), the
 * run-in of a newly mounted wheel among the standard ones (ANSI B7.1, starting the wheel), and
 * the wheel standard by kind (EN 12413 bonded, EN 13236 diamond and CBN).
 */
import { expect } from 'chai';
import { recipeCautions, STANDARD_CAUTIONS, standardCautionsFor } from '../../../shared/cautions';
import { computeRecipe } from '../../../shared/recipe-computations';
import { content, ctx, material, precisionMachine, rimWheel } from './fixtures';

const cautionIds = (c: Parameters<typeof recipeCautions>[0], m: Parameters<typeof material>[0] | null) =>
  recipeCautions(c, { material: m === null ? null : material(m) }).map((x) => x.id);

describe('shared/cautions: what the recipe calls for', () => {
  it('a plain steel recipe calls for none', () => {
    expect(cautionIds(content(), {})).to.deep.equal([]);
  });

  it('titanium: the fire caution for fines, from the group alone', () => {
    expect(cautionIds(content({ scope: { group: 'titanium' } }), { group: 'titanium' })).to.deep.equal(['combustible-fines']);
    expect(cautionIds(content({ scope: { materialId: null, group: 'titanium' } }), null)).to.deep.equal(['combustible-fines']);
  });

  it('magnesium or zirconium: the group cannot tell, the material flag does', () => {
    const mg = { group: 'aluminium-magnesium' as const, combustibleFines: true };
    expect(cautionIds(content({ scope: { group: 'aluminium-magnesium' } }), mg)).to.deep.equal(['combustible-fines']);
    expect(cautionIds(content({ scope: { group: 'aluminium-magnesium' } }), { group: 'aluminium-magnesium' })).to.deep.equal([]);
  });

  it('with cutting oil, the oil caution besides; not with water-soluble coolant', () => {
    const oil = content({ scope: { group: 'titanium' }, coolant: { type: 'oil', concentrationPct: null } });
    expect(cautionIds(oil, { group: 'titanium' })).to.deep.equal(['combustible-fines', 'combustible-fines-oil']);
    expect(cautionIds(content({ coolant: { type: 'oil', concentrationPct: null } }), {})).to.deep.equal([]);
  });

  it('electronics and mixed assemblies: lithium cells', () => {
    expect(cautionIds(content({ scope: { group: 'electronics-mixed' } }), { group: 'electronics-mixed' })).to.deep.equal(['lithium-cells']);
  });

  it('cemented carbide: cobalt and hard-metal dust; nickel and cobalt alloys only when flagged for hazardous dust', () => {
    expect(cautionIds(content({ scope: { group: 'cemented-carbide' } }), { group: 'cemented-carbide' })).to.deep.equal(['hard-metal-dust']);
    expect(cautionIds(content({ scope: { group: 'nickel-cobalt' } }), { group: 'nickel-cobalt', hazardousDust: true })).to.deep.equal(['hard-metal-dust']);
    expect(cautionIds(content({ scope: { group: 'nickel-cobalt' } }), { group: 'nickel-cobalt' })).to.deep.equal([]);
  });

  it('each names its basis', () => {
    const all = [
      ...recipeCautions(content({ scope: { group: 'titanium' }, coolant: { type: 'oil', concentrationPct: null } }), { material: null }),
      ...recipeCautions(content({ scope: { group: 'electronics-mixed' } }), { material: null }),
      ...recipeCautions(content({ scope: { group: 'cemented-carbide' } }), { material: null }),
    ];
    expect(all.map((c) => c.id)).to.have.length(4);
    for (const c of all) expect(c.sources.length, c.id).to.be.greaterThan(0);
    expect(all.flatMap((c) => c.sources).join(' | '))
      .to.contain('NFPA 484')
      .and.contain('cobalt')
      .and.contain('common practice');
  });

  it('tolerates half-typed content', () => {
    const half = { scope: null, coolant: null } as unknown as Parameters<typeof recipeCautions>[0];
    expect(recipeCautions(half, { material: null })).to.deep.equal([]);
  });
});

describe('shared/cautions: standard cautions', () => {
  it('run a newly mounted wheel at operating speed for a minute, hood closed, nobody in line (ANSI B7.1)', () => {
    const run = STANDARD_CAUTIONS.find((c) => c.id === 'new-wheel-run')!;
    expect(run.text)
      .to.match(/operating speed/)
      .and.match(/a minute/)
      .and.match(/hood closed/)
      .and.match(/in line with it/);
    expect(run.sources.join(' ')).to.contain('ANSI B7.1');
  });

  it('name EN 12413 for bonded wheels and EN 13236 for diamond and CBN wheels; only the right one for a known wheel', () => {
    const sources = (list: readonly { sources: readonly string[] }[]) => list.flatMap((c) => c.sources).join(' | ');
    expect(sources(STANDARD_CAUTIONS)).to.contain('EN 12413').and.contain('EN 13236');
    expect(sources(standardCautionsFor('bonded')))
      .to.contain('EN 12413')
      .and.not.contain('EN 13236');
    expect(sources(standardCautionsFor('rim')))
      .to.contain('EN 13236')
      .and.not.contain('EN 12413');
    expect(standardCautionsFor(null)).to.equal(STANDARD_CAUTIONS);
    expect(standardCautionsFor('rim').map((c) => c.id)).to.deep.equal(STANDARD_CAUTIONS.map((c) => c.id));
  });
});

describe('shared/recipe-computations: the marked maximum and the spindle', () => {
  it('keeps the marking and both figures, and says "never above" the marked rpm (4774 at 200 mm, 50 m/s)', () => {
    const c = computeRecipe(content({ scope: { materialId: null, group: 'ceramic-glass' }, cutting: { wheelRpm: 4000 } }), {
      ...ctx({ material: null, machine: precisionMachine(), wheel: rimWheel({ diameterMm: 200, maxSpeedMs: 50 }) }),
    });
    expect(c.markedMaximum).to.deep.include({ diameterMm: 200, maxSpeedMarkedIn: 'm/s', maxSpeedMs: 50 });
    expect(c.markedMaximum!.maxSpeedRpm).to.be.closeTo(4774.648, 0.001);
    expect(c.rpmAtMarkedMax).to.equal(4774);
    expect(c.neverAboveRpm).to.equal(4774);
    expect(c.spindleOverspeed).to.deep.include({ topRpm: 5000, wheelMaxRpm: 4774 });
  });

  it('the spindle limit where lower: never above 4500 rpm, no over-speed', () => {
    const c = computeRecipe(content({ cutting: { wheelRpm: 4000 } }), {
      ...ctx({
        material: null,
        machine: precisionMachine({ spindleLimitRpm: 4500, spindleLimitSetBy: 'Maintenance' }),
        wheel: rimWheel({ diameterMm: 200, maxSpeedMs: 50 }),
      }),
    });
    expect(c.neverAboveRpm).to.equal(4500);
    expect(c.spindleOverspeed).to.equal(null);
  });

  it('a wheel marked in rpm: the rpm at the maximum is the marked figure', () => {
    const w = rimWheel({ diameterMm: 150, maxSpeedMarkedIn: 'rpm', maxSpeedRpm: 6000, maxSpeedMs: (Math.PI * 150 * 6000) / 60_000 });
    const c = computeRecipe(content({ cutting: { wheelRpm: 4000 } }), ctx({ material: null, machine: precisionMachine(), wheel: w }));
    expect(c.markedMaximum!.maxSpeedMarkedIn).to.equal('rpm');
    expect(c.rpmAtMarkedMax).to.equal(6000);
    expect(c.neverAboveRpm).to.equal(6000);
  });

  it('nothing without a wheel or machine', () => {
    const c = computeRecipe(content(), ctx({ wheel: null, machine: null }));
    expect(c.markedMaximum).to.equal(null);
    expect(c.neverAboveRpm).to.equal(null);
    expect(c.spindleOverspeed).to.equal(null);
  });
});
