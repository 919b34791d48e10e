/**
 * The workflow held by MariaDB itself, against someone who can write to the database: a
 * version moves only the way the app moves it (draft → in review → returned or approved;
 * returned → draft; approved → superseded or withdrawn; nothing out of superseded or
 * withdrawn), approval and withdrawal need their signature first, and once a version has
 * left draft the columns the Finder, the library and acknowledgements read freeze with its
 * content.
 */
import { createHash } from 'node:crypto';
import { expect } from 'chai';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { RECIPE_STATUSES, type RecipeStatus } from '../../../shared/vocabulary';
import { verifyChain } from '../../../server/services/trail/verify';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { act, approved, createDraft, inReview, ok, sessionFor, type Session } from './workflow-support';

/** Runs the statement and returns MariaDB's refusal (fails the test if it was accepted). */
async function refused(statement: PromiseLike<unknown>, what: string): Promise<{ sqlState: string; message: string }> {
  try {
    await statement;
  } catch (err) {
    const e = err as { sqlState?: string; sqlMessage?: string; message: string };
    return { sqlState: e.sqlState ?? '', message: e.sqlMessage ?? e.message };
  }
  throw new Error(`MariaDB accepted a statement it must refuse: ${what}`);
}

const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

/** The moves the app makes (server/services/recipes/workflow.ts and supersession.ts). */
const LEGAL: Record<RecipeStatus, readonly RecipeStatus[]> = {
  draft: ['in-review'],
  'in-review': ['returned', 'approved'],
  returned: ['draft'],
  approved: ['superseded', 'withdrawn'],
  superseded: [],
  withdrawn: [],
};

describe('The workflow in the database', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author']);
    approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    stock = await createStockSet(ctx.db);
  });

  const rowOf = (v: Pick<RecipeVersionDto, 'recipeId' | 'version'>) => ctx.db('recipe_versions').where({ recipe_id: v.recipeId, version: v.version });

  it('refuses the three-UPDATE walk-back of an approved version (returned, a draft with a new feed, approved again with a new hash) and changes nothing', async () => {
    const v = await approved(author, approver, stock, { title: 'Walked back' });
    const before = await rowOf(v).first();
    const sheetBefore = ok(await act.get(author, v));
    const edited = (before.content_json as string).replace('"feedMmS":0.4', '"feedMmS":0.9');
    expect(edited).to.not.equal(before.content_json);

    const steps: [string, Record<string, unknown>][] = [
      ['approved → returned', { status: 'returned' }],
      ['returned → draft with new content', { status: 'draft', content_json: edited, content_hash: null }],
      ['draft → approved with a recomputed hash', { status: 'approved', content_json: edited, content_hash: sha256(edited) }],
    ];
    for (const [what, change] of steps) {
      const error = await refused(rowOf(v).update(change), what);
      expect(error.sqlState, what).to.equal('45000');
    }
    expect(await rowOf(v).first()).to.deep.equal(before);
    const after = ok(await act.get(author, v));
    expect(after.content.cutting.feedMmS).to.equal(0.4);
    expect(after).to.deep.equal(sheetBefore);
    expect((await verifyChain(ctx.db)).ok).to.equal(true);
  });

  it('refuses every status change the workflow does not make, from each state, and changes nothing', async () => {
    // One version in each state, reached by the app's own paths.
    const draft = await createDraft(author, stock, { title: 'A draft' });
    const review = await inReview(author, stock, { title: 'In review' });
    const returned = ok(await act.return(approver, await inReview(author, stock, { title: 'Returned' })));
    const approvedV = await approved(author, approver, stock, { title: 'Approved' });
    const old = await approved(author, approver, stock, { title: 'Superseded' });
    const next = ok(await act.newVersion(author, old.recipeId, 1), 201);
    ok(await act.approve(approver, ok(await act.submit(author, next))));
    const withdrawn = ok(await act.withdraw(approver, await approved(author, approver, stock, { title: 'Withdrawn' })));
    const byState: Record<RecipeStatus, RecipeVersionDto> = {
      draft,
      'in-review': review,
      returned,
      approved: approvedV,
      superseded: old,
      withdrawn,
    };
    let tried = 0;
    for (const from of RECIPE_STATUSES) {
      const v = byState[from];
      const before = await rowOf(v).first();
      expect(before.status, `fixture for ${from}`).to.equal(from);
      for (const to of RECIPE_STATUSES) {
        if (to === from || LEGAL[from].includes(to)) continue;
        const error = await refused(rowOf(v).update({ status: to }), `${from} → ${to}`);
        expect(error.sqlState, `${from} → ${to}`).to.equal('45000');
        expect(error.message, `${from} → ${to}`).to.match(/cannot go from/);
        tried += 1;
      }
      expect(await rowOf(v).first(), `${from} unchanged`).to.deep.equal(before);
    }
    expect(tried).to.equal(24);
  });

  it('refuses approval or withdrawal without its signature, and a submission whose hash is not that of its content', async () => {
    const review = await inReview(author, stock, { title: 'Unsigned approval' });
    expect((await refused(rowOf(review).update({ status: 'approved' }), 'unsigned approval')).message).to.match(/signature/);
    const approvedV = await approved(author, approver, stock, { title: 'Unsigned withdrawal' });
    expect((await refused(rowOf(approvedV).update({ status: 'withdrawn' }), 'unsigned withdrawal')).message).to.match(/signature/);

    const draft = await createDraft(author, stock, { title: 'Wrong hash' });
    const row = await rowOf(draft).first();
    expect((await refused(rowOf(draft).update({ status: 'in-review', content_hash: 'f'.repeat(64) }), 'wrong hash')).message).to.match(/SHA-256/);
    expect((await refused(rowOf(draft).update({ status: 'in-review' }), 'no hash')).message).to.match(/SHA-256/);
    // The right hash in the same statement is what the app's submit writes.
    await rowOf(draft).update({ status: 'in-review', content_hash: sha256(row.content_json as string) });
    expect((await rowOf(draft).first('status')).status).to.equal('in-review');
    expect(await rowOf(review).first('status')).to.deep.equal({ status: 'in-review' });
    expect(await rowOf(approvedV).first('status')).to.deep.equal({ status: 'approved' });
  });

  it('freezes machine, size window, worst check and the other columns copied from the content once a version leaves draft', async () => {
    const otherSet = await createStockSet(ctx.db, { material: { name: 'Second steel' }, wheel: { name: 'Second wheel' }, machine: { name: 'Second saw' } });
    const changes: Record<string, unknown>[] = [
      { machine_id: otherSet.machine.id },
      { size_min_mm: 1 },
      { size_max_mm: 400 },
      { checks_json: '[{"id":"slipped-in","severity":"note"}]' },
      { material_id: otherSet.material.id },
      { material_group: 'titanium' },
      { shape: 'plate' },
      { hardness_min_hv: 1 },
      { hardness_max_hv: 900 },
      { wheel_id: otherSet.wheel.id },
    ];
    const review = await inReview(author, stock, { title: 'Frozen columns in review' });
    const returned = ok(await act.return(approver, await inReview(author, stock, { title: 'Frozen columns returned' })));
    const approvedV = await approved(author, approver, stock, { title: 'Frozen columns approved' });
    for (const v of [review, returned, approvedV]) {
      const before = await rowOf(v).first();
      // Every other worst check than the one it has, "none" included.
      const worst = ['blocker', 'warning', 'note', null].filter((w) => w !== before.worst_check).map((w) => ({ worst_check: w }));
      for (const change of [...changes, ...worst]) {
        const what = `${v.status}: ${JSON.stringify(change)}`;
        const error = await refused(rowOf(v).update(change), what);
        expect(error.sqlState, what).to.equal('45000');
        expect(error.message, what).to.match(/frozen/);
      }
      expect(await rowOf(v).first(), v.status).to.deep.equal(before);
    }
    // A draft's columns follow its content freely.
    const draft = await createDraft(author, stock, { title: 'Draft columns' });
    await rowOf(draft).update({ size_max_mm: 61, worst_check: 'note' });
    expect(await rowOf(draft).first('size_max_mm', 'worst_check')).to.deep.equal({ size_max_mm: 61, worst_check: 'note' });
  });

  it('still runs the whole workflow: submit, return, edit, submit, approve, a new version approved, then withdrawn', async () => {
    const draft = await createDraft(author, stock, { title: 'Whole workflow' });
    const returned = ok(await act.return(approver, ok(await act.submit(author, draft))));
    const edited = ok(await act.save(author, returned, { cutting: { ...returned.content.cutting, feedMmS: 0.35 } }));
    expect(edited.status).to.equal('draft');
    const first = ok(await act.approve(approver, ok(await act.submit(author, edited))));
    expect(first.status).to.equal('approved');
    const second = ok(await act.approve(approver, ok(await act.submit(author, ok(await act.newVersion(author, first.recipeId, 1), 201)))));
    expect(second.status).to.equal('approved');
    expect(ok(await act.get(author, first)).status).to.equal('superseded');
    const gone = ok(await act.withdraw(approver, second));
    expect(gone.status).to.equal('withdrawn');
    expect((await verifyChain(ctx.db)).ok).to.equal(true);
  });
});
