/// <reference lib="dom" />
/**
 * The operator station in chromium: an operator finds the recipe for a part, opens it,
 * downloads its bench sheet, logs a cut that came out burnt; the author then sees the flag.
 */
import { expect } from 'chai';
import fs from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { BASE_URL, SHOTS_DIR, type WatchedPage, launch, openPage, screenshot } from './support/browser';
import { choose, signIn, signOut } from './support/steps';

const operator = DEMO_ACCOUNTS.find((a) => a.roles.includes('operator'))!;
const author = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'))!;
const specimen = `E2E-${Date.now().toString(36).toUpperCase()}`;
// KB-0001 (C45 bar, 20–60 mm, floor saw) is approved and current in the demo data.
const NUMBER = 'KB-0001';

describe('operator station in chromium', () => {
  let browser: Browser;
  let w: WatchedPage;

  before(async () => {
    browser = await launch();
    // A tablet at the saw.
    w = await openPage(browser, { width: 1024, height: 768 });
  });
  after(async () => {
    await browser?.close();
  });

  it('operator finds the recipe for a part, opens it and downloads the bench sheet', async () => {
    const { page } = w;
    await signIn(page, operator.username, operator.password);
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    await page.goto(`${BASE_URL}/finder`);
    await choose(page, 'Material group', /Plain and low-alloy steels/);
    await page.getByLabel('Size (mm)').fill('30');
    await page.getByRole('button', { name: /Find/ }).click();
    const open = page.getByRole('link', { name: `Open ${NUMBER}` }).or(page.getByRole('button', { name: `Open ${NUMBER}` }));
    await open.first().waitFor();
    const results = await page.locator('section.kb-results').innerText();
    expect(results).to.match(/Size 30 mm within 20/);
    await screenshot(page, '30-finder-tablet');
    await open.first().click();
    await page.waitForURL(/\/recipes\/\d+/);

    const href = await page.getByTestId('print-sheet').getAttribute('href');
    expect(href, 'sheet link').to.match(/\/sheet\.pdf$/);
    const sheet = await page.request.get(new URL(href!, BASE_URL).toString());
    expect(sheet.status()).to.equal(200);
    expect(sheet.headers()['content-type']).to.match(/application\/pdf/);
    const bytes = await sheet.body();
    expect(bytes.subarray(0, 5).toString()).to.equal('%PDF-');
    fs.mkdirSync(SHOTS_DIR, { recursive: true });
    fs.writeFileSync(path.join(SHOTS_DIR, 'bench-sheet.pdf'), bytes);
  });

  it('operator logs a burnt cut against the version used', async () => {
    const { page } = w;
    await page.getByRole('button', { name: 'Log a cut' }).first().click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Specimen id').fill(specimen);
    await dialog.getByLabel('Part / lot / heat').fill('Heat 4471-B');
    await dialog.getByRole('radio', { name: /Discoloured or burnt/ }).check();
    await dialog.getByLabel('Notes').fill('Temper colours near the centre of the face.');
    await screenshot(page, '31-log-cut');
    await dialog.getByRole('button', { name: 'Save the cut' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('tab', { name: /Cuts/ }).click();
    await page.getByRole('tabpanel').getByText(specimen).waitFor();
    await signOut(page, operator.displayName);
  });

  it('the author sees the flagged cut on Today', async () => {
    const { page } = w;
    await signIn(page, author.username, author.password);
    await page.waitForURL(/\/today/);
    const flagged = page.locator('[data-list="flaggedCuts"]');
    await flagged.getByText(NUMBER).first().waitFor();
    expect(await flagged.innerText()).to.match(/flagged/i);
    await screenshot(page, '32-author-today-flag');
  });
});
