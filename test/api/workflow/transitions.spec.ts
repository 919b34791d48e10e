/**
 * Review and approval through the API (DEVELOPERS.md "Review routes"): every
 * transition with its refusals, against the real MariaDB.
 */
import { createHash } from 'node:crypto';
import { expect } from 'chai';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { asJson, countRows } from '../support/test-database';
import { act, approved, createDraft, inReview, ok, post, sessionFor, type Session } from './workflow-support';

describe('Review workflow', () => {
  const ctx = apiTestContext();
  let author: Session;
  let author2: Session;
  let approver: Session;
  let approver2: Session;
  let authorApprover: Session;
  let operator: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    author2 = await sessionFor(ctx.app, ctx.db, ['author'], 'Second Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    approver2 = await sessionFor(ctx.app, ctx.db, ['approver'], 'Second Approver');
    authorApprover = await sessionFor(ctx.app, ctx.db, ['author', 'approver'], 'Both Roles');
    operator = await sessionFor(ctx.app, ctx.db, ['operator']);
    stock = await createStockSet(ctx.db);
  });

  /** What must stay the same when a request is refused. */
  async function snapshot(v: Pick<RecipeVersionDto, 'recipeId' | 'version'>) {
    const row = await ctx
      .db('recipe_versions')
      .where({ recipe_id: v.recipeId, version: v.version })
      .first('status', 'revision', 'content_hash', 'effective_from');
    const recipe = await ctx.db('recipes').where({ id: v.recipeId }).first('current_version_id', 'latest_version_id');
    return {
      row,
      recipe,
      signatures: await countRows(ctx.db, 'signatures'),
      trail: await countRows(ctx.db, 'trail_events'),
      comments: await countRows(ctx.db, 'review_comments'),
      versions: await countRows(ctx.db, 'recipe_versions'),
    };
  }

  const lastEvent = () => ctx.db('trail_events').orderBy('id', 'desc').first();

  describe('the whole path', () => {
    it('draft → submit → return with a comment → author edits → submit → approve with a signature → current; version 2 approved supersedes version 1', async () => {
      // Draft and submit: hash of the canonical content, submitted_at, one trail event.
      const draft = await createDraft(author, stock, { title: 'Whole path' });
      expect(draft.workflow).to.deep.include({ signatures: [], effectiveFrom: null, reviewDueOn: null, submittedAt: null, editorIds: [author.person.id] });
      let events = await countRows(ctx.db, 'trail_events');
      const submitted = ok(await act.submit(author, draft));
      expect(submitted).to.include({ status: 'in-review', revision: draft.revision + 1 });
      const stored = await ctx.db('recipe_versions').where({ recipe_id: draft.recipeId, version: 1 }).first('content_json', 'content_hash', 'submitted_at');
      expect(submitted.contentHash).to.equal(createHash('sha256').update(stored.content_json, 'utf8').digest('hex'));
      expect(stored.content_hash).to.equal(submitted.contentHash);
      expect(submitted.workflow!.submittedAt).to.be.a('string');
      expect(await countRows(ctx.db, 'trail_events')).to.equal(events + 1);
      let event = await lastEvent();
      expect(event).to.include({ event_type: 'recipe.version_submitted', entity_type: 'recipe_version' });
      expect(asJson(event.before_json)).to.include({ status: 'draft' });
      expect(asJson(event.after_json)).to.include({ status: 'in-review', contentSha256: submitted.contentHash });

      // Return with a comment: stored as a review comment; the hash of what was reviewed stays.
      const returned = ok(await act.return(approver, submitted, 'Give the clamp positions in mm.'));
      expect(returned).to.include({ status: 'returned', revision: submitted.revision + 1, contentHash: submitted.contentHash });
      const comments = (await author.agent.get(`/api/recipes/${draft.recipeId}/versions/1/comments`).expect(200)).body;
      expect(comments).to.have.length(1);
      expect(comments[0]).to.include({ body: 'Give the clamp positions in mm.', authorName: 'Tomas Approver', authorId: approver.person.id, path: '' });
      event = await lastEvent();
      expect(event.event_type).to.equal('recipe.version_returned');
      expect(asJson(event.before_json)).to.include({ status: 'in-review' });
      expect(asJson(event.after_json)).to.include({ status: 'returned' });

      // The author edits it: a draft again, without a hash.
      const edited = ok(await act.save(author, returned, { clamping: { ...returned.content.clamping, placement: 'Both sides, 12 mm from the cut.' } }));
      expect(edited).to.include({ status: 'draft', contentHash: null });
      const resubmitted = ok(await act.submit(author, edited));
      expect(resubmitted.contentHash).to.not.equal(submitted.contentHash);

      // Approve: signature with printed name, UTC time, meaning, comment and the content hash.
      events = await countRows(ctx.db, 'trail_events');
      const before = Date.now();
      const approvedV1 = ok(await act.approve(approver, resubmitted, { comment: 'Fine for production.' }));
      expect(approvedV1).to.include({ status: 'approved', revision: resubmitted.revision + 1 });
      const today = new Date().toISOString().slice(0, 10);
      expect(approvedV1.workflow!.effectiveFrom).to.equal(today);
      const due = new Date(`${today}T00:00:00Z`);
      due.setUTCMonth(due.getUTCMonth() + 24);
      expect(approvedV1.workflow!.reviewDueOn!.slice(0, 7)).to.equal(due.toISOString().slice(0, 7));
      expect(approvedV1.workflow!.signatures).to.have.length(1);
      const sig = approvedV1.workflow!.signatures[0]!;
      expect(sig).to.include({
        signerName: 'Tomas Approver',
        signerId: approver.person.id,
        meaning: 'approved',
        comment: 'Fine for production.',
        contentHash: resubmitted.contentHash,
      });
      expect(Date.parse(sig.signedAt)).to.be.within(before - 1000, Date.now() + 1000);
      expect(sig.signedAt).to.match(/Z$/);
      const recipe = await ctx.db('recipes').where({ id: draft.recipeId }).first();
      const v1Row = await ctx.db('recipe_versions').where({ recipe_id: draft.recipeId, version: 1 }).first('id');
      expect(recipe.current_version_id).to.equal(v1Row.id);
      expect(await countRows(ctx.db, 'trail_events')).to.equal(events + 1);
      event = await lastEvent();
      expect(event.event_type).to.equal('recipe.version_approved');
      expect(asJson(event.before_json)).to.include({ status: 'in-review' });
      expect(asJson(event.after_json)).to.include({ status: 'approved', current: true, signerName: 'Tomas Approver' });

      // Version 2 from version 1, approved: version 1 becomes superseded.
      const v2 = ok(await act.newVersion(author2, draft.recipeId, 1, 'Feed lowered after burn marks on the first lot.'), 201);
      expect(v2).to.include({ version: 2, status: 'draft', revision: 0, contentHash: null });
      expect(v2.content.changeReason).to.equal('Feed lowered after burn marks on the first lot.');
      expect({ ...v2.content, changeReason: '' }).to.deep.equal({ ...approvedV1.content, changeReason: '' });
      expect(v2.workflow!.editorIds).to.deep.equal([author2.person.id]);
      const v2saved = ok(await act.save(author2, v2, { cutting: { ...v2.content.cutting, feedMmS: 0.3 } }));
      const v2approved = ok(await act.approve(approver, ok(await act.submit(author2, v2saved))));
      expect(v2approved.status).to.equal('approved');
      const v1now = ok(await act.get(operator, approvedV1));
      expect(v1now).to.include({ status: 'superseded', revision: approvedV1.revision + 1 });
      expect(v1now.workflow!.supersededAt).to.be.a('string');
      expect(v1now.workflow!.signatures).to.have.length(1);
      const v2Row = await ctx.db('recipe_versions').where({ recipe_id: draft.recipeId, version: 2 }).first('id');
      expect((await ctx.db('recipes').where({ id: draft.recipeId }).first()).current_version_id).to.equal(v2Row.id);
      const superseded = await ctx.db('trail_events').where({ event_type: 'recipe.version_superseded', entity_id: String(v1Row.id) });
      expect(superseded).to.have.length(1);
      expect(asJson(superseded[0].before_json)).to.include({ status: 'approved' });
      expect(asJson(superseded[0].after_json)).to.include({ status: 'superseded', supersededByVersion: 2 });

      // The library keeps showing the latest version; the history lists both with their workflow.
      const list = (await operator.agent.get('/api/recipes').query({ q: 'Whole path' }).expect(200)).body;
      expect(list.items[0]).to.include({ version: 2, status: 'approved' });
      const versions = (await operator.agent.get(`/api/recipes/${draft.recipeId}/versions`).expect(200)).body as RecipeVersionDto[];
      expect(versions.map((v) => [v.version, v.status])).to.deep.equal([
        [2, 'approved'],
        [1, 'superseded'],
      ]);
      for (const v of versions) expect(v.workflow!.signatures).to.have.length(1);
    });
  });

  describe('submit', () => {
    it('refuses while a blocker stands, with 409 BLOCKERS naming each one, and writes nothing', async () => {
      // 3500 rpm is outside the bench saw's 1000–3000 rpm.
      const draft = await createDraft(author, stock, { title: 'Too fast', cutting: { wheelRpm: 3500 } });
      const snap = await snapshot(draft);
      const res = await act.submit(author, draft);
      expect(res.status).to.equal(409);
      expect(res.body.code).to.equal('BLOCKERS');
      const blockers = draft.checks.filter((c) => c.severity === 'blocker');
      expect(blockers.length).to.be.greaterThan(0);
      expect(res.body.errors).to.deep.equal(blockers.map((b) => ({ path: b.path ?? '', message: b.message })));
      expect(await snapshot(draft)).to.deep.equal(snap);
    });

    it('re-runs the checks against the stock as it is at submit time', async () => {
      const own = await createStockSet(ctx.db, { machine: { name: 'Saw to be slowed' }, wheel: { name: 'Own wheel' }, material: { name: 'Own material' } });
      const draft = await createDraft(author, own, { title: 'Stock changes' });
      expect(draft.checks.filter((c) => c.severity === 'blocker')).to.deep.equal([]);
      await ctx.db('machines').where({ id: own.machine.id }).update({ rpm_max: 2500 });
      const res = await act.submit(author, draft);
      expect(res.status, JSON.stringify(res.body)).to.equal(409);
      expect(res.body.code).to.equal('BLOCKERS');
      expect(res.body.errors[0].path).to.equal('cutting.wheelRpm');
      expect((await act.get(author, draft)).body.status).to.equal('draft');
    });

    it('needs a change reason from version 2 on', async () => {
      const v1 = await approved(author, approver, stock, { title: 'Reason needed' });
      const v2 = ok(await act.newVersion(author, v1.recipeId, 1), 201);
      const cleared = ok(await act.save(author, v2, { changeReason: '' }));
      const res = await act.submit(author, cleared);
      expect(res.status).to.equal(409);
      expect(res.body.code).to.equal('BLOCKERS');
      expect(res.body.errors.map((e: { path: string }) => e.path)).to.include('changeReason');
    });

    it('refuses a stale revision and a version that is not a draft with 409 CONFLICT and the version as it is', async () => {
      const draft = await createDraft(author, stock, { title: 'Stale submit' });
      const saved = ok(await act.save(author, draft, { instructionsMd: '1. Clamp both sides.\n2. Cut.' }));
      const stale = await act.submit(author, draft);
      expect(stale.status).to.equal(409);
      expect(stale.body.code).to.equal('CONFLICT');
      expect(stale.body.errors[0].path).to.equal('revision');
      expect(stale.body.errors[0].message).to.match(/changed after you opened it/);
      expect(stale.body.current).to.include({ revision: saved.revision, status: 'draft' });
      const submitted = ok(await act.submit(author, saved));
      const again = await act.submit(author, submitted);
      expect(again.status).to.equal(409);
      expect(again.body.errors[0].message).to.match(/in review/);
    });

    it('answers 400 for a bad body and 404 for an unknown version, writing nothing', async () => {
      const draft = await createDraft(author, stock, { title: 'Bad bodies' });
      const snap = await snapshot(draft);
      const res = await post(author, `/api/recipes/${draft.recipeId}/versions/1/submit`, { revision: 'x' });
      expect(res.status).to.equal(400);
      expect(res.body.code).to.equal('VALIDATION_FAILED');
      expect(res.body.errors[0].path).to.equal('revision');
      expect((await post(author, `/api/recipes/${draft.recipeId}/versions/1/submit`, { revision: 0, extra: 1 })).status).to.equal(400);
      expect((await post(author, `/api/recipes/${draft.recipeId}/versions/9/submit`, { revision: 0 })).status).to.equal(404);
      expect(await snapshot(draft)).to.deep.equal(snap);
    });
  });

  describe('return', () => {
    it('requires a comment, and only from in review', async () => {
      const v = await inReview(author, stock, { title: 'Return rules' });
      const snap = await snapshot(v);
      const res = await act.return(approver, v, '', { revision: v.revision, comment: '' });
      expect(res.status).to.equal(400);
      expect(res.body.errors[0].path).to.equal('comment');
      expect(await snapshot(v)).to.deep.equal(snap);
      const draft = await createDraft(author, stock, { title: 'Not in review' });
      expect((await act.return(approver, draft)).status).to.equal(409);
    });
  });

  describe('approve', () => {
    it('refuses the author who is also an approver: 403 OWN_VERSION, nothing written', async () => {
      const draft = ok(await post(authorApprover, '/api/recipes', (await import('../support/stock')).recipeInput(stock, { title: 'Own work' })), 201);
      const v = ok(await act.submit(authorApprover, draft));
      const snap = await snapshot(v);
      const res = await act.approve(authorApprover, v);
      expect(res.status).to.equal(403);
      expect(res.body.code).to.equal('OWN_VERSION');
      expect(await snapshot(v)).to.deep.equal(snap);
      // Another approver may.
      expect(ok(await act.approve(approver, v)).status).to.equal('approved');
    });

    it('refuses an approver who edited the version (not its creator)', async () => {
      const draft = await createDraft(author, stock, { title: 'Edited by an approver' });
      const edited = ok(await act.save(authorApprover, draft, { acceptanceMd: '- No burn marks.\n- Burr below 0.1 mm.' }));
      expect(edited.workflow!.editorIds).to.have.members([author.person.id, authorApprover.person.id]);
      const v = ok(await act.submit(author, edited));
      const snap = await snapshot(v);
      const res = await act.approve(authorApprover, v);
      expect(res.status).to.equal(403);
      expect(res.body.code).to.equal('OWN_VERSION');
      expect(await snapshot(v)).to.deep.equal(snap);
      // The editor does not see it as waiting for their review either.
      const today = (await authorApprover.agent.get('/api/today').expect(200)).body;
      expect(today.waitingForMyReview.map((s: { id: number }) => s.id)).to.not.include(v.recipeId);
    });

    it('answers 400 on password for a wrong signature password and changes nothing at all', async () => {
      const v = await inReview(author, stock, { title: 'Wrong password' });
      const snap = await snapshot(v);
      const failures = await countRows(ctx.db, 'sign_in_failures');
      const res = await act.approve(approver, v, { password: 'not my password' });
      expect(res.status).to.equal(400);
      expect(res.body.code).to.equal('VALIDATION_FAILED');
      expect(res.body.errors).to.have.length(1);
      expect(res.body.errors[0].path).to.equal('password');
      // Nothing changes but the trail, which records the wrong password (and counts toward the person's limit).
      expect(await snapshot(v)).to.deep.equal({ ...snap, trail: snap.trail + 1 });
      expect((await lastEvent()).event_type).to.equal('user.signature_password_wrong');
      expect(await countRows(ctx.db, 'sign_in_failures')).to.equal(failures);
      // Still signed in, and the right password works with the same revision.
      expect(ok(await act.approve(approver, v)).status).to.equal('approved');
    });

    it('refuses a stale revision with 409 CONFLICT, writing nothing', async () => {
      const v = await inReview(author, stock, { title: 'Stale approval' });
      const snap = await snapshot(v);
      const res = await act.approve(approver, v, { revision: v.revision - 1 });
      expect(res.status).to.equal(409);
      expect(res.body.code).to.equal('CONFLICT');
      expect(res.body.errors[0].path).to.equal('revision');
      expect(res.body.current).to.include({ status: 'in-review', revision: v.revision });
      expect(await snapshot(v)).to.deep.equal(snap);
    });

    it('lets exactly one of two approvers signing the same version at the same moment win', async () => {
      const v = await inReview(author, stock, { title: 'Race to approve' });
      const signatures = await countRows(ctx.db, 'signatures');
      const approvals = await ctx.db('trail_events').where({ event_type: 'recipe.version_approved' }).count({ n: '*' }).first();
      const [a, b] = await Promise.all([act.approve(approver, v), act.approve(approver2, v)]);
      expect([a.status, b.status].sort(), JSON.stringify([a.body, b.body])).to.deep.equal([200, 409]);
      const loser = a.status === 409 ? a : b;
      expect(loser.body.code).to.equal('CONFLICT');
      expect(await countRows(ctx.db, 'signatures')).to.equal(signatures + 1);
      const after = await ctx.db('trail_events').where({ event_type: 'recipe.version_approved' }).count({ n: '*' }).first();
      expect(Number(after!.n)).to.equal(Number(approvals!.n) + 1);
      const row = await ctx.db('recipe_versions').where({ recipe_id: v.recipeId, version: 1 }).first('status', 'revision');
      expect(row).to.deep.equal({ status: 'approved', revision: v.revision + 1 });
    });

    it('requires every warning to be acknowledged (400 on acknowledgedWarnings) and stores what was acknowledged', async () => {
      // Dry cutting with a consumable bonded wheel: a burn-risk warning.
      const v = await inReview(author, stock, { title: 'Dry cut', coolant: { type: 'dry', concentrationPct: null, flowLMin: null } });
      const warnings = v.checks.filter((c) => c.severity === 'warning').map((c) => c.id);
      expect(warnings).to.include('dry-cut-burn-risk');
      const snap = await snapshot(v);
      const res = await act.approve(approver, v, { acknowledgedWarnings: warnings.filter((id) => id !== 'dry-cut-burn-risk') });
      expect(res.status).to.equal(400);
      expect(res.body.code).to.equal('VALIDATION_FAILED');
      expect(res.body.errors.map((e: { path: string }) => e.path)).to.deep.equal(['acknowledgedWarnings']);
      expect(res.body.errors[0].message).to.include('dry-cut-burn-risk');
      expect(await snapshot(v)).to.deep.equal(snap);
      ok(await act.approve(approver, v, { acknowledgedWarnings: warnings }));
      const sig = await ctx.db('signatures').orderBy('id', 'desc').first();
      expect(JSON.parse(sig.acknowledged_warnings_json)).to.deep.equal([...new Set(warnings)].sort());
    });

    it('refuses an effective date in the past or not on the calendar, and the meaning must be "approved"', async () => {
      const v = await inReview(author, stock, { title: 'Dates' });
      const snap = await snapshot(v);
      const yesterday = new Date(Date.now() - 86400000).toISOString().slice(0, 10);
      for (const effectiveDate of [yesterday, '2099-02-30', '31.01.2099']) {
        const res = await act.approve(approver, v, { effectiveDate });
        expect(res.status, effectiveDate).to.equal(400);
        expect(res.body.errors[0].path, effectiveDate).to.equal('effectiveDate');
      }
      const meaning = await act.approve(approver, v, { meaning: 'reviewed' });
      expect(meaning.status).to.equal(400);
      expect(meaning.body.errors[0].path).to.equal('meaning');
      expect(await snapshot(v)).to.deep.equal(snap);
    });

    it('is for approvers only, and only for a version in review', async () => {
      const v = await inReview(author, stock, { title: 'Roles' });
      expect((await act.approve(author, v)).status).to.equal(403);
      expect((await act.approve(operator, v)).status).to.equal(403);
      const draft = await createDraft(author, stock, { title: 'Still a draft' });
      const res = await act.approve(approver, draft);
      expect(res.status).to.equal(409);
      expect(res.body.errors[0].path).to.equal('status');
    });
  });

  describe('withdraw', () => {
    it('needs the password and a reason; signs, withdraws and leaves the recipe without a current version', async () => {
      const v = await approved(author, approver, stock, { title: 'To withdraw' });
      const snap = await snapshot(v);
      const noReason = await act.withdraw(approver2, v, { reason: '' });
      expect(noReason.status).to.equal(400);
      expect(noReason.body.errors[0].path).to.equal('reason');
      const noPassword = await act.withdraw(approver2, v, { password: undefined });
      expect(noPassword.status).to.equal(400);
      expect(noPassword.body.errors[0].path).to.equal('password');
      const wrong = await act.withdraw(approver2, v, { password: 'wrong password!' });
      expect(wrong.status).to.equal(400);
      expect(wrong.body.errors[0].path).to.equal('password');
      // Only the trail grows: the wrong password is recorded.
      expect(await snapshot(v)).to.deep.equal({ ...snap, trail: snap.trail + 1 });
      expect((await lastEvent()).event_type).to.equal('user.signature_password_wrong');

      const withdrawn = ok(await act.withdraw(approver2, v, { reason: 'The wheel is no longer made.' }));
      expect(withdrawn.status).to.equal('withdrawn');
      expect(withdrawn.workflow).to.include({ withdrawnReason: 'The wheel is no longer made.' });
      expect(withdrawn.workflow!.withdrawnAt).to.be.a('string');
      expect(withdrawn.workflow!.signatures.map((s) => [s.meaning, s.signerName])).to.deep.equal([
        ['approved', 'Tomas Approver'],
        ['withdrawn', 'Second Approver'],
      ]);
      expect(withdrawn.workflow!.signatures[1]).to.include({ comment: 'The wheel is no longer made.', contentHash: v.contentHash });
      expect((await ctx.db('recipes').where({ id: v.recipeId }).first()).current_version_id).to.equal(null);
      const event = await lastEvent();
      expect(event.event_type).to.equal('recipe.version_withdrawn');
      expect(asJson(event.before_json)).to.include({ status: 'approved', current: true });
      expect(asJson(event.after_json)).to.include({ status: 'withdrawn', reason: 'The wheel is no longer made.' });
    });

    it('refuses anything but an approved version', async () => {
      const v = await inReview(author, stock, { title: 'Withdraw in review' });
      const res = await act.withdraw(approver, v);
      expect(res.status).to.equal(409);
      expect(res.body.code).to.equal('CONFLICT');
    });
  });

  describe('new version', () => {
    it('needs a change reason, starts only from a closed version, and allows one open version at a time', async () => {
      const draft = await createDraft(author, stock, { title: 'One open version' });
      const fromDraft = await act.newVersion(author, draft.recipeId, 1);
      expect(fromDraft.status).to.equal(409);
      const noReason = await post(author, `/api/recipes/${draft.recipeId}/versions`, { fromVersion: 1, changeReason: '' });
      expect(noReason.status).to.equal(400);
      expect(noReason.body.errors[0].path).to.equal('changeReason');
      const missing = await act.newVersion(author, draft.recipeId, 7);
      expect(missing.status).to.equal(400);
      expect(missing.body.errors[0].path).to.equal('fromVersion');
      expect((await act.newVersion(approver, draft.recipeId, 1)).status).to.equal(403);

      const v1 = ok(await act.approve(approver, ok(await act.submit(author, draft))));
      const versions = await countRows(ctx.db, 'recipe_versions');
      const [a, b] = await Promise.all([act.newVersion(author, v1.recipeId, 1, 'First'), act.newVersion(author2, v1.recipeId, 1, 'Second')]);
      expect([a.status, b.status].sort()).to.deep.equal([201, 409]);
      expect(await countRows(ctx.db, 'recipe_versions')).to.equal(versions + 1);
      const again = await act.newVersion(author, v1.recipeId, 1);
      expect(again.status).to.equal(409);
      expect(again.body.errors[0].message).to.match(/Version 2 .* still a draft/);
    });

    it('copies the photos of the version it starts from', async () => {
      const sharp = (await import('sharp')).default;
      const draft = await createDraft(author, stock, { title: 'With a photo' });
      const png = await sharp({ create: { width: 16, height: 12, channels: 3, background: '#406080' } })
        .png()
        .toBuffer();
      await author.agent
        .post(`/api/recipes/${draft.recipeId}/versions/1/attachments`)
        .set('x-csrf-token', author.csrf)
        .field('role', 'setup')
        .attach('file', png, 'setup.png')
        .expect(201);
      const current = ok(await act.get(author, draft));
      const v1 = ok(await act.approve(approver, ok(await act.submit(author, current))));
      const v2 = ok(await act.newVersion(author, v1.recipeId, 1), 201);
      expect(v2.attachments).to.have.length(1);
      expect(v2.attachments[0]!.sha256).to.equal(v1.attachments[0]!.sha256);
      expect(v2.attachments[0]!.id).to.not.equal(v1.attachments[0]!.id);
      const image = await author.agent.get(v2.attachments[0]!.url).expect(200);
      expect(Buffer.compare(image.body as Buffer, png)).to.equal(0);
    });
  });

  describe('comments', () => {
    it('are added by authors and approvers, read by anyone signed in, and written to the trail', async () => {
      const v = await inReview(author, stock, { title: 'Comments' });
      const events = await countRows(ctx.db, 'trail_events');
      const res = await post(approver, `/api/recipes/${v.recipeId}/versions/1/comments`, {
        body: 'Feed looks high for this hardness.',
        path: 'cutting.feedMmS',
      });
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      expect(res.body).to.include({ body: 'Feed looks high for this hardness.', path: 'cutting.feedMmS', authorName: 'Tomas Approver' });
      expect((await post(author, `/api/recipes/${v.recipeId}/versions/1/comments`, { body: 'It was tried on the last lot.' })).status).to.equal(201);
      expect(await countRows(ctx.db, 'trail_events')).to.equal(events + 2);
      expect((await post(operator, `/api/recipes/${v.recipeId}/versions/1/comments`, { body: 'x' })).status).to.equal(403);
      const empty = await post(approver, `/api/recipes/${v.recipeId}/versions/1/comments`, { body: '  ' });
      expect(empty.status).to.equal(400);
      const list = (await author2.agent.get(`/api/recipes/${v.recipeId}/versions/1/comments`).expect(200)).body;
      expect(list.map((c: { body: string }) => c.body)).to.deep.equal(['Feed looks high for this hardness.', 'It was tried on the last lot.']);
      expect((await author2.agent.get(`/api/recipes/${v.recipeId}/versions/5/comments`)).status).to.equal(404);
    });
  });

  describe('Today and reviews due', () => {
    it('lists my drafts, versions waiting for my review and reviews coming due', async () => {
      const mine = await createDraft(author2, stock, { title: 'Today: my draft' });
      const waiting = await inReview(author2, stock, { title: 'Today: waiting' });
      const authorToday = (await author2.agent.get('/api/today').expect(200)).body;
      expect(authorToday.myDrafts.map((s: { id: number }) => s.id)).to.include(mine.recipeId);
      expect(authorToday.myDrafts.map((s: { id: number }) => s.id)).to.not.include(waiting.recipeId);
      expect(authorToday.waitingForMyReview).to.deep.equal([]);
      expect(authorToday).to.deep.include({ flaggedCuts: [], toAcknowledge: [] });
      const otherAuthor = (await author.agent.get('/api/today').expect(200)).body;
      expect(otherAuthor.myDrafts.map((s: { id: number }) => s.id)).to.not.include(mine.recipeId);

      const approverToday = (await approver.agent.get('/api/today').expect(200)).body;
      expect(approverToday.myDrafts).to.deep.equal([]);
      const entry = approverToday.waitingForMyReview.find((s: { id: number }) => s.id === waiting.recipeId);
      expect(entry).to.include({ status: 'in-review', version: 1, title: 'Today: waiting' });

      // A review due in 30 days shows; one due in 90 days does not; soonest first.
      const soon = await approved(author2, approver, stock, { title: 'Due soon' });
      const later = await approved(author2, approver, stock, { title: 'Due later' });
      const overdue = await approved(author2, approver, stock, { title: 'Overdue' });
      const day = (offset: number) => new Date(Date.now() + offset * 86400000).toISOString().slice(0, 10);
      await ctx
        .db('recipe_versions')
        .where({ recipe_id: soon.recipeId, version: 1 })
        .update({ review_due_on: day(30) });
      await ctx
        .db('recipe_versions')
        .where({ recipe_id: later.recipeId, version: 1 })
        .update({ review_due_on: day(90) });
      await ctx
        .db('recipe_versions')
        .where({ recipe_id: overdue.recipeId, version: 1 })
        .update({ review_due_on: day(-3) });
      const due = (await operator.agent.get('/api/reviews/due').expect(200)).body as { id: number; reviewDueOn: string }[];
      const ids = due.map((d) => d.id);
      expect(ids).to.include.members([soon.recipeId, overdue.recipeId]);
      expect(ids).to.not.include(later.recipeId);
      expect(ids.indexOf(overdue.recipeId)).to.be.lessThan(ids.indexOf(soon.recipeId));
      expect(due.find((d) => d.id === soon.recipeId)!.reviewDueOn).to.equal(day(30));
      const dueOn = due.map((d) => d.reviewDueOn);
      expect(dueOn).to.deep.equal([...dueOn].sort());
      expect((await approver.agent.get('/api/today').expect(200)).body.reviewsDue.map((d: { id: number }) => d.id)).to.include(soon.recipeId);
      expect((await operator.agent.get('/api/today').expect(200)).body.reviewsDue).to.deep.equal([]);
    });
  });
});
