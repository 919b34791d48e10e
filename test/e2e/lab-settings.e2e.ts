/**
 * Lab settings as an admin changes them: the date format shows at once, the bench sheet
 * comes out on the chosen paper, bad input is refused with its message and saves nothing,
 * and only admins find the screen. Puts the settings back at the end, so it runs again.
 */
/// <reference lib="dom" />
import { expect } from 'chai';
import type { Browser, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { BASE_URL, type WatchedPage, launch, openPage, screenshot } from './support/browser';
import { choose, navEntries, signIn, signInAsAdmin, unexpectedErrors } from './support/steps';

const author = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'))!;

/** The page size of a PDF's first page, points (pdfkit writes it uncompressed). */
function mediaBox(pdf: Buffer): string | undefined {
  return /\/MediaBox \[([^\]]+)\]/.exec(pdf.toString('latin1'))?.[1]?.trim();
}

async function sheetOfKb0001(page: Page): Promise<Buffer> {
  const list = await page.request.get(`${BASE_URL}/api/recipes?q=KB-0001`);
  const id = ((await list.json()) as { items: { id: number; number: string }[] }).items.find((r) => r.number === 'KB-0001')!.id;
  const sheet = await page.request.get(`${BASE_URL}/api/recipes/${id}/versions/1/sheet.pdf`);
  expect(sheet.status()).to.equal(200);
  return sheet.body();
}

async function openSettings(page: Page): Promise<void> {
  await page
    .getByRole('navigation', { name: 'Sections' })
    .getByRole('link', { name: /Lab settings/ })
    .click();
  await page.getByRole('heading', { name: 'Lab settings', level: 1 }).waitFor();
  await page.getByLabel('Lab name').waitFor();
}

async function saveAndWait(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Save settings' }).click();
  try {
    await page.getByText('The lab settings have been saved.').waitFor();
  } catch (e) {
    await screenshot(page, 'lab-settings-failed');
    throw e;
  }
}

describe('lab settings in chromium', () => {
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

  it('lets an admin change the date format and the paper, and both take effect', async function () {
    // Two sheets, three saves: more than one step's time on a loaded machine.
    this.timeout(180_000);
    const { page, consoleErrors } = w;
    await signInAsAdmin(page);
    expect(mediaBox(await sheetOfKb0001(page))).to.equal('0 0 595.28 841.89');

    await openSettings(page);
    await page.getByText(/last changed \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC/).waitFor();

    // Bad input: a message under the field, nothing saved.
    await page.getByLabel('Periodic review interval (months)').fill('0');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Review interval must be at least 1 month.').waitFor();
    await page.getByText(/Nothing was saved/).waitFor();
    const still = await page.request.get(`${BASE_URL}/api/settings/lab`);
    expect(((await still.json()) as { reviewIntervalMonths: number }).reviewIntervalMonths).to.equal(24);

    await page.getByLabel('Periodic review interval (months)').fill('24');
    await choose(page, 'Date format', /05\.12\.2026/);
    await choose(page, 'Bench sheet paper', /US Letter/);
    await saveAndWait(page);
    await page.getByText(/last changed \d{2}\.\d{2}\.\d{4} \d{2}:\d{2} UTC/).waitFor();
    await screenshot(page, 'lab-settings');

    // The sheet now comes out on US Letter (612 × 792 pt).
    expect(mediaBox(await sheetOfKb0001(page))).to.equal('0 0 612 792');

    // Back as they were, through the same screen.
    await choose(page, 'Date format', /2026-12-05/);
    await choose(page, 'Bench sheet paper', /^A4/);
    await saveAndWait(page);
    await page.getByText(/last changed \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC/).waitFor();
    expect(unexpectedErrors(consoleErrors)).to.deep.equal([]);
  });

  for (const viewport of [
    { width: 1280, height: 800 },
    { width: 800, height: 1100 },
  ]) {
    it(`shows every field label whole at ${viewport.width} px wide (none cut short with an ellipsis)`, async () => {
      const { page } = await openPage(browser, viewport);
      try {
        await signInAsAdmin(page);
        await page.goto(`${BASE_URL}/lab-settings`);
        await page.getByLabel('Lab name').waitFor();
        const labels = await page
          .locator('mat-form-field .mdc-floating-label')
          .evaluateAll((els) => els.map((el) => ({ text: el.textContent?.trim() ?? '', clipped: el.scrollWidth > el.clientWidth })));
        expect(labels.map((l) => l.text)).to.include.members(['Hardness from', 'Highest feed (mm/s)', 'Worn wheel: share of the new diameter']);
        expect(labels.filter((l) => l.clipped).map((l) => l.text)).to.deep.equal([]);
        await page.getByRole('group', { name: 'Add a ceiling' }).scrollIntoViewIfNeeded();
        await screenshot(page, `lab-settings-labels-${viewport.width}`);
      } finally {
        await page.context().close();
      }
    });
  }

  it('is not offered to an author, and its address answers "not allowed"', async () => {
    const { page } = w;
    await signIn(page, author.username, author.password);
    await page.waitForURL(/\/today/);
    expect(await navEntries(page)).to.not.include('Lab settings');
    await page.goto(`${BASE_URL}/lab-settings`);
    await page.waitForURL(/\/not-allowed/);
  });
});
