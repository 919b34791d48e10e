/**
 * Review-due reminders: the daily job mails the authors of each current
 * approved version whose periodic review is due within 30 days or overdue — once per week
 * (Monday, UTC), however often it runs and however many processes run it.
 */
import { expect } from 'chai';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { addDays } from '../../../shared/calendar-dates';
import { reminderPeriodStart, sendReviewReminders } from '../../../server/services/mail/review-reminders';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, type StockSet } from '../support/stock';
import { countRows } from '../support/test-database';
import { act, createDraft, ok, sessionFor, type Session } from '../workflow/workflow-support';
import { BASE_URL, addressOf, expectMail, mailsOf, optOut, recipientsOf } from './notifications-support';

const noon = (day: string) => new Date(`${day}T12:00:00Z`);

describe('Notification mails: review due', () => {
  const ctx = apiTestContext({ appBaseUrl: BASE_URL });
  const settings = { baseUrl: BASE_URL };
  let author: Session;
  let helper: Session;
  let approver: Session;
  let stock: StockSet;
  let current: RecipeVersionDto;
  let dueOn: string;
  /** A Wednesday 20 days or less before the review is due. */
  let wednesday: string;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    helper = await sessionFor(ctx.app, ctx.db, ['author'], 'Helper Author');
    const quiet = await sessionFor(ctx.app, ctx.db, ['author'], 'Quiet Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    await optOut(ctx.db, quiet.person.id, 'review-due');
    stock = await createStockSet(ctx.db);
    let draft = await createDraft(author, stock, { title: 'Due for review' });
    draft = ok(await act.save(helper, draft));
    draft = ok(await act.save(quiet, draft));
    current = ok(await act.approve(approver, ok(await act.submit(author, draft))));
    dueOn = current.workflow!.reviewDueOn!;
    wednesday = addDays(reminderPeriodStart(noon(addDays(dueOn, -20))), 2);
    // People who must never get it: not editors, deactivated.
    await createPerson(ctx.db, { roles: ['author'], active: false });
  });

  beforeEach(async () => {
    await ctx.db('mail_outbox').delete();
    await ctx.db('review_reminders').delete();
  });

  it('counts weeks from Monday, UTC', () => {
    expect(reminderPeriodStart(new Date('2026-12-02T12:00:00Z'))).to.equal('2026-11-30');
    expect(reminderPeriodStart(new Date('2026-12-06T23:59:59Z'))).to.equal('2026-11-30');
    expect(reminderPeriodStart(new Date('2026-12-07T00:00:00Z'))).to.equal('2026-12-07');
  });

  it("writes the due date in the lab's date format", async () => {
    await ctx.db('lab_settings').where({ id: 1 }).update({ date_format: 'dmy-dot' });
    try {
      await sendReviewReminders(ctx.db, noon(wednesday), settings);
      const shown = `${dueOn.slice(8, 10)}.${dueOn.slice(5, 7)}.${dueOn.slice(0, 4)}`;
      const mails = await mailsOf(ctx.db, 'review-due');
      expect(mails).to.have.length(2);
      for (const mail of mails) {
        expect(mail.subject).to.equal(`Review due ${shown}: ${current.number} v1 "Due for review"`);
        expect(mail.text_body).to.contain(`is due on ${shown}.`);
        expect(mail.text_body).not.to.contain(dueOn);
      }
    } finally {
      await ctx.db('lab_settings').where({ id: 1 }).update({ date_format: 'iso' });
    }
  });

  it('stays quiet while the review is more than 30 days away', async () => {
    expect(await sendReviewReminders(ctx.db, noon(addDays(dueOn, -31)), settings)).to.deep.equal({ reminded: 0, mails: 0 });
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(0);
    expect(await countRows(ctx.db, 'review_reminders')).to.equal(0);
  });

  it('mails the version’s authors once a week, and again the next week', async () => {
    expect(await sendReviewReminders(ctx.db, noon(wednesday), settings)).to.deep.equal({ reminded: 1, mails: 2 });
    expect(await recipientsOf(ctx.db, 'review-due')).to.deep.equal([author.person.username, helper.person.username].map(addressOf).sort());
    for (const mail of await mailsOf(ctx.db, 'review-due')) {
      expectMail(mail, { subject: `Review due ${dueOn}: ${current.number} v1 "Due for review"`, path: `/recipes/${current.recipeId}?v=1`, optional: true });
      expect(mail.text_body).to.contain(`is due on ${dueOn}`);
    }
    const reminder = await ctx.db('review_reminders').first();
    expect(reminder).to.include({ version_id: (await ctx.db('recipe_versions').where({ recipe_id: current.recipeId, version: 1 }).first('id')).id });

    // Same week, later run: nothing more.
    expect(await sendReviewReminders(ctx.db, noon(wednesday), settings)).to.deep.equal({ reminded: 0, mails: 0 });
    expect(await sendReviewReminders(ctx.db, noon(addDays(wednesday, 4)), settings)).to.deep.equal({ reminded: 0, mails: 0 });
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(2);

    // Next Monday: a new reminder.
    expect(await sendReviewReminders(ctx.db, noon(addDays(wednesday, 5)), settings)).to.deep.equal({ reminded: 1, mails: 2 });
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(4);
    expect(await countRows(ctx.db, 'review_reminders')).to.equal(2);
  });

  it('sends once when two runs start at the same moment', async () => {
    const at = noon(wednesday);
    const results = await Promise.all([
      sendReviewReminders(ctx.db, at, settings),
      sendReviewReminders(ctx.db, at, settings),
      sendReviewReminders(ctx.db, at, settings),
    ]);
    expect(results.reduce((n, r) => n + r.reminded, 0)).to.equal(1);
    expect(results.reduce((n, r) => n + r.mails, 0)).to.equal(2);
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(2);
    expect(await countRows(ctx.db, 'review_reminders')).to.equal(1);
  });

  it('says so when the review is overdue', async () => {
    expect((await sendReviewReminders(ctx.db, noon(addDays(dueOn, 10)), settings)).reminded).to.equal(1);
    for (const mail of await mailsOf(ctx.db, 'review-due')) {
      expect(mail.subject).to.equal(`Review overdue ${dueOn}: ${current.number} v1 "Due for review"`);
      expect(mail.text_body).to.contain(`was due on ${dueOn}`);
    }
  });

  it('reminds of the current version only, not of the one it superseded', async () => {
    const v2 = ok(await act.newVersion(author, current.recipeId, 1, 'Reviewed: no change.'), 201);
    ok(await act.approve(approver, ok(await act.submit(author, v2))));
    await ctx.db('mail_outbox').delete();
    // Version 2 (approved today, so due the same day as version 1 was) has the author alone as editor.
    expect(await sendReviewReminders(ctx.db, noon(wednesday), settings)).to.deep.equal({ reminded: 1, mails: 1 });
    const [mail] = await mailsOf(ctx.db, 'review-due');
    expect(mail!.to_address).to.equal(addressOf(author.person.username));
    expectMail(mail!, { subject: `Review due ${dueOn}: ${current.number} v2 "Due for review"`, path: `/recipes/${current.recipeId}?v=2`, optional: true });
  });
});
