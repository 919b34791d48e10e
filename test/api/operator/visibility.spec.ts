/**
 * Operators see current approved versions only (DEVELOPERS.md "Operator routes"): drafts,
 * versions in review and returned versions answer like versions that do not exist.
 */
import { expect } from 'chai';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { act, approved, createDraft, inReview, ok, sessionFor, type Session } from '../workflow/workflow-support';

describe('Operator visibility', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;
  let auditor: Session;
  let stock: StockSet;
  /** Version 1 approved and current, version 2 in review. */
  let withPending: { v1: RecipeVersionDto; v2: RecipeVersionDto };
  let draftOnly: RecipeVersionDto;
  let returned: RecipeVersionDto;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Kofi Operator');
    auditor = await sessionFor(ctx.app, ctx.db, ['auditor']);
    stock = await createStockSet(ctx.db);

    const v1 = await approved(author, approver, stock, { title: 'Approved one' });
    const next = ok(await act.newVersion(author, v1.recipeId, 1), 201);
    const edited = ok(await act.save(author, next, { instructionsMd: '1. Clamp both sides.\n2. Cut slowly.' }));
    const v2 = ok(await act.submit(author, edited));
    withPending = { v1, v2 };
    draftOnly = await createDraft(author, stock, { title: 'Only a draft' });
    const inRev = await inReview(author, stock, { title: 'Sent back' });
    returned = ok(await act.return(approver, inRev));
  });

  const path = (v: Pick<RecipeVersionDto, 'recipeId' | 'version'>) => `/api/recipes/${v.recipeId}/versions/${v.version}`;

  it('lists only recipes with a current version, showing that version', async () => {
    const res = await operator.agent.get('/api/recipes');
    expect(res.status).to.equal(200);
    expect(res.body.total).to.equal(1);
    expect(res.body.items).to.have.length(1);
    expect(res.body.items[0]).to.include({ id: withPending.v1.recipeId, version: 1, status: 'approved', title: 'Approved one' });
    // The same list for an author shows every recipe by its latest version.
    const all = await author.agent.get('/api/recipes');
    expect(all.body.total).to.equal(3);
    expect(all.body.items.find((r: { id: number }) => r.id === withPending.v1.recipeId)).to.include({ version: 2, status: 'in-review' });
  });

  it('does not find a pending version through the library filters either', async () => {
    const res = await operator.agent.get('/api/recipes').query({ status: 'in-review' });
    expect(res.status).to.equal(200);
    expect(res.body.total).to.equal(0);
  });

  it('lists only released versions of a recipe', async () => {
    const res = await operator.agent.get(`/api/recipes/${withPending.v1.recipeId}/versions`);
    expect(res.status).to.equal(200);
    expect(res.body.map((v: RecipeVersionDto) => [v.version, v.status])).to.deep.equal([[1, 'approved']]);
    const full = await auditor.agent.get(`/api/recipes/${withPending.v1.recipeId}/versions`);
    expect(full.body.map((v: RecipeVersionDto) => v.version)).to.deep.equal([2, 1]);
  });

  it('answers 404 for the versions of a recipe that has nothing released, like an unknown recipe', async () => {
    for (const v of [draftOnly, returned]) {
      const res = await operator.agent.get(`/api/recipes/${v.recipeId}/versions`);
      expect(res.status).to.equal(404);
      expect(res.body.errors[0].message).to.equal(`There is no recipe with id ${v.recipeId}.`);
    }
    const unknown = await operator.agent.get('/api/recipes/999999/versions');
    expect(unknown.status).to.equal(404);
  });

  it('answers 404 for a draft, a version in review and a returned version, worded as for an unknown one', async () => {
    const inReviewRes = await operator.agent.get(path(withPending.v2));
    const unknownRes = await operator.agent.get(path({ recipeId: withPending.v1.recipeId, version: 7 }));
    expect(inReviewRes.status).to.equal(404);
    expect(unknownRes.status).to.equal(404);
    expect(inReviewRes.body.errors[0].message).to.equal(`Recipe ${withPending.v1.number} has no version 2.`);
    expect(unknownRes.body.errors[0].message).to.equal(`Recipe ${withPending.v1.number} has no version 7.`);
    for (const v of [draftOnly, returned]) {
      const res = await operator.agent.get(path(v));
      expect(res.status, v.title).to.equal(404);
      expect(res.body.errors[0].message).to.equal(`There is no recipe with id ${v.recipeId}.`);
    }
    // The others still see them.
    expect((await author.agent.get(path(withPending.v2))).status).to.equal(200);
    expect((await auditor.agent.get(path(returned))).status).to.equal(200);
  });

  it('sees the current approved version with its content and signature', async () => {
    const res = await operator.agent.get(path(withPending.v1));
    expect(res.status).to.equal(200);
    expect(res.body).to.include({ version: 1, status: 'approved' });
    expect(res.body.workflow.signatures).to.have.length(1);
  });

  it('answers 404 for the comments of a returned version, and 200 for an approved one', async () => {
    const hidden = await operator.agent.get(`${path(returned)}/comments`);
    expect(hidden.status).to.equal(404);
    expect((await approver.agent.get(`${path(returned)}/comments`)).body).to.have.length(1);
    const shown = await operator.agent.get(`${path(withPending.v1)}/comments`);
    expect(shown.status).to.equal(200);
    expect((await operator.agent.get(`${path(withPending.v2)}/comments`)).status).to.equal(404);
  });

  it('answers 404 to a comparison with a version it may not see', async () => {
    const url = `/api/recipes/${withPending.v1.recipeId}/compare`;
    const hidden = await operator.agent.get(url).query({ from: 1, to: 2 });
    expect(hidden.status).to.equal(404);
    expect(hidden.body.errors[0].message).to.equal(`Recipe ${withPending.v1.number} has no version 2.`);
    expect((await operator.agent.get(url).query({ from: 2, to: 1 })).status).to.equal(404);
    expect((await author.agent.get(url).query({ from: 1, to: 2 })).status).to.equal(200);
  });

  it('sees superseded versions once the next one is approved, and compares them', async () => {
    const v2 = ok(await act.approve(approver, withPending.v2));
    expect(v2.status).to.equal('approved');
    const versions = await operator.agent.get(`/api/recipes/${v2.recipeId}/versions`);
    expect(versions.body.map((v: RecipeVersionDto) => [v.version, v.status])).to.deep.equal([
      [2, 'approved'],
      [1, 'superseded'],
    ]);
    const cmp = await operator.agent.get(`/api/recipes/${v2.recipeId}/compare`).query({ from: 1, to: 2 });
    expect(cmp.status).to.equal(200);
    expect(cmp.body.texts.map((t: { path: string }) => t.path)).to.include('instructionsMd');
    const list = await operator.agent.get('/api/recipes');
    expect(list.body.items[0]).to.include({ version: 2, status: 'approved' });
  });

  it('treats a person with operator and author roles as an author', async () => {
    const both = await sessionFor(ctx.app, ctx.db, ['operator', 'author']);
    expect((await both.agent.get(path(draftOnly))).status).to.equal(200);
  });
});
