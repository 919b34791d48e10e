/// <reference lib="dom" />
/**
 * The foundation as people meet it: sign-in, the shell by role, the People screen, the
 * forced change of a temporary password, deactivation — in Debian's chromium against the
 * built app served by the real server and MariaDB with the demo data.
 */
import { expect } from 'chai';
import type { Browser } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { BASE_URL, type WatchedPage, launch, openPage, screenshot } from './support/browser';
import { demoAdmin, dialogSettled, navEntries, signIn, signInAsAdmin, signOut, unexpectedErrors } from './support/steps';

const operator = DEMO_ACCOUNTS.find((a) => a.roles.includes('operator'))!;
// Unique per run so the journey can run again on the same database.
const stamp = Date.now().toString(36);
const newcomer = { username: `e2e.${stamp}`, name: `Mila Sørensen ${stamp}`, temporary: 'Temporär-Passwort-42', own: 'Mein-eigenes-Passwort-7' };

describe('foundation in chromium', () => {
  let browser: Browser;
  let w: WatchedPage;

  before(async () => {
    browser = await launch();
  });
  after(async () => {
    await browser?.close();
  });
  beforeEach(async () => {
    w = await openPage(browser);
  });
  afterEach(async () => {
    await w.page.context().close();
  });

  it('shows the sign-in page with its own fonts and icons, no external host and no CSP violation', async () => {
    const { page } = w;
    await page.goto(`${BASE_URL}/`);
    await page.waitForURL(/\/sign-in/);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    await page.evaluate(() => document.fonts.ready);
    const fonts = await page.evaluate(() => ({
      roboto: document.fonts.check('16px Roboto'),
      icons: document.fonts.check('24px "Material Icons"'),
    }));
    await screenshot(page, '01-sign-in');
    expect(fonts.roboto, 'Roboto loaded').to.equal(true);
    expect(fonts.icons, 'icon font loaded').to.equal(true);
    expect(w.foreignRequests, 'requests to other hosts').to.deep.equal([]);
    expect(unexpectedErrors(w.consoleErrors), 'console errors').to.deep.equal([]);
  });

  it('refuses a wrong password with a clear message and stays on sign-in', async () => {
    const { page } = w;
    await signIn(page, demoAdmin.username, 'not-the-password');
    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(await alert.innerText()).to.match(/username or password/i);
    expect(page.url()).to.match(/\/sign-in/);
  });

  it('lets the admin in: Today greets them, the navigation offers People', async () => {
    const { page } = w;
    await signInAsAdmin(page);
    await page.getByRole('heading', { name: new RegExp(demoAdmin.displayName) }).waitFor();
    expect(await navEntries(page)).to.include.members(['Today', 'People', 'My account']);
    await screenshot(page, '02-today-admin');
    expect(unexpectedErrors(w.consoleErrors)).to.deep.equal([]);
  });

  it('lands an operator on the Finder, shows them no People entry and keeps them out of /people', async () => {
    const { page } = w;
    await signIn(page, operator.username, operator.password);
    // Operators start at the Finder, not at Today.
    await page.waitForURL(/\/finder/);
    const entries = await navEntries(page);
    expect(entries).to.include('Today');
    expect(entries).to.not.include('People');
    await page.goto(`${BASE_URL}/people`);
    await page.waitForURL((url) => !url.pathname.startsWith('/people'));
    expect(await page.getByRole('table', { name: 'People' }).count()).to.equal(0);
  });

  it('admin adds a person; the person must replace the temporary password, then sees their roles', async () => {
    const { page } = w;
    await signInAsAdmin(page);
    await page
      .getByRole('navigation', { name: 'Sections' })
      .getByRole('link', { name: /People/ })
      .click();
    // The table shows before its rows arrive: wait for a demo person's row before counting.
    await page.getByRole('table', { name: 'People' }).getByRole('cell', { name: operator.username, exact: true }).waitFor();
    expect(await page.getByRole('row').count(), 'header + demo people').to.be.greaterThan(DEMO_ACCOUNTS.length);
    await screenshot(page, '03-people');

    await page.getByRole('button', { name: 'Add person' }).click();
    const dialog = page.getByRole('dialog');
    await dialogSettled(page);
    await dialog.getByLabel('Username', { exact: true }).fill(newcomer.username);
    await dialog.getByLabel('Name', { exact: true }).fill(newcomer.name);
    await dialog.getByRole('checkbox', { name: /Operator/ }).check();
    await dialog.getByRole('checkbox', { name: /Author/ }).check();
    await dialog.getByLabel('Temporary password').fill(newcomer.temporary);
    await screenshot(page, '04-add-person');
    await dialog.getByRole('button', { name: 'Add person' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('cell', { name: newcomer.username }).waitFor();
    await signOut(page, demoAdmin.displayName);

    await signIn(page, newcomer.username, newcomer.temporary);
    await page.waitForURL(/\/account/);
    await page.getByLabel('Current password').fill(newcomer.temporary);
    await page.getByLabel('New password', { exact: true }).fill(newcomer.own);
    await page.getByLabel('Repeat new password').fill(newcomer.own);
    await screenshot(page, '05-change-temporary-password');
    await page.getByRole('button', { name: 'Change password' }).click();
    await page.waitForURL(/\/today/);
    await page.getByRole('heading', { name: new RegExp(newcomer.name) }).waitFor();
    // Today's role lists arrive after its heading: wait for them (a timeout fails the test).
    await page.getByText('Operator').first().waitFor();
    await page.getByText('Author').first().waitFor();
    expect(await navEntries(page)).to.not.include('People');
    await signOut(page, newcomer.name);

    // The temporary password no longer works; the new one does.
    await signIn(page, newcomer.username, newcomer.temporary);
    await page.getByRole('alert').waitFor();
    expect(page.url()).to.match(/\/sign-in/);
  });

  it('admin deactivates the person; they can no longer sign in and stay in the list as inactive', async () => {
    const { page } = w;
    await signInAsAdmin(page);
    await page.goto(`${BASE_URL}/people`);
    await page.getByRole('cell', { name: newcomer.username }).waitFor();
    await page.getByRole('button', { name: `Actions for ${newcomer.name}` }).click();
    await page.getByRole('menuitem', { name: /Deactivate/ }).click();
    const confirm = page.getByRole('dialog');
    await confirm.getByRole('button', { name: /Deactivate/ }).click();
    await confirm.waitFor({ state: 'detached' });
    await signOut(page, demoAdmin.displayName);

    await signIn(page, newcomer.username, newcomer.own);
    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(await alert.innerText()).to.match(/deactivated/i);
  });
});
