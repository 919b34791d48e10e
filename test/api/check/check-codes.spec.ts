/**
 * Check codes (DEVELOPERS.md "Operator routes"): the code given
 * at approval, and GET /api/check/:code for every state a printed sheet can be in.
 */
import { expect } from 'chai';
import type { CheckCodeResult, RecipeVersionDto } from '../../../shared/recipe-types';
import { CHECK_CODE_PATTERN } from '../../../shared/schemas/operator';
import { assignCheckCode, CHECK_CODE_ALPHABET, newCheckCode } from '../../../server/services/recipes/check-codes';
import { up as backfillCheckCodes } from '../../../migrations/20261201234346_backfill_check_codes';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { anonymousAgent } from '../support/test-app';
import { act, approved, createDraft, inReview, ok, sessionFor, type Session } from '../workflow/workflow-support';

const day = (inDays: number) => new Date(Date.now() + inDays * 86400000).toISOString().slice(0, 10);

describe('Check codes', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Ana Operator');
    stock = await createStockSet(ctx.db);
  });

  async function codeOf(v: Pick<RecipeVersionDto, 'recipeId' | 'version'>): Promise<string | null> {
    return (await ctx.db('recipe_versions').where({ recipe_id: v.recipeId, version: v.version }).first('check_code')).check_code;
  }

  async function check(code: string, who: Session = operator): Promise<CheckCodeResult> {
    const res = await who.agent.get(`/api/check/${encodeURIComponent(code)}`);
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    return res.body as CheckCodeResult;
  }

  const dashed = (code: string) => `${code.slice(0, 4)}-${code.slice(4)}`;

  describe('the code', () => {
    it('is 8 Crockford base32 characters, from the whole alphabet', () => {
      const seen = new Set<string>();
      for (let i = 0; i < 400; i += 1) {
        const code = newCheckCode();
        expect(code).to.match(/^[0-9A-HJKMNP-TV-Z]{8}$/);
        expect(CHECK_CODE_PATTERN.test(code)).to.equal(true);
        for (const c of code) seen.add(c);
      }
      expect([...seen].sort().join('')).to.equal([...CHECK_CODE_ALPHABET].sort().join(''));
    });

    it('is given when a version is approved, not before, and is unique', async () => {
      const draft = await createDraft(author, stock, { title: 'Code on approval' });
      expect(await codeOf(draft)).to.equal(null);
      const review = ok(await act.submit(author, draft));
      expect(await codeOf(review)).to.equal(null);
      ok(await act.approve(approver, review));
      const code = await codeOf(review);
      expect(code).to.match(/^[0-9A-HJKMNP-TV-Z]{8}$/);
      const other = await approved(author, approver, stock, { title: 'Another one' });
      expect(await codeOf(other)).to.not.equal(code);
    });

    it('tries again when a new code clashes with one already given', async () => {
      const first = await approved(author, approver, stock, { title: 'Clash target' });
      const taken = (await codeOf(first))!;
      const v = await createDraft(author, stock, { title: 'Clash victim' });
      const id = (await ctx.db('recipe_versions').where({ recipe_id: v.recipeId, version: 1 }).first('id')).id as number;
      const tries = [taken, taken, 'QQQQ2222'];
      await assignCheckCode(ctx.db, id, () => tries.shift()!);
      expect(await codeOf(v)).to.equal('QQQQ2222');
      expect(tries).to.have.length(0);
    });
  });

  it('is backfilled for versions approved before codes existed, keeping codes already given', async () => {
    const kept = await approved(author, approver, stock, { title: 'Keeps its code' });
    const keptCode = await codeOf(kept);
    const old = await approved(author, approver, stock, { title: 'Approved before codes' });
    const open = await createDraft(author, stock, { title: 'Still open' });
    await ctx.db('recipe_versions').where({ recipe_id: old.recipeId }).update({ check_code: null });
    await backfillCheckCodes(ctx.db);
    expect(await codeOf(old)).to.match(/^[0-9A-HJKMNP-TV-Z]{8}$/);
    expect(await codeOf(kept)).to.equal(keptCode);
    expect(await codeOf(open)).to.equal(null);
    const again = await codeOf(old);
    await backfillCheckCodes(ctx.db);
    expect(await codeOf(old)).to.equal(again);
  });

  describe('GET /api/check/:code', () => {
    it('says a current version may be used, with or without the dash, in any case', async () => {
      const v = await approved(author, approver, stock, { title: 'Current one' });
      const code = (await codeOf(v))!;
      const expected: CheckCodeResult = {
        code: dashed(code),
        recipeId: v.recipeId,
        number: v.number,
        title: 'Current one',
        version: 1,
        state: 'current',
        currentVersion: null,
        message: 'Version 1 is current — this sheet may be used.',
      };
      expect(await check(code)).to.deep.equal(expected);
      expect(await check(dashed(code).toLowerCase())).to.deep.equal(expected);
      expect(await check(` ${dashed(code)} `)).to.deep.equal(expected);
    });

    it('says superseded and names the current version once the next one is approved', async () => {
      const v1 = await approved(author, approver, stock, { title: 'Will be superseded' });
      const code1 = (await codeOf(v1))!;
      const draft2 = ok(await act.newVersion(author, v1.recipeId, 1), 201);
      const v2 = ok(await act.approve(approver, ok(await act.submit(author, draft2))));
      const code2 = (await codeOf(v2))!;
      expect(code2).to.not.equal(code1);
      expect(await check(code1)).to.deep.include({
        version: 1,
        state: 'superseded',
        currentVersion: 2,
        message: 'Superseded by version 2 — do not use this sheet; print the current one.',
      });
      expect(await check(code2)).to.deep.include({
        version: 2,
        state: 'current',
        currentVersion: null,
        message: 'Version 2 is current — this sheet may be used.',
      });
    });

    it('says pending for a version approved for a later day, and names the version in force until then', async () => {
      const v1 = await approved(author, approver, stock, { title: 'Pending successor' });
      const draft2 = ok(await act.newVersion(author, v1.recipeId, 1), 201);
      const later = day(14);
      const v2 = ok(await act.approve(approver, ok(await act.submit(author, draft2)), { effectiveDate: later }));
      expect(await check((await codeOf(v2))!)).to.deep.include({
        version: 2,
        state: 'pending',
        currentVersion: 1,
        message: `Version 2 becomes current on ${later} — do not use this sheet before then. Until then version 1 is current.`,
      });
      expect(await check((await codeOf(v1))!)).to.deep.include({ state: 'current', currentVersion: null });
    });

    it('says withdrawn, with the day, and that the recipe is not to be used', async () => {
      const v = await approved(author, approver, stock, { title: 'Withdrawn one' });
      const withdrawn = ok(await act.withdraw(approver, v));
      const result = await check((await codeOf(v))!);
      expect(result).to.deep.include({
        state: 'withdrawn',
        currentVersion: null,
        message: `Withdrawn on ${withdrawn.workflow!.withdrawnAt!.slice(0, 10)} — do not use this recipe.`,
      });
    });

    it('answers 400 with a clear message for a malformed code', async () => {
      for (const bad of ['abc', 'IIII-LLLL', 'OOOO-UUUU', '1234-56789', 'A'.repeat(60), '12345678-']) {
        const res = await operator.agent.get(`/api/check/${encodeURIComponent(bad)}`);
        expect(res.status, bad).to.equal(400);
        expect(res.body.code).to.equal('VALIDATION_FAILED');
        expect(res.body.errors).to.deep.equal([{ path: 'code', message: 'A check code has 8 letters and digits, like 7KQ2-M9XD.' }]);
      }
    });

    it('answers 404 for a well-formed code no sheet has', async () => {
      const res = await operator.agent.get('/api/check/ZZZZ-ZZZ0');
      expect(res.status).to.equal(404);
      expect(res.body.code).to.equal('NOT_FOUND');
      expect(res.body.errors[0].message).to.include('ZZZZ-ZZZ0');
    });

    it('is open to everyone signed in (an operator above; an author here), not to anonymous callers', async () => {
      const v = await approved(author, approver, stock, { title: 'Who may check' });
      const code = (await codeOf(v))!;
      expect((await check(code, author)).state).to.equal('current');
      const { agent } = await anonymousAgent(ctx.app);
      expect((await agent.get(`/api/check/${code}`)).status).to.equal(401);
    });

    it('gives no code to a version that was never approved', async () => {
      const review = await inReview(author, stock, { title: 'Never approved' });
      expect(await codeOf(review)).to.equal(null);
    });
  });
});
