/**
 * GET /api/finder: the current approved recipes that cover a part, best first, with reasons.
 * Hardness conversions are checked against ASTM E140 Table 1 (30 HRC = 302 HV, 45 HRC = 446 HV).
 */
import { expect } from 'chai';
import type { FinderHit, RecipeVersionDto } from '../../../shared/recipe-types';
import type { MachineRecord, MaterialRecord } from '../../../shared/stock-types';
import { createStock } from '../../../server/services/stock/stock';
import { MACHINES, MATERIALS } from '../../../server/services/stock/records';
import { apiTestContext } from '../support/hooks';
import { createStockSet, machineInput, materialInput, type recipeInput, type StockSet } from '../support/stock';
import { act, approved, createDraft, ok, sessionFor, type Session } from '../workflow/workflow-support';

const SETUP = { userId: null, name: 'test set-up', clientAddress: '' };

describe('Finder', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;
  let stock: StockSet;
  let crmo: MaterialRecord;
  let bay2: MachineRecord;
  const ids: Record<string, number> = {};
  const versions: Record<string, RecipeVersionDto> = {};

  const find = (query: Record<string, string | number>) => operator.agent.get('/api/finder').query(query);
  const titles = (hits: FinderHit[]) => hits.map((h) => h.summary.title);

  before(async function () {
    this.timeout(60000);
    author = await sessionFor(ctx.app, ctx.db, ['author']);
    approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    operator = await sessionFor(ctx.app, ctx.db, ['operator']);
    stock = await createStockSet(ctx.db); // C45, 200 HBW typical, "Bench saw"
    crmo = await createStock(
      ctx.db,
      SETUP,
      MATERIALS,
      materialInput({ name: '42CrMo4 alloy steel', designation: 'EN 1.7225', condition: 'quenched and tempered', hardness: { value: 30, scale: 'HRC' } }),
    );
    bay2 = await createStock(ctx.db, SETUP, MACHINES, machineInput({ name: 'Bay 2 bench saw' }));
    const crmoStock = { ...stock, material: crmo };
    const recipes: [string, Parameters<typeof recipeInput>[1], StockSet][] = [
      ['CrMo exact', { scope: { hardness: { min: 250, max: 350, scale: 'HV' } } }, crmoStock],
      ['Steel group-wide', { scope: { materialId: null, hardness: null, sizeMinMm: 10, sizeMaxMm: 80 } }, stock],
      ['C45 only', {}, stock],
      ['Stainless group-wide', { scope: { materialId: null, group: 'stainless-steel', hardness: { min: 150, max: 250, scale: 'HV' } } }, stock],
      ['CrMo plate', { scope: { hardness: { min: 250, max: 350, scale: 'HV' }, shape: 'rectangular', widthMm: 40 } }, crmoStock],
      ['CrMo on bay 2', { scope: { hardness: { min: 250, max: 350, scale: 'HV' } }, cutting: { machineId: bay2.id } }, crmoStock],
      ['CrMo hard', { scope: { hardness: { min: 400, max: 500, scale: 'HV' } } }, crmoStock],
      ['CrMo typical', { scope: { hardness: null } }, crmoStock],
    ];
    for (const [title, over, set] of recipes) {
      versions[title] = await approved(author, approver, set, { ...over, title });
      ids[title] = versions[title].recipeId;
    }
    ids['CrMo draft'] = (await createDraft(author, crmoStock, { title: 'CrMo draft' })).recipeId;
  });

  it('lists every current approved recipe (no drafts) when nothing is given', async () => {
    const res = await find({});
    expect(res.status).to.equal(200);
    expect(titles(res.body)).to.have.members([
      'CrMo exact',
      'Steel group-wide',
      'C45 only',
      'Stainless group-wide',
      'CrMo plate',
      'CrMo on bay 2',
      'CrMo hard',
      'CrMo typical',
    ]);
    for (const hit of res.body as FinderHit[]) expect(hit.summary.status).to.equal('approved');
  });

  it('matches by material: the material’s own recipes first, then group-wide ones; other materials and groups are left out', async () => {
    const res = await find({ materialId: crmo.id });
    expect(res.status).to.equal(200);
    const hits = res.body as FinderHit[];
    expect(titles(hits)).to.have.members(['CrMo exact', 'CrMo plate', 'CrMo on bay 2', 'CrMo hard', 'CrMo typical', 'Steel group-wide']);
    expect(titles(hits).at(-1)).to.equal('Steel group-wide');
    expect(hits[0]!.reasons).to.include('Material: 42CrMo4 alloy steel (EN 1.7225)');
    expect(hits.at(-1)!.reasons[0]).to.match(/^Group: Plain and low-alloy steels/);
    expect(hits[0]!.score).to.be.greaterThan(hits.at(-1)!.score);
  });

  it('matches by group alone', async () => {
    const res = await find({ group: 'stainless-steel' });
    expect(titles(res.body)).to.deep.equal(['Stainless group-wide']);
  });

  it('converts the hardness to the window’s scale (ASTM E140 Table 1: 30 HRC ≈ 302 HV) and leaves out windows that miss it', async () => {
    const res = await find({ materialId: crmo.id, hardnessValue: 30, hardnessScale: 'HRC' });
    const hits = res.body as FinderHit[];
    expect(titles(hits)).to.have.members(['CrMo exact', 'CrMo plate', 'CrMo on bay 2', 'CrMo typical', 'Steel group-wide']);
    expect(hits.find((h) => h.summary.title === 'CrMo exact')!.reasons).to.include('Hardness 30 HRC (≈ 302 HV) within 250–350 HV');
    // No window: the material's typical 30 HRC ± 10 %.
    expect(hits.find((h) => h.summary.title === 'CrMo typical')!.reasons.join(' ')).to.include('within 27–33 HRC');
    // A group-wide recipe without a window covers any hardness.
    expect(hits.find((h) => h.summary.title === 'Steel group-wide')!.reasons.join(' ')).to.include('any hardness');

    const hard = await find({ materialId: crmo.id, hardnessValue: 45, hardnessScale: 'HRC' });
    expect(titles(hard.body)).to.have.members(['CrMo hard', 'Steel group-wide']);
    expect((hard.body as FinderHit[])[0]!.reasons).to.include('Hardness 45 HRC (≈ 446 HV) within 400–500 HV');
  });

  it('does not convert where the steel tables do not apply: a stainless part must be measured on the window’s scale', async () => {
    expect(titles((await find({ group: 'stainless-steel', hardnessValue: 90, hardnessScale: 'HRB' })).body)).to.deep.equal([]);
    expect(titles((await find({ group: 'stainless-steel', hardnessValue: 200, hardnessScale: 'HV' })).body)).to.deep.equal(['Stainless group-wide']);
  });

  it('matches by shape', async () => {
    const res = await find({ materialId: crmo.id, shape: 'rectangular' });
    expect(titles(res.body)).to.deep.equal(['CrMo plate']);
    expect(res.body[0].reasons).to.include('Shape: rectangular bar or plate');
  });

  it('matches by size and prefers the tighter size window', async () => {
    const big = await find({ group: 'plain-low-alloy-steel', sizeMm: 70 });
    expect(titles(big.body)).to.deep.equal(['Steel group-wide']);
    expect(big.body[0].reasons).to.include('Size 70 mm within 10–80 mm');
    const mid = titles((await find({ group: 'plain-low-alloy-steel', sizeMm: 30 })).body);
    expect(mid.indexOf('C45 only')).to.be.lessThan(mid.indexOf('Steel group-wide'));
  });

  it('matches by machine', async () => {
    const res = await find({ materialId: crmo.id, machineId: bay2.id });
    expect(titles(res.body)).to.deep.equal(['CrMo on bay 2']);
    expect(res.body[0].reasons).to.include('On Bay 2 bench saw');
  });

  it('orders the best match first when everything is given', async () => {
    const res = await find({ materialId: crmo.id, hardnessValue: 30, hardnessScale: 'HRC', shape: 'round-bar', sizeMm: 30, machineId: stock.machine.id });
    const hits = res.body as FinderHit[];
    expect(titles(hits)).to.deep.equal(['CrMo exact', 'CrMo typical', 'Steel group-wide']);
    expect(hits[0]!.reasons).to.deep.equal([
      'Material: 42CrMo4 alloy steel (EN 1.7225)',
      'Hardness 30 HRC (≈ 302 HV) within 250–350 HV',
      'Shape: round bar',
      'Size 30 mm within 20–60 mm',
      'On Bench saw',
    ]);
    expect(hits.map((h) => h.score)).to.deep.equal([...hits.map((h) => h.score)].sort((a, b) => b - a));
  });

  it('refuses bad queries with 400 and field errors', async () => {
    const cases: [Record<string, string | number>, string][] = [
      [{ hardnessValue: 30 }, 'hardnessScale'],
      [{ hardnessScale: 'HRC' }, 'hardnessValue'],
      [{ materialId: 999999 }, 'materialId'],
      [{ materialId: crmo.id, group: 'copper' }, 'group'],
      [{ shape: 'hexagon' }, 'shape'],
      [{ sizeMm: -3 }, 'sizeMm'],
      [{ colour: 'red' }, ''],
    ];
    for (const [query, path] of cases) {
      const res = await find(query);
      expect(res.status, JSON.stringify(query)).to.equal(400);
      expect(res.body.code).to.equal('VALIDATION_FAILED');
      if (path)
        expect(
          res.body.errors.map((e: { path: string }) => e.path),
          JSON.stringify(query),
        ).to.include(path);
    }
  });

  it('leaves out drafts and recipes whose version was withdrawn', async () => {
    expect(ids['CrMo draft']).to.be.a('number');
    ok(await act.withdraw(approver, versions['CrMo hard']!));
    const res = await find({ materialId: crmo.id });
    expect(titles(res.body)).to.not.include('CrMo draft');
    expect(titles(res.body)).to.not.include('CrMo hard');
    expect(titles(res.body)).to.include('CrMo exact');
  });
});
