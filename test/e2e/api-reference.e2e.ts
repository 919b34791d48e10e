/// <reference lib="dom" />
/**
 * The API reference page as an admin meets it: reached from the navigation, it draws the
 * server's own OpenAPI document with the viewer bundled into the app — under the app's CSP,
 * with nothing fetched from another host and no CSP violation.
 */
import { expect } from 'chai';
import type { Browser } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import * as trail from '../../server/web/handlers/trail';
import { routes } from '../../server/web/routes';
import { BASE_URL, type WatchedPage, launch, openPage, screenshot } from './support/browser';
import { navEntries, signIn, signInAsAdmin, unexpectedErrors } from './support/steps';

const operator = DEMO_ACCOUNTS.find((a) => a.roles.length === 1 && a.roles[0] === 'operator')!;
/** The trail's routes, found by their handlers so the test follows the table's paths. */
const trailPaths = routes.filter((r) => (Object.values(trail) as unknown[]).includes(r.handler)).map((r) => r.path);

declare global {
  interface Window {
    cspViolations?: string[];
  }
}

describe('API reference in chromium', () => {
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
    // Counts every CSP violation the page reports, whatever the console says.
    await w.page.addInitScript(() => {
      window.cspViolations = [];
      document.addEventListener('securitypolicyviolation', (e) => window.cspViolations!.push(`${e.violatedDirective} ${e.blockedURI}`));
    });
  });
  afterEach(async () => {
    await w.page.context().close();
  });

  it('shows the admin every route of the API, the trail among them, with no CSP violation and nothing from another host', async () => {
    const { page } = w;
    await signInAsAdmin(page);
    expect(await navEntries(page)).to.include('API reference');
    await page
      .getByRole('navigation', { name: 'Sections' })
      .getByRole('link', { name: /API reference/ })
      .click();
    await page.waitForURL(/\/api-reference$/);
    await page.getByRole('heading', { level: 1, name: 'API reference' }).waitFor();

    const shown = (path: string) => page.locator(`.opblock-summary-path[data-path="${path}"]`).first();
    await shown('/api/recipes').waitFor();
    // The events, their CSV, the chain check and the people auditors filter by.
    expect(trailPaths, 'trail routes in the table').to.have.length(4);
    for (const path of [
      '/api/recipes',
      '/api/recipes/{id}/versions/{n}/sheet.pdf',
      '/api/openapi.json',
      ...trailPaths.map((p) => p.replace(/:(\w+)/g, '{$1}')),
    ]) {
      expect(await shown(path).isVisible(), `${path} listed`).to.equal(true);
    }
    // One block per route of the table.
    expect(await page.locator('.opblock').count()).to.equal(routes.length);
    await screenshot(page, '70-api-reference');

    // Opening an operation shows its access and its parameters from the route's schemas.
    await page
      .locator('.opblock-get')
      .filter({ has: shown('/api/recipes') })
      .locator('.opblock-summary-control')
      .click();
    await page.getByText('Access: any signed-in person.').first().waitFor();
    await page.locator('.parameters tr[data-param-name="pageSize"]').first().waitFor();
    await screenshot(page, '71-api-reference-operation');

    expect(await page.evaluate(() => window.cspViolations), 'CSP violations').to.deep.equal([]);
    expect(w.foreignRequests, 'requests to other hosts').to.deep.equal([]);
    expect(unexpectedErrors(w.consoleErrors), 'console errors').to.deep.equal([]);
  });

  it('is not offered to someone without the admin role, and its route sends them away', async () => {
    const { page } = w;
    await signIn(page, operator.username, operator.password);
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    expect(await navEntries(page)).to.not.include('API reference');
    await page.goto(`${BASE_URL}/api-reference`);
    await page.waitForURL((url) => !url.pathname.startsWith('/api-reference'));
    expect(await page.locator('.opblock').count()).to.equal(0);
  });
});
