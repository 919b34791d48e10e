/**
 * The records that are evidence — cut records, acknowledgements, sheet prints, signatures
 * and review comments — are append-only in MariaDB itself, against someone who can write to
 * the database: no UPDATE, no DELETE (a cut's flag is cleared once, and only that). A
 * signature is accepted only on a version in the state its meaning signs (approval on a
 * version in review, withdrawal on an approved one), bound to the version's content hash,
 * which is the order the app writes them in.
 */
import { expect } from 'chai';
import type { CutRecordDto, RecipeVersionDto } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { act, approved, createDraft, inReview, ok, post, sessionFor, type Session } from '../workflow/workflow-support';

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

describe('Append-only evidence in the database', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;
  let stock: StockSet;
  let current: RecipeVersionDto;
  let flagged: CutRecordDto;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author']);
    approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    operator = await sessionFor(ctx.app, ctx.db, ['operator']);
    stock = await createStockSet(ctx.db);
    await ctx.db('user_machines').insert({ user_id: operator.person.id, machine_id: stock.machine.id, assigned_at: new Date() });
    current = await approved(author, approver, stock, { title: 'Evidence' });
    // One of each record, written by the app.
    await post(operator, `/api/recipes/${current.recipeId}/versions/1/acknowledge`, {}).expect(200);
    await operator.agent.get(`/api/recipes/${current.recipeId}/versions/1/sheet.pdf`).expect(200);
    flagged = (await post(operator, `/api/recipes/${current.recipeId}/versions/1/cuts`, { specimenId: 'S-9', outcome: 'burnt' }).expect(201))
      .body as CutRecordDto;
    await post(approver, `/api/recipes/${current.recipeId}/versions/1/comments`, { body: 'Kept.' }).expect(201);
  });

  /** A change of every column but the id, and the table's message. */
  const EVIDENCE: { table: string; change: Record<string, unknown>; message: RegExp }[] = [
    { table: 'cut_records', change: { outcome: 'good', notes: 'rewritten', specimen_id: 'S-10', quantity: 7 }, message: /cut records/ },
    { table: 'acknowledgements', change: { user_name: 'Someone else', acknowledged_at: new Date(0) }, message: /acknowledgements/ },
    { table: 'sheet_prints', change: { printed_at: new Date(0), client_address: '10.0.0.1' }, message: /sheet prints/ },
    { table: 'signatures', change: { signer_name: 'Someone else', comment: 'forged' }, message: /signatures/ },
    { table: 'review_comments', change: { body: 'Rewritten.' }, message: /review comments/ },
  ];

  for (const { table, change, message } of EVIDENCE) {
    it(`refuses any UPDATE or DELETE of ${table}, one column at a time, changing nothing`, async () => {
      const before = await ctx.db(table).orderBy('id');
      expect(before.length, `${table} has a row`).to.be.above(0);
      for (const [column, value] of Object.entries(change)) {
        const error = await refused(ctx.db(table).update({ [column]: value }), `UPDATE ${table}.${column}`);
        expect(error.sqlState, column).to.equal('45000');
        expect(error.message, column).to.match(message);
      }
      const gone = await refused(ctx.db(table).del(), `DELETE FROM ${table}`);
      expect(gone.sqlState).to.equal('45000');
      expect(gone.message).to.match(message);
      expect(await ctx.db(table).orderBy('id')).to.deep.equal(before);
    });
  }

  it("lets a cut's flag be cleared once, through the app, and nothing else with it", async () => {
    const row = await ctx.db('cut_records').where({ id: flagged.id }).first();
    const at = new Date();
    // Clearing together with another change, or without saying who cleared it, is refused.
    await refused(
      ctx.db('cut_records').where({ id: flagged.id }).update({ flag_cleared_at: at, flag_cleared_by: author.person.id, outcome: 'good' }),
      'clear + outcome',
    );
    await refused(ctx.db('cut_records').where({ id: flagged.id }).update({ flag_cleared_at: at }), 'clear without who');
    expect(await ctx.db('cut_records').where({ id: flagged.id }).first()).to.deep.equal(row);
    const cleared = (await post(author, `/api/cuts/${flagged.id}/clear-flag`).expect(200)).body as CutRecordDto;
    expect(cleared.flagClearedAt).to.be.a('string');
    // Once cleared, the clearing itself is kept.
    const error = await refused(ctx.db('cut_records').where({ id: flagged.id }).update({ flag_cleared_at: null, flag_cleared_by: null }), 'unclear');
    expect(error.message).to.match(/cut records/);
  });

  const signatureOf = (versionId: number, meaning: string, contentHash: string) => ({
    version_id: versionId,
    signer_id: approver.person.id,
    signer_name: 'Forged',
    meaning,
    comment: '',
    signed_at: new Date(),
    content_hash: contentHash,
    acknowledged_warnings_json: '[]',
  });

  it('refuses a forged signature on a draft, on the wrong state for its meaning, or on other content; changes nothing', async () => {
    const draft = await createDraft(author, stock, { title: 'Forged on a draft' });
    const draftRow = await ctx.db('recipe_versions').where({ recipe_id: draft.recipeId, version: 1 }).first();
    const review = await inReview(author, stock, { title: 'Forged in review' });
    const reviewRow = await ctx.db('recipe_versions').where({ recipe_id: review.recipeId, version: 1 }).first();
    const approvedRow = await ctx.db('recipe_versions').where({ recipe_id: current.recipeId, version: 1 }).first();
    const count = async () => Number(((await ctx.db('signatures').count({ n: '*' }).first()) as { n: number }).n);
    const before = await count();
    const forged: [string, Record<string, unknown>][] = [
      ['approval of a draft', signatureOf(draftRow.id, 'approved', 'a'.repeat(64))],
      ['withdrawal of a draft', signatureOf(draftRow.id, 'withdrawn', 'a'.repeat(64))],
      ['withdrawal of a version in review', signatureOf(reviewRow.id, 'withdrawn', reviewRow.content_hash)],
      ['approval of an approved version', signatureOf(approvedRow.id, 'approved', approvedRow.content_hash)],
      ['approval of other content', signatureOf(reviewRow.id, 'approved', 'b'.repeat(64))],
    ];
    for (const [what, row] of forged) {
      const error = await refused(ctx.db('signatures').insert(row), what);
      expect(error.sqlState, what).to.equal('45000');
      expect(error.message, what).to.match(/signature/);
    }
    expect(await count()).to.equal(before);
  });

  it('still signs in the app’s order: approval and withdrawal through the API', async () => {
    const v = ok(await act.approve(approver, await inReview(author, stock, { title: 'Signed in order' })));
    const gone = ok(await act.withdraw(approver, v));
    expect(gone.status).to.equal('withdrawn');
    const meanings = (await ctx
      .db('signatures')
      .whereIn('version_id', ctx.db('recipe_versions').select('id').where({ recipe_id: v.recipeId }))
      .orderBy('id')
      .pluck('meaning')) as string[];
    expect(meanings).to.deep.equal(['approved', 'withdrawn']);
  });
});
