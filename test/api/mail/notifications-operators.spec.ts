/**
 * Mails about versions in use: when a version becomes current — approved
 * for today or made current by the scheduled job — every active operator of its machine is
 * asked to acknowledge it (a mail nobody can turn off); a flagged cut tells the authors.
 * One mail is followed end to end: sent to a real SMTP catcher, its link acknowledged.
 */
import { expect } from 'chai';
import type { Transporter } from 'nodemailer';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { applyDueSupersessions } from '../../../server/services/recipes/supersession';
import { createMailTransport, deliverDueMails } from '../../../server/services/mail/worker';
import { startMailCatcher, type MailCatcher } from '../../../server/tools/mail-catcher';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, type StockSet } from '../support/stock';
import { countRows } from '../support/test-database';
import { act, approved, createDraft, ok, post, sessionFor, type Session } from '../workflow/workflow-support';
import { BASE_URL, addressOf, assignMachine, clearEmail, expectMail, linkPaths, mailsOf, optOut, recipientsOf } from './notifications-support';

const DAY_MS = 86400000;
const day = (offset: number) => new Date(Date.now() + offset * DAY_MS).toISOString().slice(0, 10);

describe('Notification mails: version in use and flagged cuts', () => {
  const ctx = apiTestContext({ appBaseUrl: BASE_URL });
  let author: Session;
  let approver: Session;
  let operator: Session;
  let keenOperator: Session;
  let otherOperator: Session;
  let stock: StockSet;
  /** The addresses that must get each version-current mail for `stock.machine`. */
  let expectedOperators: string[];

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Kofi Operator');
    keenOperator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Keen Operator');
    otherOperator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Other Machine');
    stock = await createStockSet(ctx.db);
    const otherStock = await createStockSet(ctx.db, { machine: { name: 'Floor saw' } });
    const gone = await createPerson(ctx.db, { roles: ['operator'], active: false });
    const noMail = await createPerson(ctx.db, { roles: ['operator'] });
    await clearEmail(ctx.db, noMail.id);
    // Assigned to the machine but not an operator: not asked to acknowledge.
    const assignedAuthor = await createPerson(ctx.db, { roles: ['author'] });
    for (const p of [operator.person, keenOperator.person, gone, noMail, assignedAuthor]) await assignMachine(ctx.db, p.id, stock.machine.id);
    await assignMachine(ctx.db, otherOperator.person.id, otherStock.machine.id);
    // Cannot be turned off: an opt-out row for it changes nothing.
    await optOut(ctx.db, keenOperator.person.id, 'version-current');
    expectedOperators = [operator.person.username, keenOperator.person.username].map(addressOf).sort();
  });

  beforeEach(async () => {
    await ctx.db('mail_outbox').delete();
  });

  async function secondVersion(v1: RecipeVersionDto, reason: string): Promise<RecipeVersionDto> {
    const v2 = ok(await act.newVersion(author, v1.recipeId, 1, reason), 201);
    return ok(await act.submit(author, ok(await act.save(author, v2, { cutting: { ...v2.content.cutting, feedMmS: 0.3 } }))));
  }

  it('asks the machine’s operators to acknowledge a version approved for today, naming what changed', async () => {
    const v1 = await approved(author, approver, stock, { title: 'C45 bar in use' });
    expect(await recipientsOf(ctx.db, 'version-current')).to.deep.equal(expectedOperators);
    for (const mail of await mailsOf(ctx.db, 'version-current')) {
      expectMail(mail, {
        subject: `New version in use: ${v1.number} v1 "C45 bar in use" — please acknowledge`,
        path: `/recipes/${v1.recipeId}/acknowledge?v=1`,
        optional: false,
      });
      expect(mail.text_body).to.contain('first version');
      expect(mail.text_body).to.contain('Bench saw');
    }

    await ctx.db('mail_outbox').delete();
    const v2 = ok(await act.approve(approver, await secondVersion(v1, 'Feed lowered after burn marks.')));
    expect(await recipientsOf(ctx.db, 'version-current')).to.deep.equal(expectedOperators);
    for (const mail of await mailsOf(ctx.db, 'version-current')) {
      expectMail(mail, {
        subject: `New version in use: ${v2.number} v2 "C45 bar in use" — please acknowledge`,
        path: `/recipes/${v1.recipeId}/acknowledge?v=2`,
        optional: false,
      });
      expect(mail.text_body).to.contain('What changed: Feed lowered after burn marks.');
      expect(mail.text_body).to.contain('It replaces version 1.');
      expect(mail.text_body).to.contain('acknowledge it');
    }
  });

  it('asks them when the scheduled job makes a version with a later effective date current, once', async () => {
    const v1 = await approved(author, approver, stock, { title: 'C45 bar later' });
    const submitted = await secondVersion(v1, 'New wheel.');
    await ctx.db('mail_outbox').delete();
    const effectiveDate = day(10);
    ok(await act.approve(approver, submitted, { effectiveDate }));
    // Approved for later: the authors hear of it, the operators not yet.
    expect(await recipientsOf(ctx.db, 'version-current')).to.deep.equal([]);
    expect((await mailsOf(ctx.db, 'review-outcome'))[0]!.text_body).to.contain(`It comes into use on ${effectiveDate}.`);

    expect((await applyDueSupersessions(ctx.db, new Date(`${day(9)}T12:00:00Z`), { baseUrl: BASE_URL })).madeCurrent).to.equal(0);
    expect(await recipientsOf(ctx.db, 'version-current')).to.deep.equal([]);

    const at = new Date(`${effectiveDate}T00:05:00Z`);
    expect(await applyDueSupersessions(ctx.db, at, { baseUrl: BASE_URL })).to.deep.equal({ madeCurrent: 1, superseded: 1 });
    expect(await recipientsOf(ctx.db, 'version-current')).to.deep.equal(expectedOperators);
    for (const mail of await mailsOf(ctx.db, 'version-current')) {
      expectMail(mail, { subject: /^New version in use: KB-\d{4} v2 "C45 bar later"/, path: `/recipes/${v1.recipeId}/acknowledge?v=2`, optional: false });
      expect(mail.text_body).to.contain('What changed: New wheel.');
    }
    // A second run (or another process) changes nothing and mails nobody again.
    expect((await applyDueSupersessions(ctx.db, at, { baseUrl: BASE_URL })).madeCurrent).to.equal(0);
    expect(await recipientsOf(ctx.db, 'version-current')).to.have.length(2);
  });

  it('mails the version’s authors about a flagged cut, not about a good one or a refused one', async () => {
    const helper = await sessionFor(ctx.app, ctx.db, ['author'], 'Helper Author');
    const quiet = await sessionFor(ctx.app, ctx.db, ['author'], 'Quiet Author');
    await optOut(ctx.db, quiet.person.id, 'cut-flagged');
    let draft = await createDraft(author, stock, { title: 'Flag me' });
    draft = ok(await act.save(helper, draft));
    draft = ok(await act.save(quiet, draft));
    const current = ok(await act.approve(approver, ok(await act.submit(author, draft))));
    const cut = (v: RecipeVersionDto, outcome: string) =>
      post(operator, `/api/recipes/${v.recipeId}/versions/${v.version}/cuts`, { specimenId: 'S-77', outcome, notes: 'Blue at the exit side.' });
    // Cuts are logged only against a version the operator has acknowledged.
    expect((await post(operator, `/api/recipes/${current.recipeId}/versions/${current.version}/acknowledge`)).status).to.equal(200);
    await ctx.db('mail_outbox').delete();

    expect((await cut(current, 'good')).status).to.equal(201);
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(0);

    expect((await cut(current, 'burnt')).status).to.equal(201);
    expect(await recipientsOf(ctx.db, 'cut-flagged')).to.deep.equal([author.person.username, helper.person.username].map(addressOf).sort());
    for (const mail of await mailsOf(ctx.db, 'cut-flagged')) {
      expectMail(mail, { subject: `Cut flagged: ${current.number} v1 "Flag me"`, path: `/recipes/${current.recipeId}?v=1&tab=cuts`, optional: true });
      expect(mail.text_body).to.contain('Kofi Operator recorded a cut');
      expect(mail.text_body).to.contain('S-77');
      expect(mail.text_body).to.contain('discoloured or burnt');
      expect(mail.text_body).to.contain('Blue at the exit side.');
    }

    // A cut on a version approved for later is refused: no mail.
    await ctx.db('mail_outbox').delete();
    const pending = ok(await act.approve(approver, await secondVersion(current, 'Slower.'), { effectiveDate: day(5) }));
    await ctx.db('mail_outbox').delete();
    expect((await cut(pending, 'burnt')).status).to.equal(409);
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(0);
  });

  describe('through a real SMTP server', () => {
    let catcher: MailCatcher | null = null;
    let transport: Transporter | null = null;

    afterEach(async () => {
      transport?.close();
      if (catcher) await catcher.stop();
      catcher = null;
    });

    it('delivers the request to acknowledge, and its link leads the operator to acknowledge that version', async () => {
      catcher = await startMailCatcher(0, { dir: null });
      transport = createMailTransport(`smtp://127.0.0.1:${catcher.port}`, { ignoreTls: true });
      const v1 = await approved(author, approver, stock, { title: 'Delivered mail' });
      await ctx.db('mail_outbox').whereNot({ kind: 'version-current' }).delete();
      expect(await deliverDueMails(ctx.db, transport, new Date(Date.now() + 1000))).to.deep.equal({ sent: 2, failed: 0 });

      const mine = catcher.messages().find((m) => m.to.includes(addressOf(operator.person.username)));
      expect(mine, 'the operator’s mail').to.not.equal(undefined);
      expect(mine!.subject).to.contain(`${v1.number} v1 "Delivered mail"`);
      expect(mine!.html).to.contain(BASE_URL);
      const path = linkPaths(mine!.text)[0]!;
      const match = /^\/recipes\/(\d+)\/acknowledge\?v=(\d+)$/.exec(path);
      expect(match, path).to.not.equal(null);
      const [recipeId, version] = [Number(match![1]), Number(match![2])];
      expect([recipeId, version]).to.deep.equal([v1.recipeId, 1]);

      const res = await post(operator, `/api/recipes/${recipeId}/versions/${version}/acknowledge`);
      expect(res.status, JSON.stringify(res.body)).to.equal(200);
      expect(res.body.required).to.equal(false);
    });
  });

  it("tells the authors the effective date in the lab's date format", async () => {
    const v1 = await approved(author, approver, stock, { title: 'C45 bar, lab dates' });
    const submitted = await secondVersion(v1, 'New wheel.');
    await ctx.db('mail_outbox').delete();
    await ctx.db('lab_settings').where({ id: 1 }).update({ date_format: 'mdy-slash' });
    try {
      const effectiveDate = day(10);
      ok(await act.approve(approver, submitted, { effectiveDate }));
      const text = (await mailsOf(ctx.db, 'review-outcome'))[0]!.text_body;
      expect(text).to.contain(`It comes into use on ${effectiveDate.slice(5, 7)}/${effectiveDate.slice(8, 10)}/${effectiveDate.slice(0, 4)}.`);
      expect(text).not.to.contain(effectiveDate);
    } finally {
      await ctx.db('lab_settings').where({ id: 1 }).update({ date_format: 'iso' });
    }
  });
});
