/**
 * Overdue periodic reviews: the library marks a recipe whose current version's review date
 * has passed and filters on it (a range on the review-due index), Today marks it too.
 * Due today is not overdue yet; overdue starts the day after.
 */
import { expect } from 'chai';
import type { Page } from '../../../shared/api-types';
import type { RecipeSummary } from '../../../shared/recipe-types';
import { isReviewOverdue } from '../../../shared/review-due';
import { apiTestContext } from '../support/hooks';
import { createStockSet } from '../support/stock';
import { act, approved, ok, sessionFor, type Session } from '../workflow/workflow-support';

describe('Review overdue in the library and Today', function () {
  this.timeout(60000);
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;
  const ids = { overdue: 0, dueToday: 0, later: 0, redrafted: 0 };
  const day = (offset: number) => new Date(Date.now() + offset * 86400000).toISOString().slice(0, 10);

  const library = async (who: Session, query: Record<string, string | number> = {}): Promise<Page<RecipeSummary>> => {
    const res = await who.agent.get('/api/recipes').query({ pageSize: 100, ...query });
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    return res.body as Page<RecipeSummary>;
  };

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author']);
    approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    operator = await sessionFor(ctx.app, ctx.db, ['operator']);
    const stock = await createStockSet(ctx.db);
    const due = async (recipeId: number, offset: number) => {
      await ctx
        .db('recipe_versions')
        .where({ recipe_id: recipeId, version: 1 })
        .update({ review_due_on: day(offset) });
    };
    ids.overdue = (await approved(author, approver, stock, { title: 'Overdue review' })).recipeId;
    ids.dueToday = (await approved(author, approver, stock, { title: 'Due today' })).recipeId;
    ids.later = (await approved(author, approver, stock, { title: 'Due later' })).recipeId;
    const old = await approved(author, approver, stock, { title: 'Overdue, new draft started' });
    ids.redrafted = old.recipeId;
    await due(ids.overdue, -1);
    await due(ids.dueToday, 0);
    await due(ids.later, 30);
    await due(ids.redrafted, -40);
    // A new draft is the latest version; the current (approved) one is still overdue.
    ok(await act.newVersion(author, old.recipeId, 1), 201);
  });

  it('counts a review as overdue from the day after its date (worked example)', () => {
    expect(isReviewOverdue('2027-03-01', '2027-03-01')).to.equal(false);
    expect(isReviewOverdue('2027-03-01', '2027-03-02')).to.equal(true);
    expect(isReviewOverdue(null, '2027-03-02')).to.equal(false);
  });

  it('marks each library row with its current version’s review date and whether it has passed', async () => {
    const items = (await library(author)).items;
    const row = (id: number) => items.find((r) => r.id === id)!;
    expect(row(ids.overdue)).to.include({ reviewDueOn: day(-1), reviewOverdue: true });
    expect(row(ids.dueToday)).to.include({ reviewDueOn: day(0), reviewOverdue: false });
    expect(row(ids.later)).to.include({ reviewDueOn: day(30), reviewOverdue: false });
    expect(row(ids.redrafted)).to.include({ version: 2, status: 'draft', reviewDueOn: day(-40), reviewOverdue: true });
  });

  it('filters the library to overdue reviews, for authors and for operators alike', async () => {
    const overdue = await library(author, { review: 'overdue' });
    expect(overdue.items.map((r) => r.id).sort()).to.deep.equal([ids.overdue, ids.redrafted].sort());
    expect(overdue.total).to.equal(2);
    const combined = await library(author, { review: 'overdue', q: 'draft' });
    expect(combined.items.map((r) => r.id)).to.deep.equal([ids.redrafted]);
    const released = await library(operator, { review: 'overdue' });
    expect(released.items.map((r) => r.id).sort()).to.deep.equal([ids.overdue, ids.redrafted].sort());
    expect(released.items.every((r) => r.reviewOverdue && r.status === 'approved')).to.equal(true);
  });

  it('refuses another review filter with a clear message', async () => {
    const res = await author.agent.get('/api/recipes').query({ review: 'soon' });
    expect(res.status).to.equal(400);
    expect(res.body.errors).to.deep.include({ path: 'review', message: 'Use review=overdue, or leave it out.' });
  });

  it('marks overdue reviews in Today', async () => {
    const today = (await approver.agent.get('/api/today').expect(200)).body as { reviewsDue: RecipeSummary[] };
    const entry = (id: number) => today.reviewsDue.find((r) => r.id === id)!;
    expect(entry(ids.overdue)).to.include({ reviewOverdue: true });
    expect(entry(ids.dueToday)).to.include({ reviewOverdue: false });
  });
});
