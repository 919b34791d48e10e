/// <reference lib="dom" />
/**
 * The review workflow in chromium, as an author and an approver do it: the author
 * starts version 2 of an approved recipe and submits it, the approver returns it with a
 * comment, the author fixes it and submits again, the approver signs; version 2 becomes
 * current and version 1 is superseded.
 */
import { expect } from 'chai';
import type { Browser, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { BASE_URL, type WatchedPage, launch, openPage, screenshot } from './support/browser';
import { signIn, signOut } from './support/steps';

const author = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'))!;
const approver = DEMO_ACCOUNTS.find((a) => a.roles.includes('approver'))!;
// An approved demo recipe nobody else's journey touches.
const NUMBER = 'KB-0007';

async function openRecipe(page: Page): Promise<void> {
  await page.goto(`${BASE_URL}/library?q=${NUMBER}`);
  await page.getByRole('link', { name: NUMBER, exact: true }).click();
  await page.waitForURL(/\/recipes\/\d+(\?.*)?$/);
}

async function waitSaved(page: Page): Promise<void> {
  await page.waitForFunction(() => /^Saved/.test(document.querySelector('[data-testid="save-status"]')?.textContent?.trim() ?? ''));
}

describe('review workflow in chromium', () => {
  let browser: Browser;
  let w: WatchedPage;

  before(async () => {
    browser = await launch();
    w = await openPage(browser, { width: 1440, height: 1000 });
  });
  after(async () => {
    await browser?.close();
  });

  it('author drafts and submits; approver returns with a comment', async () => {
    const { page } = w;
    await signIn(page, author.username, author.password);
    await page.waitForURL(/\/today/);
    await openRecipe(page);
    await page.getByRole('button', { name: 'Start a new version' }).click();
    await page.getByRole('dialog').getByLabel('Change reason').fill('Lower feed after burn marks on thin sections.');
    await page.getByRole('button', { name: 'Start the new version' }).click();
    await page.waitForURL(/\/recipes\/\d+\/edit/);
    await page.getByLabel('Feed', { exact: true }).fill('0.35');
    await page.getByRole('button', { name: 'Save draft' }).click();
    await waitSaved(page);
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.waitForURL(/\/recipes\/\d+(\?.*)?$/);
    await page
      .getByText(/In review/i)
      .first()
      .waitFor();
    await signOut(page, author.displayName);

    await signIn(page, approver.username, approver.password);
    await page.waitForURL(/\/today/);
    await openRecipe(page);
    await page.getByRole('link', { name: 'Review' }).click();
    await page.waitForURL(/\/review/);
    await screenshot(page, '20-review');
    await page.getByRole('button', { name: 'Return with comments' }).click();
    await page.getByLabel('Comment for the author').fill('Give the entry feed for the first 2 mm as well.');
    await page.getByRole('button', { name: 'Return to author' }).click();
    await page
      .getByText(/Returned/i)
      .first()
      .waitFor();
    await signOut(page, approver.displayName);
  });

  it('author sees the comment, fixes the draft and submits again', async () => {
    const { page } = w;
    await signIn(page, author.username, author.password);
    await page.waitForURL(/\/today/);
    await openRecipe(page);
    await page.getByText('Give the entry feed for the first 2 mm as well.').first().waitFor();
    await page.getByRole('link', { name: 'Edit draft' }).click();
    await page.waitForURL(/\/edit/);
    await page.getByLabel('Entry feed (optional)').fill('0.2');
    await page.getByLabel('Entry length (optional)').fill('2');
    await page.getByRole('button', { name: 'Save draft' }).click();
    await waitSaved(page);
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.waitForURL(/\/recipes\/\d+(\?.*)?$/);
    await page
      .getByText(/In review/i)
      .first()
      .waitFor();
    await signOut(page, author.displayName);
  });

  it('approver signs: version 2 is current, version 1 superseded, the signature shown', async () => {
    const { page } = w;
    await signIn(page, approver.username, approver.password);
    await page.waitForURL(/\/today/);
    await openRecipe(page);
    await page.getByRole('link', { name: 'Review' }).click();
    await page.waitForURL(/\/review/);
    // The checks and the buttons render together: wait for them before ticking the warnings.
    await page.getByRole('button', { name: 'Approve…' }).waitFor();
    for (const box of await page.getByRole('checkbox', { name: 'I have considered this warning' }).all()) await box.check();
    await page.getByRole('button', { name: 'Approve…' }).click();
    const dialog = page.getByRole('dialog');
    // The first signing in this session takes both signature components (21 CFR 11.200(a)(1)(i)).
    await dialog.getByLabel('Username', { exact: true }).fill(approver.username);
    await dialog.getByLabel('Password', { exact: true }).fill('not-my-password');
    await dialog.getByRole('button', { name: 'Sign and approve' }).click();
    await dialog.getByText('The password is not correct.', { exact: false }).waitFor();
    expect(await dialog.isVisible(), 'a wrong password keeps the dialog open').to.equal(true);
    await dialog.getByLabel('Password', { exact: true }).fill(approver.password);
    await screenshot(page, '21-signature-dialog');
    await dialog.getByRole('button', { name: 'Sign and approve' }).click();
    await dialog.waitFor({ state: 'detached' });

    await openRecipe(page);
    const signature = page.getByText(new RegExp(`Approved by ${approver.displayName}`)).first();
    await signature.waitFor();
    await screenshot(page, '22-approved-recipe');
    await page.getByRole('tab', { name: /History/ }).click();
    const history = page.getByRole('tabpanel');
    await history
      .getByText(/Superseded/i)
      .first()
      .waitFor();
    const text = await history.innerText();
    expect(text).to.match(/Superseded/i);
    expect(text).to.match(/Lower feed after burn marks/);
    await screenshot(page, '23-history');
  });
});
