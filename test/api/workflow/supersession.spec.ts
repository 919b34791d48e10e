/**
 * Effective dates: a version approved for a later day stays pending, the
 * previous one stays current until that day, and the scheduled job then makes it current
 * and supersedes its predecessors — once, even when several processes run the job at the
 * same moment.
 */
import { expect } from 'chai';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { applyDueSupersessions, startSupersessionTimer } from '../../../server/services/recipes/supersession';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { asJson, countRows } from '../support/test-database';
import { act, approved, ok, sessionFor, type Session } from './workflow-support';

const DAY_MS = 86400000;
const day = (offset: number, from = Date.now()) => new Date(from + offset * DAY_MS).toISOString().slice(0, 10);

describe('Effective dates and supersession', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let reader: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author']);
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    reader = await sessionFor(ctx.app, ctx.db, ['auditor']);
    stock = await createStockSet(ctx.db);
  });

  const stateOf = async (recipeId: number) => {
    const versions = (await reader.agent.get(`/api/recipes/${recipeId}/versions`).expect(200)).body as RecipeVersionDto[];
    const recipe = await ctx.db('recipes').where({ id: recipeId }).first('current_version_id');
    const current =
      recipe.current_version_id === null ? null : (await ctx.db('recipe_versions').where({ id: recipe.current_version_id }).first('version')).version;
    return { statuses: versions.map((v) => [v.version, v.status]), current };
  };

  /** Version 1 approved today; version 2 approved effective `inDays` days from now. */
  async function pendingSecondVersion(title: string, inDays: number) {
    const v1 = await approved(author, approver, stock, { title });
    const v2 = ok(await act.newVersion(author, v1.recipeId, 1, 'Feed lowered.'), 201);
    const submitted = ok(await act.submit(author, ok(await act.save(author, v2, { cutting: { ...v2.content.cutting, feedMmS: 0.3 } }))));
    const effectiveDate = day(inDays);
    const v2approved = ok(await act.approve(approver, submitted, { effectiveDate }));
    return { v1, v2: v2approved, effectiveDate };
  }

  it('keeps the previous version current until the effective day, then supersedes it (and does nothing twice)', async () => {
    const { v1, v2, effectiveDate } = await pendingSecondVersion('Future effective', 10);
    expect(v2.status).to.equal('approved');
    expect(v2.workflow!.effectiveFrom).to.equal(effectiveDate);
    const months = (await ctx.db('lab_settings').where({ id: 1 }).first('review_interval_months')).review_interval_months;
    const due = new Date(`${effectiveDate}T00:00:00Z`);
    due.setUTCMonth(due.getUTCMonth() + months);
    expect(v2.workflow!.reviewDueOn!.slice(0, 7)).to.equal(due.toISOString().slice(0, 7));
    expect(await stateOf(v1.recipeId)).to.deep.equal({
      statuses: [
        [2, 'approved'],
        [1, 'approved'],
      ],
      current: 1,
    });

    // The day before: nothing is due.
    expect(await applyDueSupersessions(ctx.db, new Date(`${day(9)}T23:59:59Z`))).to.deep.equal({ madeCurrent: 0, superseded: 0 });
    expect((await stateOf(v1.recipeId)).current).to.equal(1);

    const events = await countRows(ctx.db, 'trail_events');
    const result = await applyDueSupersessions(ctx.db, new Date(`${effectiveDate}T00:00:01Z`));
    expect(result).to.deep.equal({ madeCurrent: 1, superseded: 1 });
    expect(await stateOf(v1.recipeId)).to.deep.equal({
      statuses: [
        [2, 'approved'],
        [1, 'superseded'],
      ],
      current: 2,
    });
    expect(await countRows(ctx.db, 'trail_events')).to.equal(events + 2);
    const rows = await ctx.db('trail_events').orderBy('id', 'desc').limit(2);
    const types = rows.map((r) => r.event_type).sort();
    expect(types).to.deep.equal(['recipe.version_effective', 'recipe.version_superseded']);
    const effective = rows.find((r) => r.event_type === 'recipe.version_effective');
    expect(effective.actor_user_id).to.equal(null);
    expect(asJson(effective.after_json)).to.include({ current: true, effectiveFrom: effectiveDate });

    // Idempotent: a second run finds nothing.
    expect(await applyDueSupersessions(ctx.db, new Date(`${effectiveDate}T12:00:00Z`))).to.deep.equal({ madeCurrent: 0, superseded: 0 });
    expect(await countRows(ctx.db, 'trail_events')).to.equal(events + 2);
  });

  it('supersedes a still-pending older version when a newer one becomes current first', async () => {
    const { v1 } = await pendingSecondVersion('Overtaken', 20);
    const v3 = ok(await act.newVersion(author, v1.recipeId, 2, 'Wheel changed.'), 201);
    ok(await act.approve(approver, ok(await act.submit(author, v3))));
    expect(await stateOf(v1.recipeId)).to.deep.equal({
      statuses: [
        [3, 'approved'],
        [2, 'superseded'],
        [1, 'superseded'],
      ],
      current: 3,
    });
    expect(await applyDueSupersessions(ctx.db, new Date(Date.now() + 30 * DAY_MS))).to.deep.include({ madeCurrent: 0 });
  });

  it('does the work once when two runs start at the same moment', async () => {
    const recipes = [];
    for (let i = 0; i < 4; i++) recipes.push(await pendingSecondVersion(`Concurrent job ${i}`, 5));
    const events = await countRows(ctx.db, 'trail_events');
    const at = new Date(Date.now() + 6 * DAY_MS);
    const [a, b, c] = await Promise.all([applyDueSupersessions(ctx.db, at), applyDueSupersessions(ctx.db, at), applyDueSupersessions(ctx.db, at)]);
    expect(a.madeCurrent + b.madeCurrent + c.madeCurrent).to.equal(4);
    expect(a.superseded + b.superseded + c.superseded).to.equal(4);
    expect(await countRows(ctx.db, 'trail_events')).to.equal(events + 8);
    for (const { v1 } of recipes) {
      expect(await stateOf(v1.recipeId)).to.deep.equal({
        statuses: [
          [2, 'approved'],
          [1, 'superseded'],
        ],
        current: 2,
      });
      const effective = await ctx.db('trail_events').where({ event_type: 'recipe.version_effective', recipe_id: v1.recipeId }).count({ n: '*' }).first();
      expect(Number(effective!.n)).to.equal(1);
    }
  });

  it('leaves a recipe another transaction holds for the next run', async () => {
    const { v1, effectiveDate } = await pendingSecondVersion('Held by someone', 3);
    const at = new Date(`${effectiveDate}T08:00:00Z`);
    const trx = await ctx.db.transaction();
    try {
      await trx('recipes').where({ id: v1.recipeId }).forUpdate().first();
      const skipped = await applyDueSupersessions(ctx.db, at);
      expect(skipped.madeCurrent).to.equal(0);
    } finally {
      await trx.rollback();
    }
    expect(await applyDueSupersessions(ctx.db, at)).to.deep.equal({ madeCurrent: 1, superseded: 1 });
  });

  it('does not make a withdrawn pending version current', async () => {
    const { v1, v2, effectiveDate } = await pendingSecondVersion('Withdrawn before its day', 4);
    ok(await act.withdraw(approver, v2, { reason: 'Customer changed the drawing.' }));
    expect(await applyDueSupersessions(ctx.db, new Date(`${effectiveDate}T09:00:00Z`))).to.deep.equal({ madeCurrent: 0, superseded: 0 });
    expect(await stateOf(v1.recipeId)).to.deep.equal({
      statuses: [
        [2, 'withdrawn'],
        [1, 'approved'],
      ],
      current: 1,
    });
  });

  it('runs on a timer started with the app settings and stops when asked', async () => {
    const { v1 } = await pendingSecondVersion('Timer', 0);
    // Effective today: already current through the approval itself.
    expect((await stateOf(v1.recipeId)).current).to.equal(2);
    const { v1: other, v2 } = await pendingSecondVersion('Timer pending', 1);
    // Pretend the day has come: move the effective date back (a seed-style update of a workflow column).
    await ctx
      .db('recipe_versions')
      .where({ recipe_id: v2.recipeId, version: 2 })
      .update({ effective_from: day(0) });
    const stop = startSupersessionTimer(ctx.db, 50, () => undefined);
    try {
      for (let i = 0; i < 100 && (await stateOf(other.recipeId)).current !== 2; i++) await new Promise((r) => setTimeout(r, 20));
    } finally {
      stop();
    }
    expect(await stateOf(other.recipeId)).to.deep.equal({
      statuses: [
        [2, 'approved'],
        [1, 'superseded'],
      ],
      current: 2,
    });
  });
});
