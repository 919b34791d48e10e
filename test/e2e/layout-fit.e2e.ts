/// <reference lib="dom" />
/**
 * Screens that must fit a laptop and a narrow window, in chromium: the recipe page's tabs all
 * in view at 1366 × 768 (no paging arrows), and the cut-profile plot's legend inside its box
 * in the editor's live panel and the recipe page's Computed tab at 1366 and 800 px.
 */
import { expect } from 'chai';
import type { Browser, Locator, Page } from 'playwright-core';
import type { Page as ListPage } from '../../shared/api-types';
import type { RecipeSummary, RecipeVersionDto } from '../../shared/recipe-types';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { type ApiSession, apiSignIn } from './support/api';
import { BASE_URL, launch, openPage, screenshot } from './support/browser';
import { signIn } from './support/steps';

const auditor = DEMO_ACCOUNTS.find((a) => a.roles.includes('auditor'))!;
const author = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'))!;

/** Whether `inner`'s box lies inside `outer`'s (half a pixel of rounding allowed). */
async function boxInside(inner: Locator, outer: Locator): Promise<{ inside: boolean; inner: string; outer: string }> {
  const a = (await inner.boundingBox())!;
  const b = (await outer.boundingBox())!;
  const inside = a.x >= b.x - 0.5 && a.y >= b.y - 0.5 && a.x + a.width <= b.x + b.width + 0.5 && a.y + a.height <= b.y + b.height + 0.5;
  const text = (r: typeof a) => `${Math.round(r.x)},${Math.round(r.y)} ${Math.round(r.width)}×${Math.round(r.height)}`;
  return { inside, inner: text(a), outer: text(b) };
}

/**
 * Every legend entry of every plot in `scope` (the entries themselves, whose text may run out
 * of a too-small legend) lies inside its plot's figure and shows all its text, and every label
 * drawn in the chart lies inside the chart's box.
 */
async function expectLegendsInside(scope: Locator, where: string): Promise<void> {
  const plots = scope.locator('kb-cut-profile-plot, kb-cut-power-plot');
  await plots.first().waitFor({ timeout: 20_000 });
  const plotCount = await plots.count();
  for (let p = 0; p < plotCount; p++) {
    const plot = plots.nth(p);
    await plot.scrollIntoViewIfNeeded();
    const name = `${where}, ${await plot.evaluate((el) => el.tagName.toLowerCase())}`;
    const figure = plot.locator('figure').first();
    const entries = plot.locator('.kb-legend > *');
    const count = await entries.count();
    expect(count, `${name}: legend entries`).to.be.greaterThan(0);
    for (let i = 0; i < count; i++) {
      const r = await boxInside(entries.nth(i), figure);
      expect(r.inside, `${name}: legend entry ${i} at ${r.inner} lies outside the plot's box ${r.outer}`).to.equal(true);
      const overflows = await entries.nth(i).evaluate((el) => el.scrollWidth > el.clientWidth + 1);
      expect(overflows, `${name}: legend entry ${i} overflows its own box`).to.equal(false);
    }
    const chart = figure.locator(':scope > svg');
    const labels = chart.locator('text');
    for (let i = 0; i < (await labels.count()); i++) {
      const r = await boxInside(labels.nth(i), chart);
      expect(r.inside, `${name}: chart label "${await labels.nth(i).textContent()}" at ${r.inner} is cut off by the chart's box ${r.outer}`).to.equal(true);
    }
    // Nor does the plot run out of the panel or card that holds it.
    const clipped = await plot.evaluate((el) => {
      for (let box = el.parentElement; box; box = box.parentElement) {
        const style = getComputedStyle(box);
        if (style.overflowX !== 'visible')
          return el.getBoundingClientRect().right > box.getBoundingClientRect().right + 0.5 || box.scrollWidth > box.clientWidth + 1;
      }
      return false;
    });
    expect(clipped, `${name}: the plot runs out of its scrolling container`).to.equal(false);
  }
}

describe('screens that fit, in chromium', () => {
  let browser: Browser;
  let api: ApiSession;
  let recipeId: number;
  let draftRecipeId: number;

  before(async () => {
    api = await apiSignIn(author.username, author.password);
    // The approved recipe with the longest tab labels (check counts, photos): the auditor sees
    // every tab on it, Acknowledgements included.
    const list = await api.get<ListPage<RecipeSummary>>('/api/recipes?status=approved&pageSize=50');
    let longest = -1;
    for (const r of list.items) {
      const versions = await api.get<RecipeVersionDto[]>(`/api/recipes/${r.id}/versions`);
      const v = versions.find((x) => x.status === 'approved')!;
      const weight = v.checks.filter((c) => c.severity !== 'note').length + v.attachments.length;
      if (weight > longest) [longest, recipeId] = [weight, r.id];
    }
    // The demo's recipe returned to its author opens in the editor.
    const open = await api.get<ListPage<RecipeSummary>>('/api/recipes?status=returned&pageSize=50');
    draftRecipeId = open.items[0]!.id;
    browser = await launch();
  });

  after(async () => {
    await api?.close();
    await browser?.close();
  });

  async function signedIn(width: number, height: number, who = auditor): Promise<Page> {
    const { page } = await openPage(browser, { width, height });
    await signIn(page, who.username, who.password);
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    return page;
  }

  it('shows every recipe tab at 1366 × 768 without paging arrows', async () => {
    const page = await signedIn(1366, 768);
    await page.goto(`${BASE_URL}/recipes/${recipeId}`);
    const tabs = page.getByRole('tab');
    await tabs.first().waitFor();
    const labels = await tabs.allInnerTexts();
    expect(labels.map((l) => l.replace(/\s+/g, ' ').trim())).to.include.members(['History', 'Cuts', 'Acknowledgements']);
    await screenshot(page, 'recipe-tabs-1366');

    const arrows = page.locator('.mat-mdc-tab-header-pagination');
    for (let i = 0; i < (await arrows.count()); i++) expect(await arrows.nth(i).isVisible(), 'a paging arrow is shown').to.equal(false);
    const header = page.locator('.mat-mdc-tab-header').first();
    for (let i = 0; i < (await tabs.count()); i++) {
      const r = await boxInside(tabs.nth(i), header);
      expect(r.inside, `tab "${labels[i]}" at ${r.inner} is outside the header ${r.outer}`).to.equal(true);
    }
    await page.context().close();
  });

  for (const width of [1366, 800]) {
    it(`keeps the plot legend inside the plot on the Computed tab at ${width} px`, async () => {
      const page = await signedIn(width, 900);
      await page.goto(`${BASE_URL}/recipes/${recipeId}`);
      await page.getByRole('tab', { name: 'Computed' }).click();
      const tab = page.getByRole('tabpanel');
      await tab.locator('kb-cut-profile-plot').first().scrollIntoViewIfNeeded();
      await screenshot(page, `recipe-computed-legend-${width}`);
      await expectLegendsInside(tab, `Computed tab at ${width} px`);
      await page.context().close();
    });

    it(`keeps the plot legend inside the plot in the editor's live panel at ${width} px`, async () => {
      const page = await signedIn(width, 900, author);
      await page.goto(`${BASE_URL}/recipes/${draftRecipeId}/edit`);
      const panel = page.locator('kb-recipe-live-panel');
      await panel.locator('kb-cut-profile-plot').first().scrollIntoViewIfNeeded();
      await screenshot(page, `editor-live-legend-${width}`);
      await expectLegendsInside(panel, `editor at ${width} px`);
      await page.context().close();
    });
  }
});
