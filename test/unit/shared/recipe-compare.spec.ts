import { expect } from 'chai';
import { compareVersions, contentLeafPaths, PARAMETER_FIELDS, TEXT_FIELDS, type ComparedVersion, type StockNames } from '../../../shared/recipe-compare';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { content } from './fixtures';

const names: StockNames = {
  materials: new Map([
    [1, 'Q&T alloy steel bar'],
    [2, 'Duplex stainless plate'],
  ]),
  wheels: new Map([
    [1, 'Alumina 250'],
    [2, 'Diamond rim 150'],
  ]),
  machines: new Map([[1, 'Bench saw']]),
};

function v(version: number, c: RecipeContent, title = 'Alloy bar, transverse', status = 'approved'): ComparedVersion {
  return { version, status, title, content: c };
}

function withText(c: RecipeContent, over: Partial<Pick<RecipeContent, 'instructionsMd' | 'acceptanceMd' | 'cautionsMd' | 'changeReason'>>): RecipeContent {
  return { ...c, ...over };
}

describe('shared/recipe-compare', () => {
  it('finds nothing between a version and itself', () => {
    const c = withText(content(), { instructionsMd: '1. Clamp.\n2. Cut slowly.' });
    const result = compareVersions(v(2, c), v(2, structuredClone(c)), names, 'metric');
    expect(result.parameters).to.deep.equal([]);
    expect(result.texts).to.deep.equal([]);
    expect(result.from).to.deep.equal({ version: 2, status: 'approved', title: 'Alloy bar, transverse' });
  });

  it('shows a feed change as one parameter with both values and the unit', () => {
    const result = compareVersions(
      v(1, content({ cutting: { feedMmS: 0.3 } })),
      v(2, content({ cutting: { feedMmS: 0.25 } }), undefined, 'draft'),
      names,
      'metric',
    );
    expect(result.parameters).to.deep.equal([{ path: 'cutting.feedMmS', label: 'Feed', before: '0.30 mm/s', after: '0.25 mm/s' }]);
    expect(result.texts).to.deep.equal([]);
    expect(result.to).to.deep.equal({ version: 2, status: 'draft', title: 'Alloy bar, transverse' });
  });

  it('adds the imperial value for people who want both (0.30 mm/s × 60 / 25.4 = 0.71 in/min)', () => {
    const result = compareVersions(v(1, content({ cutting: { feedMmS: 0.3 } })), v(2, content({ cutting: { feedMmS: 0.25 } })), names, 'metric+imperial');
    expect(result.parameters[0]).to.include({ before: '0.30 mm/s (0.71 in/min)', after: '0.25 mm/s (0.59 in/min)' });
  });

  it('shows two values that round to the same text unrounded, so the change is visible', () => {
    const result = compareVersions(v(1, content({ cutting: { feedMmS: 0.301 } })), v(2, content({ cutting: { feedMmS: 0.304 } })), names, 'metric');
    expect(result.parameters).to.deep.equal([{ path: 'cutting.feedMmS', label: 'Feed', before: '0.301 mm/s', after: '0.304 mm/s' }]);
  });

  it('names stock records instead of showing their ids, and marks an id it has no name for', () => {
    const result = compareVersions(
      v(1, content({ cutting: { wheelId: 1, machineId: 1 }, scope: { materialId: 1 } })),
      v(2, content({ cutting: { wheelId: 2, machineId: 7 }, scope: { materialId: null } })),
      names,
      'metric',
    );
    expect(result.parameters).to.deep.equal([
      { path: 'scope.materialId', label: 'Material', before: 'Q&T alloy steel bar', after: 'Any in the group' },
      { path: 'cutting.machineId', label: 'Machine', before: 'Bench saw', after: '#7 (unknown)' },
      { path: 'cutting.wheelId', label: 'Wheel', before: 'Alumina 250', after: 'Diamond rim 150' },
    ]);
  });

  it('labels vocabulary values in plain words, in the editor order', () => {
    const result = compareVersions(
      v(
        1,
        content({
          cutting: { cutMotion: 'straight-plunge', wheelRpm: 3000 },
          clamping: { method: 'vise-backstop', softInserts: false },
          coolant: { type: 'water-soluble', concentrationPct: 4 },
        }),
      ),
      v(
        2,
        content({
          cutting: { cutMotion: 'pulsed-plunge', wheelRpm: 2500 },
          clamping: { method: null, softInserts: true },
          coolant: { type: 'oil', concentrationPct: null },
        }),
      ),
      names,
      'metric',
    );
    expect(result.parameters.map((p) => [p.label, p.before, p.after])).to.deep.equal([
      ['Wheel speed', '3000 rpm', '2500 rpm'],
      ['Cut motion', 'Straight plunge', 'Pulsed plunge'],
      ['Clamping method', 'Vise with backstop', 'None chosen'],
      ['Soft inserts', 'No', 'Yes'],
      ['Coolant', 'Water-soluble coolant', 'Cutting oil'],
      ['Coolant concentration', '4 % v/v', '—'],
    ]);
  });

  it('treats the hardness window as one parameter, and key order as no change', () => {
    const a = content({ scope: { hardness: { min: 170, max: 230, scale: 'HV' } } });
    const reordered = content({ scope: { hardness: { scale: 'HV', max: 230, min: 170 } as RecipeContent['scope']['hardness'] } });
    expect(compareVersions(v(1, a), v(2, reordered), names, 'metric').parameters).to.deep.equal([]);
    const b = content({ scope: { hardness: { min: 180, max: 240, scale: 'HV' } } });
    expect(compareVersions(v(1, a), v(2, b), names, 'metric').parameters).to.deep.equal([
      { path: 'scope.hardness', label: 'Hardness window', before: '170–230 HV', after: '180–240 HV' },
    ]);
  });

  it('gives a word inserted in the instructions as one added part, and no parameter', () => {
    const a = withText(content(), { instructionsMd: '1. Clamp the bar.\n2. Cut.' });
    const b = withText(content(), { instructionsMd: '1. Clamp the bar firmly.\n2. Cut.' });
    const result = compareVersions(v(1, a), v(2, b), names, 'metric');
    expect(result.parameters).to.deep.equal([]);
    expect(result.texts).to.have.length(1);
    const change = result.texts[0]!;
    expect(change).to.include({ path: 'instructionsMd', label: 'Instructions' });
    expect(change.parts.filter((p) => p.added)).to.deep.equal([{ value: ' firmly', added: true }]);
    expect(change.parts.filter((p) => p.removed)).to.deep.equal([]);
    // The parts rebuild both sides exactly.
    expect(
      change.parts
        .filter((p) => !p.added)
        .map((p) => p.value)
        .join(''),
    ).to.equal(a.instructionsMd);
    expect(
      change.parts
        .filter((p) => !p.removed)
        .map((p) => p.value)
        .join(''),
    ).to.equal(b.instructionsMd);
  });

  it('diffs the title, clamp placement, orientation rule, acceptance, cautions and change reason as text', () => {
    const a = content();
    const b = withText(content({ clamping: { placement: 'one side only', orientationRule: 'Enter through the coating.' } }), {
      acceptanceMd: '- No burn.',
      cautionsMd: 'Hot part.',
      changeReason: 'Slower feed.',
    });
    const result = compareVersions(v(1, a, 'Bar'), v(2, b, 'Bar, transverse'), names, 'metric');
    expect(result.parameters).to.deep.equal([]);
    expect(result.texts.map((t) => t.label)).to.deep.equal([
      'Title',
      'Clamp placement',
      'Orientation rule',
      'Acceptance criteria',
      'Cautions',
      'Change reason',
    ]);
    const rule = result.texts.find((t) => t.path === 'clamping.orientationRule')!;
    expect(rule.parts).to.deep.equal([{ value: 'Enter through the coating.', added: true }]);
  });

  it('has a label for every leaf of the recipe content (a new field must be named here)', () => {
    const known = new Set([...PARAMETER_FIELDS.map((f) => f.path), ...TEXT_FIELDS.map((f) => f.path)]);
    const leaves = contentLeafPaths(content({ scope: { hardness: { min: 1, max: 2, scale: 'HV' } } }));
    expect(leaves.filter((p) => !known.has(p))).to.deep.equal([]);
    expect(leaves).to.include.members(['cutting.feedMmS', 'scope.hardness', 'coolant.flowLMin', 'instructionsMd']);
  });

  it('still shows a field it has no label for, by its path', () => {
    const b = { ...content(), extraSetting: 3 } as unknown as RecipeContent;
    const result = compareVersions(v(1, content()), v(2, b), names, 'metric');
    expect(result.parameters).to.deep.equal([{ path: 'extraSetting', label: 'extraSetting', before: 'null', after: '3' }]);
  });
});
