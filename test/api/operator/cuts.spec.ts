/**
 * Cut records: recorded on the current version only, listed, exported as CSV,
 * traced by specimen id, flagged on the author's Today until an author clears the flag.
 */
import { expect } from 'chai';
import type { CutRecordDto, CutTrace, RecipeVersionDto } from '../../../shared/recipe-types';
import { CSRF_HEADER } from '../../../shared/api-types';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { asJson, countRows } from '../support/test-database';
import { act, approved, createDraft, inReview, ok, post, sessionFor, type Session } from '../workflow/workflow-support';

describe('Cut records', () => {
  const ctx = apiTestContext();
  let author: Session;
  let otherAuthor: Session;
  let approver: Session;
  let operator: Session;
  let auditor: Session;
  let stock: StockSet;
  let current: RecipeVersionDto;

  const cutsPath = (v: Pick<RecipeVersionDto, 'recipeId' | 'version'>) => `/api/recipes/${v.recipeId}/versions/${v.version}/cuts`;
  const cut = (v: Pick<RecipeVersionDto, 'recipeId' | 'version'>, body: object, who = operator) => post(who, cutsPath(v), body);
  const today = async (who: Session) => (await who.agent.get('/api/today').expect(200)).body;
  const written = async () => ({ cuts: await countRows(ctx.db, 'cut_records'), trail: await countRows(ctx.db, 'trail_events') });

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    otherAuthor = await sessionFor(ctx.app, ctx.db, ['author'], 'Other Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Kofi Operator');
    auditor = await sessionFor(ctx.app, ctx.db, ['auditor']);
    stock = await createStockSet(ctx.db);
    current = await approved(author, approver, stock, { title: 'C45 bar for cuts' });
  });

  describe('recording', () => {
    it('records a good cut on the current version with the operator’s name, the UTC time and a trail event', async () => {
      const before = await written();
      const t0 = Date.now();
      const res = await cut(current, { specimenId: 'S-1001', partRef: 'Heat 7731', quantity: 2, outcome: 'good', notes: '' });
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      const dto = res.body as CutRecordDto;
      expect(dto).to.include({
        recipeId: current.recipeId,
        number: current.number,
        version: 1,
        specimenId: 'S-1001',
        partRef: 'Heat 7731',
        quantity: 2,
        outcome: 'good',
        operatorId: operator.person.id,
        operatorName: 'Kofi Operator',
        flagClearedAt: null,
      });
      expect(dto.cutAt).to.match(/Z$/);
      expect(Date.parse(dto.cutAt)).to.be.within(t0 - 1000, Date.now() + 1000);
      expect(await written()).to.deep.equal({ cuts: before.cuts + 1, trail: before.trail + 1 });
      const event = await ctx.db('trail_events').orderBy('id', 'desc').first();
      expect(event).to.include({ event_type: 'cut.recorded', actor_user_id: operator.person.id, recipe_id: current.recipeId });
      expect(asJson(event.after_json)).to.include({ cutId: dto.id, specimenId: 'S-1001', outcome: 'good' });
    });

    it('fills the defaults (quantity 1, no part, no notes)', async () => {
      const res = await cut(current, { specimenId: 'S-1002', outcome: 'good' });
      expect(res.status).to.equal(201);
      expect(res.body).to.include({ quantity: 1, partRef: '', notes: '' });
    });

    it('refuses over-long texts and bad values with 400, writing nothing', async () => {
      const before = await written();
      const cases: [object, string][] = [
        [{ specimenId: 'S'.repeat(61), outcome: 'good' }, 'specimenId'],
        [{ specimenId: 'S-1', outcome: 'good', notes: 'n'.repeat(2001) }, 'notes'],
        [{ specimenId: 'S-1', outcome: 'good', partRef: 'p'.repeat(121) }, 'partRef'],
        [{ specimenId: 'S-1', outcome: 'smoking' }, 'outcome'],
        [{ specimenId: '  ', outcome: 'good' }, 'specimenId'],
        [{ specimenId: 'S-1', outcome: 'good', quantity: 0 }, 'quantity'],
        [{ specimenId: 'S-1', outcome: 'good', operatorId: 1 }, ''],
      ];
      for (const [body, path] of cases) {
        const res = await cut(current, body);
        expect(res.status, JSON.stringify(body)).to.equal(400);
        expect(res.body.code).to.equal('VALIDATION_FAILED');
        if (path) expect(res.body.errors.map((e: { path: string }) => e.path)).to.include(path);
      }
      expect(await written()).to.deep.equal(before);
    });

    it('answers 404 for an unknown recipe or version, and for versions an operator may not see', async () => {
      const draft = await createDraft(author, stock, { title: 'Draft for cuts' });
      const pending = await inReview(author, stock, { title: 'In review for cuts' });
      const both = await sessionFor(ctx.app, ctx.db, ['operator', 'author']);
      const before = await written();
      expect((await cut({ recipeId: current.recipeId, version: 9 }, { specimenId: 'S-1', outcome: 'good' })).status).to.equal(404);
      expect((await cut({ recipeId: 999999, version: 1 }, { specimenId: 'S-1', outcome: 'good' })).status).to.equal(404);
      expect((await cut(draft, { specimenId: 'S-1', outcome: 'good' })).status).to.equal(404);
      expect((await cut(pending, { specimenId: 'S-1', outcome: 'good' })).status).to.equal(404);
      // Someone who is also an author sees the draft, and is told why it cannot take cuts.
      const res = await cut(draft, { specimenId: 'S-1', outcome: 'good' }, both);
      expect(res.status).to.equal(409);
      expect(res.body.errors[0].message).to.match(/is a draft: cuts are recorded only on the current version/);
      expect(await written()).to.deep.equal(before);
    });

    it('lets only operators record cuts', async () => {
      expect((await cut(current, { specimenId: 'S-1', outcome: 'good' }, author)).status).to.equal(403);
    });

    it('refuses a cut on an approved version that is not in force yet (409)', async () => {
      const first = await approved(author, approver, stock, { title: 'Pending next' });
      const next = ok(await act.newVersion(author, first.recipeId, 1), 201);
      const submitted = ok(await act.submit(author, next));
      const later = new Date(Date.now() + 14 * 86400000).toISOString().slice(0, 10);
      const pending = ok(await act.approve(approver, submitted, { effectiveDate: later }));
      expect(pending.status).to.equal('approved');
      const before = await written();
      const res = await cut(pending, { specimenId: 'S-1', outcome: 'good' });
      expect(res.status).to.equal(409);
      expect(res.body.errors[0].message).to.equal(
        `Version 2 of ${first.number} is approved but not in force yet: cuts are recorded only on the current version. Use version 1, the one in force.`,
      );
      expect(await written()).to.deep.equal(before);
    });
  });

  describe('flags, lists and exports', () => {
    let burnt: CutRecordDto;

    it('flags a burnt cut on the author’s Today, and only there', async () => {
      expect((await today(author)).flaggedCuts).to.deep.equal([]);
      const res = await cut(current, { specimenId: 'S-2001', partRef: 'Lot 12', outcome: 'burnt', notes: 'Temper colours on the face near the centre.' });
      expect(res.status).to.equal(201);
      burnt = res.body;
      expect((await today(author)).flaggedCuts).to.deep.equal([{ recipeId: current.recipeId, number: current.number, title: 'C45 bar for cuts', count: 1 }]);
      expect((await today(otherAuthor)).flaggedCuts).to.deep.equal([]);
      expect((await today(approver)).flaggedCuts).to.deep.equal([]);
      expect((await today(operator)).flaggedCuts).to.deep.equal([]);
      await cut(current, { specimenId: 'S-2002', outcome: 'deformed', notes: 'Burr on the exit side.' });
      expect((await today(author)).flaggedCuts[0].count).to.equal(2);
    });

    it('lists the version’s cuts newest first for anyone signed in', async () => {
      for (const who of [operator, auditor, author]) {
        const res = await who.agent.get(cutsPath(current));
        expect(res.status).to.equal(200);
        expect(res.body.map((c: CutRecordDto) => c.specimenId)).to.deep.equal(['S-2002', 'S-2001', 'S-1002', 'S-1001']);
      }
      expect((await operator.agent.get(cutsPath({ recipeId: current.recipeId, version: 5 }))).status).to.equal(404);
    });

    it('exports the version’s cuts as CSV: UTF-8 with BOM, CRLF, quoted fields, formulas made inert', async () => {
      await cut(current, { specimenId: '=HYPERLINK("x")', partRef: 'Ø 40, "as rolled"', outcome: 'other', notes: 'line one\nline two' });
      const res = await auditor.agent
        .get(`${cutsPath(current)}.csv`)
        .buffer(true)
        .parse((r, cb) => {
          const chunks: Buffer[] = [];
          r.on('data', (c: Buffer) => chunks.push(c));
          r.on('end', () => cb(null, Buffer.concat(chunks)));
        });
      expect(res.status).to.equal(200);
      expect(res.headers['content-type']).to.equal('text/csv; charset=utf-8');
      expect(res.headers['content-disposition']).to.match(new RegExp(`attachment; filename="kerfbook-cuts-${current.number}-v1-\\d{8}\\.csv"`));
      const bytes = res.body as Buffer;
      expect([...bytes.subarray(0, 3)]).to.deep.equal([0xef, 0xbb, 0xbf]);
      const text = bytes.toString('utf8').slice(1);
      const lines = text.split('\r\n');
      expect(lines[0]).to.equal(
        'cut_id,recipe,version,specimen_id,part_lot_heat,quantity,outcome,notes,operator_id,operator_name,cut_at_utc,flag_cleared_at_utc',
      );
      expect(lines[1]).to.match(
        new RegExp(
          `^\\d+,${current.number},1,"'=HYPERLINK\\(""x""\\)","Ø 40, ""as rolled""",1,other,"line one\nline two",${operator.person.id},Kofi Operator,[0-9T:.-]+Z,$`,
        ),
      );
      expect(text.endsWith('\r\n')).to.equal(true);
      expect(lines.filter((l) => /^\d+,/.test(l))).to.have.length(5);
    });

    it('traces a specimen to the version’s content and signatures', async () => {
      const res = await auditor.agent.get('/api/cuts').query({ specimenId: 'S-2001' });
      expect(res.status).to.equal(200);
      const traces = res.body as CutTrace[];
      expect(traces).to.have.length(1);
      expect(traces[0]!.cut).to.deep.equal(burnt);
      expect(traces[0]!.versionContent).to.deep.equal(current.content);
      expect(traces[0]!.signatures.map((s) => [s.signerName, s.meaning])).to.deep.equal([['Tomas Approver', 'approved']]);
      expect((await operator.agent.get('/api/cuts').query({ specimenId: 'nobody' })).body).to.deep.equal([]);
      const missing = await operator.agent.get('/api/cuts');
      expect(missing.status).to.equal(400);
      expect(missing.body.errors[0].path).to.equal('specimenId');
    });

    it('lets an author clear a flag once, with a trail event; good cuts carry no flag', async () => {
      const before = await written();
      expect((await post(operator, `/api/cuts/${burnt.id}/clear-flag`)).status).to.equal(403);
      const res = await post(author, `/api/cuts/${burnt.id}/clear-flag`);
      expect(res.status, JSON.stringify(res.body)).to.equal(200);
      expect(res.body).to.include({ id: burnt.id, outcome: 'burnt' });
      expect(res.body.flagClearedAt).to.be.a('string');
      const row = await ctx.db('cut_records').where({ id: burnt.id }).first();
      expect(row.flag_cleared_by).to.equal(author.person.id);
      expect(await written()).to.deep.equal({ cuts: before.cuts, trail: before.trail + 1 });
      const event = await ctx.db('trail_events').orderBy('id', 'desc').first();
      expect(event).to.include({ event_type: 'cut.flag_cleared', actor_user_id: author.person.id, recipe_id: current.recipeId });
      // Two flagged cuts remain (deformed, other).
      expect((await today(author)).flaggedCuts[0].count).to.equal(2);

      const again = await post(author, `/api/cuts/${burnt.id}/clear-flag`);
      expect(again.status).to.equal(409);
      const good = (await operator.agent.get(cutsPath(current))).body.find((c: CutRecordDto) => c.outcome === 'good');
      expect((await post(author, `/api/cuts/${good.id}/clear-flag`)).status).to.equal(409);
      expect((await post(author, '/api/cuts/999999/clear-flag')).status).to.equal(404);
      expect((await post(author, '/api/cuts/abc/clear-flag')).status).to.equal(400);
      expect(await written()).to.deep.equal({ cuts: before.cuts, trail: before.trail + 1 });
    });
  });

  describe('on a superseded version', () => {
    it('refuses new cuts (409), takes them on the new current version, and keeps the old cuts listed', async () => {
      const next = ok(await act.newVersion(author, current.recipeId, 1), 201);
      const v2 = ok(await act.approve(approver, ok(await act.submit(author, next))));
      expect(v2.status).to.equal('approved');
      const before = await written();
      const refused = await cut(current, { specimenId: 'S-3001', outcome: 'good' });
      expect(refused.status).to.equal(409);
      expect(refused.body.errors[0].message).to.equal(
        `Version 1 of ${current.number} is superseded: cuts are recorded only on the current version. Use version 2, the one in force.`,
      );
      expect(await written()).to.deep.equal(before);
      expect((await cut(v2, { specimenId: 'S-3001', outcome: 'good' })).status).to.equal(201);
      expect((await operator.agent.get(cutsPath(current))).body).to.have.length(5);
      expect((await operator.agent.get(cutsPath(v2))).body).to.have.length(1);
    });

    it('still counts flags for an author who only edited a later version', async () => {
      // otherAuthor edits a new draft of the recipe: the open flags now show on their Today too.
      const v3 = ok(await act.newVersion(otherAuthor, current.recipeId, 2), 201);
      expect(v3.version).to.equal(3);
      expect((await today(otherAuthor)).flaggedCuts.map((f: { recipeId: number }) => f.recipeId)).to.deep.equal([current.recipeId]);
    });
  });

  it('needs the CSRF header to record a cut', async () => {
    const res = await operator.agent.post(cutsPath(current)).set(CSRF_HEADER, 'wrong').send({ specimenId: 'S-1', outcome: 'good' });
    expect(res.status).to.equal(403);
  });
});
