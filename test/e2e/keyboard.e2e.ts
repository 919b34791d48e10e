/// <reference lib="dom" />
/**
 * The keyboard alone: an author signs in, opens the library from the navigation, starts a
 * new recipe, fills its required fields, creates the draft and submits it for review —
 * Tab, Shift+Tab, Enter, Space, arrow keys and typing only (no clicks, no programmatic
 * focus). Locators only assert where the focus is and what the page shows. The server
 * then has the version in review with what was typed. The approver then opens it from
 * Today and signs it in the signature dialog, whose focus trap holds, with the keyboard too.
 */
import { expect } from 'chai';
import type { Browser, Page } from 'playwright-core';
import type { RecipeVersionDto } from '../../shared/recipe-types';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { apiSignIn } from './support/api';
import { BASE_URL, type WatchedPage, launch, openPage, screenshot } from './support/browser';
import { hasFocus, selectByKeys, tabTo, typeInto } from './support/keyboard';
import { unexpectedErrors } from './support/steps';

const author = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'))!;
const approver = DEMO_ACCOUNTS.find((a) => a.roles.includes('approver'))!;
const title = `Alumina tube, keyboard only (e2e ${Date.now().toString(36)})`;

async function waitSaved(page: Page): Promise<void> {
  await page.waitForFunction(() => /^Saved/.test(document.querySelector('[data-testid="save-status"]')?.textContent?.trim() ?? ''));
}

describe('keyboard only in chromium', () => {
  let browser: Browser;
  let w: WatchedPage;
  /** The recipe the author submits; the approver signs it in the second journey. */
  let submitted: { recipeId: number; number: string } | null = null;

  before(async () => {
    browser = await launch();
    w = await openPage(browser, { width: 1440, height: 1000 });
  });
  after(async () => {
    await browser?.close();
  });

  it('an author signs in, creates a recipe and submits it for review without the mouse', async () => {
    const { page } = w;
    // Sign in: Tab into the form, type, Enter submits.
    await page.goto(`${BASE_URL}/sign-in`);
    await typeInto(page, page.getByLabel('Username'), author.username);
    await typeInto(page, page.getByLabel('Password', { exact: true }), author.password);
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/today/);

    // The navigation, then the library's "New recipe" link.
    const nav = page.getByRole('navigation', { name: 'Sections' });
    await tabTo(page, nav.getByRole('link', { name: /Library/ }));
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/library/);
    await tabTo(page, page.getByRole('link', { name: /New recipe/ }));
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/recipes\/new/);

    // The required fields, in the order the form offers them.
    await typeInto(page, page.getByLabel('Title', { exact: true }), title);
    await selectByKeys(page, page.getByRole('combobox', { name: 'Material', exact: true }), /Alumina 99\.5/);
    await selectByKeys(page, page.getByRole('combobox', { name: 'Shape', exact: true }), /Tube/i);
    await typeInto(page, page.getByLabel('Smallest size'), '8');
    await typeInto(page, page.getByLabel('Largest size'), '20');
    await typeInto(page, page.getByLabel('Wall thickness'), '2');
    await selectByKeys(page, page.getByRole('combobox', { name: 'Machine', exact: true }), /Clean-room precision saw/);
    await selectByKeys(page, page.getByRole('combobox', { name: 'Wheel', exact: true }), /Diamond rim 200/);
    await typeInto(page, page.getByLabel('Wheel speed'), '3900');
    await typeInto(page, page.getByLabel('Feed', { exact: true }), '0.05');
    await selectByKeys(page, page.getByRole('combobox', { name: 'Clamping method', exact: true }), /Adhesive or wax mount/);
    // A checkbox takes Space.
    const softInserts = page.getByRole('checkbox', { name: 'Soft inserts' });
    expect(await softInserts.isChecked(), 'soft inserts start unticked').to.equal(false);
    await tabTo(page, softInserts);
    await page.keyboard.press('Space');
    expect(await softInserts.isChecked(), 'Space ticks the checkbox').to.equal(true);
    await typeInto(page, page.getByLabel('Concentration'), '3');
    await typeInto(page, page.getByLabel('Steps for the operator'), '1. Mount the tube in wax.\n2. Cut at the marked line.');
    await page.getByTestId('no-blockers').waitFor();

    // Back up to "Create draft" and press it.
    await tabTo(page, page.getByRole('button', { name: 'Create draft' }), { backwards: true, max: 200 });
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/recipes\/\d+\/edit/);
    const recipeId = Number(/\/recipes\/(\d+)\/edit/.exec(page.url())![1]);
    await waitSaved(page);
    await screenshot(page, '40-keyboard-draft');

    // After the navigation the focus starts again from the top; Tab on to the submit button.
    const submit = page.getByRole('button', { name: 'Submit for review' });
    await page.waitForFunction(() => [...document.querySelectorAll('button')].some((b) => /Submit for review/.test(b.textContent ?? '') && !b.disabled));
    await tabTo(page, submit, { max: 200 });
    expect(await hasFocus(submit)).to.equal(true);
    await page.keyboard.press('Enter');
    await page.waitForURL(new RegExp(`/recipes/${recipeId}(\\?.*)?$`));
    await page
      .getByText(/In review/i)
      .first()
      .waitFor();
    // The stock names arrive after the version: the page shows them, not bare ids.
    await page.getByText('Clean-room precision saw').first().waitFor();
    await screenshot(page, '41-keyboard-submitted');

    // The server has the submitted version with what was typed.
    const api = await apiSignIn(author.username, author.password);
    const version = await api.get<RecipeVersionDto>(`/api/recipes/${recipeId}/versions/1`);
    await api.close();
    expect(version.status).to.equal('in-review');
    expect(version.title).to.equal(title);
    expect(version.content.scope.shape).to.equal('tube');
    expect(version.content.scope.sizeMinMm).to.equal(8);
    expect(version.content.scope.wallMm).to.equal(2);
    expect(version.content.cutting.wheelRpm).to.equal(3900);
    expect(version.content.clamping.softInserts).to.equal(true);
    expect(version.content.clamping.method).to.equal('adhesive-wax-mount');
    expect(version.content.instructionsMd).to.contain('Cut at the marked line.');
    expect(unexpectedErrors(w.consoleErrors), 'console errors').to.deep.equal([]);
    submitted = { recipeId, number: version.number };
  });

  it('the approver opens it from Today and signs it in the dialog without the mouse; Tab stays inside the dialog', async function () {
    if (!submitted) this.skip();
    const { recipeId, number } = submitted!;
    await w.page.context().close();
    w = await openPage(browser, { width: 1440, height: 1000 });
    const { page } = w;
    await page.goto(`${BASE_URL}/sign-in`);
    await typeInto(page, page.getByLabel('Username'), approver.username);
    await typeInto(page, page.getByLabel('Password', { exact: true }), approver.password);
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/today/);

    // Today lists it under the approver's reviews; its link leads to the recipe or its review.
    await tabTo(page, page.locator('[data-list="waitingForMyReview"]').getByRole('link', { name: new RegExp(number) }));
    await page.keyboard.press('Enter');
    await page.waitForURL(new RegExp(`/recipes/${recipeId}`));
    if (!/\/review/.test(page.url())) {
      await tabTo(page, page.getByRole('link', { name: 'Review', exact: true }));
      await page.keyboard.press('Enter');
      await page.waitForURL(/\/review/);
    }
    await page.getByRole('button', { name: 'Approve…' }).waitFor();
    for (const box of await page.getByRole('checkbox', { name: 'I have considered this warning' }).all()) {
      await tabTo(page, box);
      await page.keyboard.press('Space');
    }
    const approve = page.getByRole('button', { name: 'Approve…' });
    await page.waitForFunction(() => [...document.querySelectorAll('button')].some((b) => /Approve…/.test(b.textContent ?? '') && !b.disabled));
    await tabTo(page, approve, { max: 200 });
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();

    // A modal dialog keeps the focus: two full rounds of Tab never leave it.
    await page.waitForFunction(() => document.activeElement?.closest('mat-dialog-container') !== null);
    for (let i = 0; i < 24; i += 1) {
      await page.keyboard.press('Tab');
      expect(await hasFocus(dialog), `Tab ${i + 1} left the dialog`).to.equal(true);
    }
    // The first signing in this session takes both signature components.
    await typeInto(page, dialog.getByLabel('Username', { exact: true }), approver.username);
    await typeInto(page, dialog.getByLabel('Password', { exact: true }), approver.password);
    await page.keyboard.press('Enter');
    await dialog.waitFor({ state: 'detached' });

    const api = await apiSignIn(approver.username, approver.password);
    const version = await api.get<RecipeVersionDto>(`/api/recipes/${recipeId}/versions/1`);
    await api.close();
    expect(version.status).to.equal('approved');
    expect((version.workflow?.signatures ?? []).map((s) => [s.meaning, s.signerName])).to.deep.include(['approved', approver.displayName]);
    expect(unexpectedErrors(w.consoleErrors), 'console errors').to.deep.equal([]);
  });
});
