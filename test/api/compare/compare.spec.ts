/**
 * GET /api/recipes/:id/compare?from=&to=: an approved version against the draft that
 * follows it, labelled in plain words with the reader's units and stock names.
 */
import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { RecipeComparison, RecipeVersionDto } from '../../../shared/recipe-types';
import { createStock } from '../../../server/services/stock/stock';
import { WHEELS } from '../../../server/services/stock/records';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { createStockSet, recipeInput, wheelInput, type StockSet } from '../support/stock';
import { anonymousAgent, signedInAgent, type Agent } from '../support/test-app';

describe('Comparing versions', function () {
  this.timeout(30000);
  const ctx = apiTestContext();
  let reader: { agent: Agent; csrf: string };
  let recipe: RecipeVersionDto;
  let stock: StockSet;
  let softWheelId: number;

  const compare = (query: Record<string, string | number>, who = reader, id: number = recipe.recipeId) =>
    who.agent.get(`/api/recipes/${id}/compare`).query(query);

  before(async () => {
    const authorPerson = await createPerson(ctx.db, { roles: ['author'], displayName: 'Compare Author' });
    const approverPerson: TestPerson = await createPerson(ctx.db, { roles: ['approver'], displayName: 'Compare Approver' });
    const author = await signedInAgent(ctx.app, authorPerson);
    const approver = await signedInAgent(ctx.app, approverPerson);
    // The versions compared include a draft: an auditor reads every version (operators only released ones).
    reader = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['auditor'] }));
    stock = await createStockSet(ctx.db);
    softWheelId = (
      await createStock(ctx.db, { userId: null, name: 'set-up', clientAddress: '' }, WHEELS, wheelInput({ name: 'Alumina 250 soft', specification: 'A60K5B' }))
    ).id;

    // Version 1: written, submitted and approved through the API.
    recipe = (
      await author.agent
        .post('/api/recipes')
        .set(CSRF_HEADER, author.csrf)
        .send(recipeInput(stock, { instructionsMd: '1. Clamp the bar.\n2. Cut.' }))
        .expect(201)
    ).body;
    const submitted = await author.agent
      .post(`/api/recipes/${recipe.recipeId}/versions/1/submit`)
      .set(CSRF_HEADER, author.csrf)
      .send({ revision: recipe.revision });
    expect(submitted.status, JSON.stringify(submitted.body)).to.equal(200);
    const v1 = submitted.body as RecipeVersionDto;
    const approved = await approver.agent
      .post(`/api/recipes/${recipe.recipeId}/versions/1/approve`)
      .set(CSRF_HEADER, approver.csrf)
      .send({
        revision: v1.revision,
        username: approverPerson.username,
        password: approverPerson.password,
        meaning: 'approved',
        acknowledgedWarnings: v1.checks.filter((c) => c.severity === 'warning').map((c) => c.id),
      });
    expect(approved.status, JSON.stringify(approved.body)).to.equal(200);

    // Version 2: a new draft with a slower feed, the soft wheel and one more word.
    const v2 = await author.agent
      .post(`/api/recipes/${recipe.recipeId}/versions`)
      .set(CSRF_HEADER, author.csrf)
      .send({ fromVersion: 1, changeReason: 'Burn marks at 0.40 mm/s.' });
    expect(v2.status, JSON.stringify(v2.body)).to.equal(201);
    const draft = v2.body as RecipeVersionDto;
    const saved = await author.agent
      .put(`/api/recipes/${recipe.recipeId}/versions/2`)
      .set(CSRF_HEADER, author.csrf)
      .send({
        revision: draft.revision,
        title: draft.title,
        content: {
          ...draft.content,
          cutting: { ...draft.content.cutting, feedMmS: 0.3, wheelId: softWheelId },
          instructionsMd: '1. Clamp the bar firmly.\n2. Cut.',
        },
      });
    expect(saved.status, JSON.stringify(saved.body)).to.equal(200);
  });

  it('lists the changed parameters with units and names, and word diffs of the text', async () => {
    const res = await compare({ from: 1, to: 2 });
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    const body = res.body as RecipeComparison;
    expect(body).to.include({ recipeId: recipe.recipeId, number: recipe.number });
    expect(body.from).to.deep.equal({ version: 1, status: 'approved', title: recipe.title, integrity: { ok: true, problems: [] } });
    expect(body.to).to.deep.equal({ version: 2, status: 'draft', title: recipe.title, integrity: { ok: true, problems: [] } });
    expect(body.parameters).to.deep.equal([
      { path: 'cutting.wheelId', label: 'Wheel', before: 'Alumina 250 hard', after: 'Alumina 250 soft' },
      { path: 'cutting.feedMmS', label: 'Feed', before: '0.40 mm/s', after: '0.30 mm/s' },
    ]);
    const instructions = body.texts.find((t) => t.path === 'instructionsMd')!;
    expect(instructions.parts.filter((p) => p.added).map((p) => p.value)).to.deep.equal([' firmly']);
    const reason = body.texts.find((t) => t.path === 'changeReason')!;
    expect(reason.parts).to.deep.equal([{ value: 'Burn marks at 0.40 mm/s.', added: true }]);
    expect(body.texts.map((t) => t.path).sort()).to.deep.equal(['changeReason', 'instructionsMd']);
  });

  it('compares the other way round too (old and new swap sides)', async () => {
    const body = (await compare({ from: 2, to: 1 })).body as RecipeComparison;
    expect(body.parameters.find((p) => p.path === 'cutting.feedMmS')).to.include({ before: '0.30 mm/s', after: '0.40 mm/s' });
    expect(body.texts.find((t) => t.path === 'changeReason')!.parts).to.deep.equal([{ value: 'Burn marks at 0.40 mm/s.', removed: true }]);
  });

  it('shows the imperial value beside the metric one for someone who chose both', async () => {
    const person = await createPerson(ctx.db, { roles: ['auditor'] });
    const session = await signedInAgent(ctx.app, person);
    await session.agent.patch('/api/session/preferences').set(CSRF_HEADER, session.csrf).send({ units: 'metric+imperial' }).expect(200);
    const body = (await compare({ from: 1, to: 2 }, session)).body as RecipeComparison;
    expect(body.parameters.find((p) => p.path === 'cutting.feedMmS')).to.include({ before: '0.40 mm/s (0.94 in/min)', after: '0.30 mm/s (0.71 in/min)' });
  });

  it('answers no changes when a version is compared with itself', async () => {
    const res = await compare({ from: 2, to: 2 });
    expect(res.status).to.equal(200);
    expect(res.body).to.deep.include({ parameters: [], texts: [] });
  });

  it('answers 404 for a version or a recipe that does not exist', async () => {
    for (const [query, id] of [
      [{ from: 1, to: 9 }, recipe.recipeId],
      [{ from: 9, to: 1 }, recipe.recipeId],
      [{ from: 1, to: 2 }, 999999],
    ] as const) {
      const res = await compare(query, reader, id);
      expect(res.status, JSON.stringify(query)).to.equal(404);
      expect(res.body.code).to.equal('NOT_FOUND');
    }
  });

  it('answers 400 VALIDATION_FAILED naming the field for a bad query', async () => {
    const cases: [Record<string, string>, string[]][] = [
      [{}, ['from', 'to']],
      [{ from: 'one', to: '2' }, ['from']],
      [{ from: '0', to: '2' }, ['from']],
      [{ from: '1', to: '2.5' }, ['to']],
      [{ from: '1', to: '2', side: 'left' }, ['']],
    ];
    for (const [query, paths] of cases) {
      const res = await compare(query);
      expect(res.status, JSON.stringify(query)).to.equal(400);
      expect(res.body.code).to.equal('VALIDATION_FAILED');
      expect(res.body.errors.map((e: { path: string }) => e.path).sort(), JSON.stringify(query)).to.deep.equal(paths);
    }
    const badId = await reader.agent.get('/api/recipes/abc/compare').query({ from: 1, to: 2 });
    expect(badId.status).to.equal(400);
    expect(badId.body.code).to.equal('VALIDATION_FAILED');
  });

  it('is open to everyone signed in, and to no one else', async () => {
    const anon = await anonymousAgent(ctx.app);
    const res = await compare({ from: 1, to: 2 }, anon);
    expect(res.status).to.equal(401);
    expect(res.body.code).to.equal('NOT_SIGNED_IN');
  });
});
