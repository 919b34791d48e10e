/// <reference lib="dom" />
/**
 * Decimal signs in a German and an English browser. A number field of type "number" read
 * the other locale's decimal sign as a thousands separator and dropped it: "0,3" mm/s became
 * 3 mm/s in an English browser, "0.3" became 3 in a German one. Every number field now takes
 * a comma or a point as the decimal sign, and refuses "1.000,5" with a message instead of
 * guessing. Each locale types the sign its browser used to drop.
 */
import { expect } from 'chai';
import type { Browser, Page } from 'playwright-core';
import type { MachineRecord } from '../../shared/stock-types';
import type { RecipeVersionDto } from '../../shared/recipe-types';
import type { Page as ListPage } from '../../shared/api-types';
import type { LabSettingsDto } from '../../shared/schemas/lab-settings';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { type ApiSession, apiSignIn } from './support/api';
import { BASE_URL, launch, screenshot } from './support/browser';
import { choose, demoAdmin, dialogSettled, signIn, signInAsAdmin } from './support/steps';

const author = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'))!;

/** Types as a person does, key by key (a fill would bypass the browser's number parsing). */
async function type(page: Page, label: string, text: string): Promise<void> {
  const field = page.getByLabel(label, { exact: true });
  await field.clear();
  await field.pressSequentially(text);
  await field.press('Tab');
}

const LOCALES = [
  // [locale, the sign that browser used to drop, its own decimal sign]
  { locale: 'de-DE', foreign: '.', own: ',' },
  { locale: 'en-GB', foreign: ',', own: '.' },
];

describe('decimal signs in number fields (chromium, German and English locales)', () => {
  let browser: Browser;
  let api: ApiSession;

  before(async () => {
    browser = await launch();
    api = await apiSignIn(author.username, author.password);
  });
  after(async () => {
    await api?.close();
    await browser?.close();
  });

  for (const { locale, foreign, own } of LOCALES) {
    describe(locale, () => {
      let page: Page;
      before(async () => {
        const context = await browser.newContext({ locale, viewport: { width: 1440, height: 1000 } });
        page = await context.newPage();
        await signIn(page, author.username, author.password);
        await page.waitForURL(/\/today/);
      });
      after(() => page?.context().close());

      it(`the editor saves feed 0${foreign}3 as 0.3 mm/s and concentration 2${own}5 as 2.5 %, and refuses 1.000,5`, async () => {
        expect(await page.evaluate(() => navigator.language)).to.equal(locale);
        await page.goto(`${BASE_URL}/recipes/new`);
        await page.getByLabel('Title', { exact: true }).fill(`Decimal signs ${locale} (e2e ${Date.now().toString(36)})`);
        await choose(page, 'Material', /Alumina 99\.5/);
        await type(page, 'Smallest size', '5');
        await choose(page, 'Machine', /Clean-room precision saw/);
        await choose(page, 'Wheel', /Diamond rim 200/);
        await choose(page, 'Clamping method', /Adhesive or wax mount/);
        await type(page, 'Wheel speed', '3000');
        await type(page, 'Feed', `0${foreign}3`);
        await type(page, 'Concentration', `2${own}5`);
        await page.getByLabel('Steps for the operator').fill('1. Mount the rod in wax.');

        // Ambiguous: refused with its reason, and nothing is created.
        await type(page, 'Largest size', '1.000,5');
        await page.getByText(/"1\.000,5" has more than one point or comma/).waitFor();
        await screenshot(page, `decimal-refused-${locale}`);
        await page.getByRole('button', { name: 'Create draft' }).click();
        await page.getByTestId('form-error').waitFor();
        expect(page.url()).to.match(/\/recipes\/new$/);

        await type(page, 'Largest size', `20${own}5`);
        await page.getByRole('button', { name: 'Create draft' }).click();
        await page.waitForURL(/\/recipes\/\d+\/edit/);
        const recipeId = Number(/\/recipes\/(\d+)\/edit/.exec(page.url())![1]);
        const saved = await api.get<RecipeVersionDto>(`/api/recipes/${recipeId}/versions/1`);
        expect(saved.content.cutting.feedMmS).to.equal(0.3);
        expect(saved.content.coolant.concentrationPct).to.equal(2.5);
        expect(saved.content.scope.sizeMaxMm).to.equal(20.5);
        // Shown back with the browser's own decimal sign.
        expect(await page.getByLabel('Feed', { exact: true }).inputValue()).to.equal(`0${own}3`);
      });

      it(`a stock dialog saves motor power 2${foreign}25 as 2.25 kW and 2${own}2 as 2.2 kW`, async () => {
        const motorPower = async (typed: string) => {
          await page.goto(`${BASE_URL}/stock/machines`);
          await page.getByRole('button', { name: 'Actions for Bay 2 bench saw' }).click();
          await page.getByRole('menuitem', { name: 'Edit' }).click();
          await dialogSettled(page);
          await type(page, 'Motor power', typed);
          await page.getByRole('button', { name: 'Save changes' }).click();
          await page.getByRole('dialog').waitFor({ state: 'detached' });
          const machines = await api.get<ListPage<MachineRecord>>('/api/machines?pageSize=100');
          return machines.items.find((m) => m.name === 'Bay 2 bench saw')?.motorPowerKw;
        };
        expect(await motorPower(`2${foreign}25`)).to.equal(2.25);
        // Back to the demo's 2.2 kW, with the browser's own sign.
        expect(await motorPower(`2${own}2`)).to.equal(2.2);
      });

      it(`the lab settings save kerf allowance 0${foreign}35 mm, worn share 0${own}65, an energy of 7${foreign}5 J/mm³ and a feed ceiling of 0${foreign}45 mm/s`, async () => {
        const asAdmin = await apiSignIn(demoAdmin.username, demoAdmin.password);
        const before = await asAdmin.get<LabSettingsDto>('/api/settings/lab');
        const context = await browser.newContext({ locale, viewport: { width: 1440, height: 1000 } });
        const adminPage = await context.newPage();
        try {
          await signInAsAdmin(adminPage);
          await adminPage.goto(`${BASE_URL}/lab-settings`);
          await adminPage.getByLabel('Lab name').waitFor();
          await type(adminPage, 'Kerf allowance (mm)', `0${foreign}35`);
          await type(adminPage, 'Worn wheel: share of the new diameter', `0${own}65`);
          await type(adminPage, 'Specific cutting energy, Copper alloys', `7${foreign}5`);
          await choose(adminPage, 'Material group', /^Copper alloys/);
          await choose(adminPage, 'Machine class', /precision/i);
          await type(adminPage, 'Highest feed (mm/s)', `0${foreign}45`);
          await adminPage.getByRole('button', { name: 'Add', exact: true }).click();
          await adminPage.getByRole('button', { name: 'Save settings' }).click();
          // Either outcome ends the wait; the values read back below say which it was.
          await adminPage
            .getByText('The lab settings have been saved.')
            .or(adminPage.getByText(/Nothing was saved/))
            .first()
            .waitFor();
          await screenshot(adminPage, `decimal-lab-settings-${locale}`);

          const saved = await asAdmin.get<LabSettingsDto>('/api/settings/lab');
          expect(saved.revision, 'a save went through').to.equal(before.revision + 1);
          expect(saved.kerfAllowanceMm).to.equal(0.35);
          expect(saved.wornDiameterShare).to.equal(0.65);
          expect(saved.specificEnergyJMm3.copper).to.equal(7.5);
          const added = saved.feedCeilings.filter((c) => !before.feedCeilings.some((b) => JSON.stringify(b) === JSON.stringify(c)));
          expect(added.map((c) => [c.group, c.maxFeedMmS])).to.deep.equal([['copper', 0.45]]);
          // Shown back with the browser's own decimal sign.
          expect(await adminPage.getByLabel('Kerf allowance (mm)', { exact: true }).inputValue()).to.equal(`0${own}35`);
        } finally {
          // Back as they were, so the file runs again.
          const now = await asAdmin.get<LabSettingsDto>('/api/settings/lab');
          const { updatedAt: _at, ...values } = before;
          await asAdmin.put('/api/settings/lab', { ...values, revision: now.revision });
          await context.close();
          await asAdmin.close();
        }
      });
    });
  }
});
