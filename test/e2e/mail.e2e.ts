/// <reference lib="dom" />
/**
 * Mail in chromium, through the real SMTP path: the server's worker sends to the local mail
 * catcher that `npm test` started, and these journeys follow the links in what it caught.
 * - A new version of a bench-saw recipe becomes current; the operator of that saw follows
 *   the mail's link, signs in and acknowledges it; the approver sees the acknowledgement.
 * - An admin invites a newcomer; the newcomer follows the link, sets a password and signs
 *   in; the same link then no longer works.
 */
import { expect } from 'chai';
import type { Browser } from 'playwright-core';
import type { Page as ListPage, UserDto } from '../../shared/api-types';
import type { AcknowledgementsDto, RecipeSummary, RecipeVersionDto } from '../../shared/recipe-types';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { apiSignIn } from './support/api';
import { BASE_URL, type WatchedPage, launch, openPage, screenshot } from './support/browser';
import { linkIn, waitForMail } from './support/mailbox';
import { demoAdmin, signIn, unexpectedErrors } from './support/steps';

const author = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'))!;
const approver = DEMO_ACCOUNTS.find((a) => a.roles.includes('approver'))!;
const operator = DEMO_ACCOUNTS.find((a) => a.roles.includes('operator'))!;
// KB-0003 (X153CrMoV12 block, bench saw) is current in the demo data; the demo operator runs
// the bench saw. No other journey touches it.
const NUMBER = 'KB-0003';

describe('mail links in chromium', () => {
  let browser: Browser;
  let w: WatchedPage;

  before(async () => {
    browser = await launch();
  });
  after(async () => {
    await browser?.close();
  });
  beforeEach(async () => {
    w = await openPage(browser, { width: 1024, height: 768 });
  });
  afterEach(async () => {
    expect(unexpectedErrors(w.consoleErrors), 'console errors').to.deep.equal([]);
    expect(w.foreignRequests, 'requests outside the app').to.deep.equal([]);
    await w.page.context().close();
  });

  it('a version becomes current; the operator follows the mail link and acknowledges it', async () => {
    // The author starts version 2 and submits it; the approver signs it, effective today.
    const asAuthor = await apiSignIn(author.username, author.password);
    const found = await asAuthor.get<ListPage<RecipeSummary>>(`/api/recipes?q=${NUMBER}`);
    const recipe = found.items.find((r) => r.number === NUMBER)!;
    expect(recipe, NUMBER).to.exist;
    const draft = await asAuthor.post<RecipeVersionDto>(`/api/recipes/${recipe.id}/versions`, {
      fromVersion: recipe.version,
      changeReason: 'Entry feed halved for the first 3 mm after edge chipping on block 88.',
    });
    await asAuthor.post(`/api/recipes/${recipe.id}/versions/${draft.version}/submit`, { revision: draft.revision });
    await asAuthor.close();

    const asApprover = await apiSignIn(approver.username, approver.password);
    const inReview = await asApprover.get<RecipeVersionDto>(`/api/recipes/${recipe.id}/versions/${draft.version}`);
    await asApprover.post(`/api/recipes/${recipe.id}/versions/${draft.version}/approve`, {
      revision: inReview.revision,
      username: approver.username,
      password: approver.password,
      meaning: 'approved',
      acknowledgedWarnings: inReview.checks.filter((c) => c.severity === 'warning').map((c) => c.id),
    });

    // The worker sends the request to acknowledge to the operator of the bench saw.
    const mail = await waitForMail(
      operator.email,
      (m) => m.subject.includes(NUMBER) && m.text.includes(`/recipes/${recipe.id}/acknowledge?v=${draft.version}`),
    );
    expect(mail.html, 'HTML part').to.be.a('string').and.include(NUMBER);
    const link = linkIn(mail, BASE_URL);
    expect(link).to.equal(`${BASE_URL}/recipes/${recipe.id}/acknowledge?v=${draft.version}`);

    // Signed out, the link asks for a sign-in first and then opens the acknowledgement.
    const { page } = w;
    await page.goto(link);
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('Username').fill(operator.username);
    await page.getByLabel('Password', { exact: true }).fill(operator.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/acknowledge/);
    await page
      .getByText(new RegExp(`read and understood.*${NUMBER}|${NUMBER}.*read and understood`, 'i'))
      .first()
      .waitFor();
    await screenshot(page, '60-acknowledge');
    await page.getByRole('button', { name: /^Acknowledge/ }).click();
    // The confirmation names this version ("Since version 1, which you acknowledged …" is on the page before).
    await page.getByText(new RegExp(`You acknowledged version ${draft.version} of ${NUMBER}`)).waitFor();

    const acks = await asApprover.get<AcknowledgementsDto>(`/api/recipes/${recipe.id}/versions/${draft.version}/acknowledgements`);
    expect(acks.acknowledged.map((a) => a.displayName)).to.include(operator.displayName);
    expect(acks.pending.map((p) => p.displayName)).to.not.include(operator.displayName);
    await asApprover.close();
  });

  it('an invited newcomer follows the mail link, sets a password and signs in; the link then fails', async () => {
    const username = `e2e.newcomer.${Date.now().toString(36)}`;
    const email = `${username}@harrowgate.example`;
    const asAdmin = await apiSignIn(demoAdmin.username, demoAdmin.password);
    const invited = await asAdmin.post<UserDto>('/api/users/invitations', { username, displayName: 'Mira Solberg', email, roles: ['auditor'], machineIds: [] });
    expect(invited.invitationPending).to.equal(true);

    const mail = await waitForMail(email, (m) => /invit/i.test(m.subject));
    const link = linkIn(mail, BASE_URL);
    expect(link).to.match(new RegExp(`^${BASE_URL.replace(/[.]/g, '\\.')}/set-password\\?token=[A-Za-z0-9_-]{43}$`));

    const { page } = w;
    const password = 'newcomer-password-2026';
    await page.goto(link);
    await page
      .getByText(/Mira Solberg/)
      .first()
      .waitFor();
    await screenshot(page, '61-set-password');
    await page.getByLabel(/^New password/).fill(password);
    await page.getByLabel(/^Repeat/).fill(password);
    await page.getByRole('button', { name: /Set password/i }).click();
    await page.waitForURL(/\/sign-in/);
    await signIn(page, username, password);
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));

    const after = await asAdmin.get<UserDto>(`/api/users/${invited.id}`);
    expect(after.invitationPending).to.equal(false);
    await asAdmin.close();

    // Single use: the same link now says so.
    const again = await browser.newPage();
    await again.goto(link);
    await again
      .getByText(/already (been )?used/i)
      .first()
      .waitFor();
    await again.close();
  });
});
