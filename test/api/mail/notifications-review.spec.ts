/**
 * Review mails: a submitted version tells the approvers who could approve it;
 * a return or an approval tells the version's authors. Mails go only to active people with
 * an e-mail who did not turn the kind off, and a refused transition enqueues nothing.
 */
import { expect } from 'chai';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, type StockSet } from '../support/stock';
import { countRows } from '../support/test-database';
import { act, createDraft, ok, sessionFor, type Session } from '../workflow/workflow-support';
import { BASE_URL, addressOf, clearEmail, expectMail, mailsOf, optOut, recipientsOf } from './notifications-support';

describe('Notification mails: review requested and review outcome', () => {
  const ctx = apiTestContext({ appBaseUrl: BASE_URL });
  let author: Session;
  let coAuthor: Session;
  let quietAuthor: Session;
  let approver: Session;
  let approverAuthor: Session;
  let quietApprover: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    coAuthor = await sessionFor(ctx.app, ctx.db, ['author', 'approver'], 'Carla Both');
    quietAuthor = await sessionFor(ctx.app, ctx.db, ['author'], 'Quiet Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    approverAuthor = await sessionFor(ctx.app, ctx.db, ['approver', 'author'], 'Otto Other');
    quietApprover = await sessionFor(ctx.app, ctx.db, ['approver'], 'Quiet Approver');
    await optOut(ctx.db, quietApprover.person.id, 'review-requested');
    // Opted out of another kind only: still gets review requests.
    await optOut(ctx.db, approverAuthor.person.id, 'review-outcome');
    await optOut(ctx.db, quietAuthor.person.id, 'review-outcome');
    const gone = await createPerson(ctx.db, { roles: ['approver'], active: false });
    const noMail = await createPerson(ctx.db, { roles: ['approver'] });
    await clearEmail(ctx.db, noMail.id);
    expect(gone.id).to.be.a('number');
    stock = await createStockSet(ctx.db);
  });

  beforeEach(async () => {
    await ctx.db('mail_outbox').delete();
  });

  /** A draft by the author, also saved by the co-author and the quiet author (all three are its editors). */
  async function draftEditedByThree(title: string): Promise<RecipeVersionDto> {
    let v = await createDraft(author, stock, { title });
    v = ok(await act.save(coAuthor, v));
    return ok(await act.save(quietAuthor, v));
  }

  it('mails each approver who could approve a submitted version, and nobody else', async () => {
    const draft = await draftEditedByThree('C45 bar for review mail');
    const submitted = ok(await act.submit(author, draft));

    // Not the co-author (an approver, but an editor of the version), not the one who opted
    // out, not the deactivated approver, not the one without an e-mail, not authors.
    expect(await recipientsOf(ctx.db, 'review-requested')).to.deep.equal([approver.person.username, approverAuthor.person.username].map(addressOf).sort());
    for (const mail of await mailsOf(ctx.db, 'review-requested')) {
      expectMail(mail, {
        subject: `Review requested: ${submitted.number} v1 "C45 bar for review mail"`,
        path: `/recipes/${submitted.recipeId}/review`,
        optional: true,
      });
      expect(mail.text_body).to.contain('Ines Author sent');
    }
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(2);
  });

  it('mails the version’s authors the comment when it is returned, with a link to edit it', async () => {
    const submitted = ok(await act.submit(author, await draftEditedByThree('Returned mail')));
    await ctx.db('mail_outbox').delete();
    ok(await act.return(approver, submitted, 'Give the clamp distance <in mm> & the side.'));

    // The editors with the author role, less the one who turned review outcomes off.
    expect(await recipientsOf(ctx.db, 'review-outcome')).to.deep.equal([author.person.username, coAuthor.person.username].map(addressOf).sort());
    for (const mail of await mailsOf(ctx.db, 'review-outcome')) {
      expectMail(mail, { subject: `Returned to you: ${submitted.number} v1 "Returned mail"`, path: `/recipes/${submitted.recipeId}/edit`, optional: true });
      expect(mail.text_body).to.contain('Give the clamp distance <in mm> & the side.');
      expect(mail.text_body).to.contain('Tomas Approver returned');
      // The HTML part escapes the comment.
      expect(mail.html_body).to.contain('Give the clamp distance &lt;in mm&gt; &amp; the side.');
    }
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(2);
  });

  it('mails the version’s authors when it is approved, with a link to that version', async () => {
    const submitted = ok(await act.submit(author, await draftEditedByThree('Approved mail')));
    await ctx.db('mail_outbox').delete();
    const done = ok(await act.approve(approver, submitted));
    expect(done.status).to.equal('approved');

    expect(await recipientsOf(ctx.db, 'review-outcome')).to.deep.equal([author.person.username, coAuthor.person.username].map(addressOf).sort());
    for (const mail of await mailsOf(ctx.db, 'review-outcome')) {
      expectMail(mail, { subject: `Approved: ${done.number} v1 "Approved mail"`, path: `/recipes/${done.recipeId}?v=1`, optional: true });
      expect(mail.text_body).to.contain('It is in use from today.');
    }
  });

  it('enqueues nothing for a refused transition', async () => {
    const draft = await draftEditedByThree('Refused mail');
    // Stale revision: 409, no review request.
    expect((await act.submit(author, draft, { revision: draft.revision - 1 })).status).to.equal(409);
    const submitted = ok(await act.submit(author, draft));
    await ctx.db('mail_outbox').delete();

    // An editor may not approve: 403 and no mail to anyone.
    expect((await act.approve(coAuthor, submitted)).status).to.equal(403);
    // Wrong password: 400.
    expect((await act.approve(approver, submitted, { password: 'not the password' })).status).to.equal(400);
    // Stale revisions: 409.
    expect((await act.approve(approver, submitted, { revision: submitted.revision + 5 })).status).to.equal(409);
    expect((await act.return(approver, submitted, 'Stale.', { revision: submitted.revision + 5, comment: 'Stale.' })).status).to.equal(409);
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(0);
  });

  it('sends nothing to people who opted out or were deactivated after they edited', async () => {
    const loner = await sessionFor(ctx.app, ctx.db, ['author'], 'Loner Author');
    const v = await createDraft(loner, stock, { title: 'Lonely draft' });
    const submitted = ok(await act.submit(loner, v));
    await ctx.db('users').where({ id: loner.person.id }).update({ active: false });
    await ctx.db('mail_outbox').delete();
    ok(await act.return(approver, submitted, 'Nobody reads this.'));
    expect(await countRows(ctx.db, 'mail_outbox')).to.equal(0);
  });
});
