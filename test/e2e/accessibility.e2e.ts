/// <reference lib="dom" />
/**
 * Accessibility in chromium: axe-core (WCAG 2.0/2.1 A and AA rules) on every screen of
 * app.routes.ts, as the role that can reach it, and on the dialogs those screens open.
 * A screen fails on any serious or critical violation; every violation, of any impact, is
 * printed with its target so a failure says where to look. Nothing here changes what
 * other journeys use: dialogs are opened and closed with Escape; the only write is one
 * invitation, for the set-password screen its mail links to.
 */
import { expect } from 'chai';
import type { Browser, Page } from 'playwright-core';
import type { Page as ListPage } from '../../shared/api-types';
import type { RecipeSummary } from '../../shared/recipe-types';
import { DEMO_ACCOUNTS, type DemoAccount } from '../../seeds/data/demo-accounts';
import { createDb } from '../../server/data/db';
import { apiSignIn } from './support/api';
import { audit, blocking, settle } from './support/axe';
import { BASE_URL, launch } from './support/browser';
import { readPdfText } from './support/pdf-text';
import { linkIn, waitForMail } from './support/mailbox';
import { choose, signIn } from './support/steps';

const account = (role: string): DemoAccount => DEMO_ACCOUNTS.find((a) => a.roles.includes(role as DemoAccount['roles'][number]))!;
const author = account('author');
const approver = account('approver');
const operator = account('operator');
const auditor = account('auditor');
const admin = account('admin');

/** Recipe ids by number, looked up once (ids differ between databases, numbers do not). */
const ids = new Map<string, number>();
const id = (number: string): number => {
  const found = ids.get(number);
  if (found === undefined) throw new Error(`${number} is not in the demo data`);
  return found;
};

/** Opens a screen, waits for its data, audits it and fails on serious or critical findings. */
async function check(page: Page, screen: string, path: string | null, ready?: (page: Page) => Promise<unknown>): Promise<void> {
  if (path !== null) await page.goto(`${BASE_URL}${path}`);
  if (ready) await ready(page);
  await settle(page);
  expect(blocking(await audit(page, screen)), `serious or critical axe violations on ${screen}`).to.deep.equal([]);
}

/** Audits with a dialog open, then closes it with Escape (nothing is saved). */
async function checkDialog(page: Page, screen: string, open: (page: Page) => Promise<unknown>): Promise<void> {
  await open(page);
  const dialog = page.getByRole('dialog');
  await dialog.waitFor();
  await settle(page);
  expect(blocking(await audit(page, screen)), `serious or critical axe violations on ${screen}`).to.deep.equal([]);
  await page.keyboard.press('Escape');
  await dialog.waitFor({ state: 'detached' });
}

/** Every tab of the recipe page, each audited while selected. */
async function checkRecipeTabs(page: Page, who: string, number: string): Promise<void> {
  await check(page, `${who}: recipe ${number}`, `/recipes/${id(number)}`, (p) => p.getByRole('tab').first().waitFor());
  // A tab's count badge sits on its own line in the text; its accessible name has a space.
  const names = (await page.getByRole('tab').allInnerTexts()).map((t) => t.trim().replace(/\s+/g, ' '));
  expect(names.length, 'tabs').to.be.greaterThan(3);
  // The page around the tabs was audited above; each tab's panel is audited on its own (faster).
  // Chosen by position: a count badge's accessible name ("1 warnings") is longer than its text.
  for (const [i, name] of names.entries()) {
    await page.getByRole('tab').nth(i).click();
    await settle(page);
    const screen = `${who}: recipe ${number}, tab ${name}`;
    expect(blocking(await audit(page, screen, '.mat-mdc-tab-body-active')), `serious or critical axe violations on ${screen}`).to.deep.equal([]);
  }
}

describe('accessibility in chromium (axe-core, WCAG 2.1 A and AA)', () => {
  let browser: Browser;
  let page: Page;

  before(async () => {
    browser = await launch();
    const api = await apiSignIn(author.username, author.password);
    const all = await api.get<ListPage<RecipeSummary>>('/api/recipes?pageSize=100');
    for (const r of all.items) ids.set(r.number, r.id);
    await api.close();
  });
  after(async () => {
    await browser?.close();
  });

  /** A fresh context per role: nothing carries over between people. */
  async function as(who: DemoAccount | null): Promise<void> {
    await page?.context().close();
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    page = await context.newPage();
    if (who) {
      await signIn(page, who.username, who.password);
      await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    }
  }

  it('axe itself reports a violation planted in a screen (the check can fail)', async () => {
    await as(null);
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    await page.evaluate(() => document.body.appendChild(document.createElement('img')));
    const found = blocking(await audit(page, 'planted image without alt'));
    expect(found.join('\n')).to.match(/critical image-alt/);
  });

  describe('signed out', () => {
    before(() => as(null));

    it('sign-in', () => check(page, 'sign-in', '/sign-in', (p) => p.getByRole('button', { name: 'Sign in' }).waitFor()));
    it('sign-in with a wrong password (error shown)', async () => {
      await page.getByLabel('Username').fill(admin.username);
      await page.getByLabel('Password', { exact: true }).fill('not-the-password');
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('alert').waitFor();
      await check(page, 'sign-in, wrong password', null);
    });
    it('sign-in with empty fields (field errors shown)', async () => {
      await page.goto(`${BASE_URL}/sign-in`);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.locator('mat-error').first().waitFor();
      await check(page, 'sign-in, field errors', null);
    });
    it('forgot password', () => check(page, 'forgot password', '/forgot-password', (p) => p.getByRole('heading').first().waitFor()));
    it('set password, broken link', () =>
      check(page, 'set password, broken link', '/set-password?token=not-a-token', (p) => p.getByRole('heading').first().waitFor()));
    it('set password, from an invitation mail', async function () {
      if (!process.env['E2E_MAIL_DIR']) this.skip();
      const stamp = Date.now().toString(36);
      const email = `a11y.${stamp}@harrowgate.example`;
      const api = await apiSignIn(admin.username, admin.password);
      await api.post('/api/users/invitations', { username: `a11y.${stamp}`, displayName: `Ada Lind ${stamp}`, email, roles: ['auditor'] });
      await api.close();
      const link = linkIn(await waitForMail(email, (m) => /set-password/.test(m.text)), BASE_URL);
      await check(page, 'set password, invitation', link.replace(BASE_URL, ''), (p) => p.getByLabel('New password', { exact: true }).waitFor());
    });
    it('page not found', () => check(page, 'page not found', '/no-such-screen', (p) => p.getByRole('heading').first().waitFor()));
  });

  describe('author', () => {
    before(() => as(author));

    it('Today', () => check(page, 'author: Today', '/today'));
    it('Library', () => check(page, 'author: Library', '/library', (p) => p.getByRole('row').nth(1).waitFor()));
    it('Library, nothing found', () => check(page, 'author: Library, empty', '/library?q=no-such-recipe-anywhere'));
    it('recipe page, every tab (approved, with cuts)', () => checkRecipeTabs(page, 'author', 'KB-0001'));
    it('recipe page, every tab (returned, with comments)', () => checkRecipeTabs(page, 'author', 'KB-0005'));
    it('recipe pages in other states: withdrawn, draft, in review', async () => {
      for (const number of ['KB-0006', 'KB-0011', 'KB-0009']) {
        await check(page, `author: recipe ${number}`, `/recipes/${id(number)}`, (p) => p.getByRole('tab').first().waitFor());
      }
    });
    it('new version dialog', () =>
      checkDialog(page, 'author: new version dialog', async (p) => {
        await p.goto(`${BASE_URL}/recipes/${id('KB-0001')}`);
        await p.getByRole('button', { name: 'Start a new version' }).click();
      }));
    it('editor, new recipe', () => check(page, 'author: editor, new', '/recipes/new', (p) => p.getByLabel('Title', { exact: true }).waitFor()));
    it('editor, every field error and the form error shown', async () => {
      await page.getByRole('button', { name: 'Create draft' }).click();
      await page.locator('mat-error').first().waitFor();
      await check(page, 'author: editor, errors', null);
    });
    it('editor, a blocker in the live checks', async () => {
      await page.goto(`${BASE_URL}/recipes/new`);
      await page.getByLabel('Title', { exact: true }).fill('Axe probe');
      await choose(page, 'Material', /Alumina 99\.5/);
      await choose(page, 'Machine', /Clean-room precision saw/);
      await choose(page, 'Wheel', /Diamond rim 200/);
      // 4900 rpm on a 200 mm wheel is above its marked 50 m/s: a blocker.
      await page.getByLabel('Wheel speed').fill('4900');
      await page.getByRole('button', { name: /Blocker.*above its marked maximum/ }).waitFor();
      await check(page, 'author: editor, blocker', null);
    });
    it('editor, a draft', () =>
      check(page, 'author: editor, draft', `/recipes/${id('KB-0004')}/edit`, (p) => p.getByLabel('Title', { exact: true }).waitFor()));
    it('compare', () => check(page, 'author: compare', `/recipes/${id('KB-0002')}/compare?from=1&to=2`, (p) => p.getByRole('heading').first().waitFor()));
    it('compare, inline layout', () => check(page, 'author: compare inline', `/recipes/${id('KB-0002')}/compare?from=1&to=2&layout=inline`));
    it('finder', () => check(page, 'author: finder', '/finder'));
    it('check a sheet', () => check(page, 'author: check', '/check'));
    it('check a sheet, a printed code (current)', async () => {
      // The code printed on KB-0001's bench sheet, as the QR code on it would open it.
      const sheet = await page.request.get(`${BASE_URL}/api/recipes/${id('KB-0001')}/versions/1/sheet.pdf`);
      const code = /\b[0-9A-HJKMNP-TV-Z]{4}-[0-9A-HJKMNP-TV-Z]{4}\b/.exec(await readPdfText(await sheet.body()))?.[0];
      expect(code, 'check code on the sheet').to.be.a('string');
      await check(page, 'author: check a current code', `/check/${code}`, (p) => p.getByText('KB-0001').first().waitFor());
    });
    // Old sheets no longer print, so their codes come from the database (npm test names it).
    for (const [number, state] of [
      ['KB-0002', 'superseded'],
      ['KB-0006', 'withdrawn'],
    ] as const) {
      it(`check a sheet, a printed code (${state})`, async function () {
        const url = process.env['E2E_DATABASE_URL'];
        if (!url) this.skip();
        const db = createDb(url!);
        const row = (await db('recipe_versions')
          .where({ recipe_id: id(number), version: 1 })
          .first('check_code')) as { check_code: string | null } | undefined;
        await db.destroy();
        expect(row?.check_code, `check code of ${number} v1`).to.be.a('string');
        await check(page, `author: check a ${state} code`, `/check/${row!.check_code}`, (p) => p.getByText(number).first().waitFor());
      });
    }
    it('recipe not found', () => check(page, 'author: recipe not found', '/recipes/999999', (p) => p.getByRole('heading').first().waitFor()));
    it('check a sheet, unknown code', () => check(page, 'author: check unknown code', '/check/AAAA-AAAA'));
    it('specimen trace', () => check(page, 'author: specimen trace', '/cuts'));
    it('specimen trace, with a result', () =>
      check(page, 'author: specimen trace result', '/cuts?specimen=HF-24-0421', (p) => p.getByText('HF-24-0421').first().waitFor()));
    it('stock: materials', () => check(page, 'author: stock materials', '/stock/materials', (p) => p.getByRole('row').nth(1).waitFor()));
    it('stock: material dialog', () => checkDialog(page, 'author: material dialog', (p) => p.getByRole('button', { name: 'Add material' }).click()));
    it('stock: wheels', () => check(page, 'author: stock wheels', '/stock/wheels', (p) => p.getByRole('row').nth(1).waitFor()));
    it('stock: wheel dialog', () => checkDialog(page, 'author: wheel dialog', (p) => p.getByRole('button', { name: 'Add wheel' }).click()));
    it('stock: machines', () => check(page, 'author: stock machines', '/stock/machines', (p) => p.getByRole('row').nth(1).waitFor()));
    it('stock: machine dialog', () => checkDialog(page, 'author: machine dialog', (p) => p.getByRole('button', { name: 'Add machine' }).click()));
    it('stock: wheel selection', () => check(page, 'author: wheel selection', '/stock/wheel-selection', (p) => p.getByRole('row').nth(1).waitFor()));
    it('stock: wheel selection dialog', () =>
      checkDialog(page, 'author: selection row dialog', (p) => p.getByRole('button', { name: /Add (a )?row/ }).click()));
    it('my account', () => check(page, 'author: account', '/account'));
    it('my account, password errors shown', async () => {
      await page.getByRole('button', { name: 'Change password' }).click();
      await page.locator('mat-error').first().waitFor();
      await check(page, 'author: account, errors', null);
    });
    it('account menu', async () => {
      await page.getByRole('button', { name: `Account menu for ${author.displayName}` }).click();
      await page.getByRole('menu').waitFor();
      await check(page, 'author: account menu open', null);
      await page.keyboard.press('Escape');
    });
    it('not allowed', () => check(page, 'author: not allowed', '/not-allowed'));
  });

  describe('approver', () => {
    before(() => as(approver));

    it('Today (review queue)', () => check(page, 'approver: Today', '/today'));
    it('review page', () =>
      check(page, 'approver: review', `/recipes/${id('KB-0009')}/review`, (p) => p.getByRole('button', { name: 'Return with comments' }).waitFor()));
    it('return dialog', () => checkDialog(page, 'approver: return dialog', (p) => p.getByRole('button', { name: 'Return with comments' }).click()));
    it('signature dialog', () =>
      checkDialog(page, 'approver: signature dialog', async (p) => {
        for (const box of await p.getByRole('checkbox', { name: 'I have considered this warning' }).all()) await box.check();
        await p.getByRole('button', { name: 'Approve…' }).click();
      }));
    it('withdraw dialog', () =>
      checkDialog(page, 'approver: withdraw dialog', async (p) => {
        await p.goto(`${BASE_URL}/recipes/${id('KB-0008')}`);
        await p.getByRole('button', { name: 'Withdraw…' }).click();
      }));
  });

  describe('operator', () => {
    before(() => as(operator));

    it('finder', () => check(page, 'operator: finder', '/finder'));
    it('finder with results', () =>
      check(page, 'operator: finder results', '/finder?group=plain-low-alloy-steel&sizeMm=30', (p) =>
        p
          .getByRole('link', { name: /Open KB-/ })
          .or(p.getByRole('button', { name: /Open KB-/ }))
          .first()
          .waitFor(),
      ));
    it('Today', () => check(page, 'operator: Today', '/today'));
    it('recipe page, every tab', () => checkRecipeTabs(page, 'operator', 'KB-0001'));
    it('log a cut dialog', () =>
      checkDialog(page, 'operator: log cut dialog', async (p) => {
        await p.goto(`${BASE_URL}/recipes/${id('KB-0001')}`);
        await p.getByRole('button', { name: 'Log a cut' }).first().click();
      }));
    it('acknowledge page', () =>
      check(page, 'operator: acknowledge', `/recipes/${id('KB-0002')}/acknowledge?v=2`, (p) => p.getByRole('heading').first().waitFor()));
  });

  describe('auditor', () => {
    before(() => as(auditor));

    it('trail', () => check(page, 'auditor: trail', '/trail', (p) => p.getByRole('row').nth(1).waitFor()));
    it('trail, chain verified', async () => {
      await page.getByRole('button', { name: 'Verify chain' }).click();
      await page
        .getByText(/checked/)
        .first()
        .waitFor();
      await check(page, 'auditor: trail verified', null);
    });
    it('recipe page, every tab', () => checkRecipeTabs(page, 'auditor', 'KB-0002'));
  });

  describe('admin', () => {
    before(() => as(admin));

    it('people', () => check(page, 'admin: people', '/people', (p) => p.getByRole('row').nth(1).waitFor()));
    it('invite dialog', () => checkDialog(page, 'admin: invite dialog', (p) => p.getByRole('button', { name: 'Invite by e-mail' }).click()));
    it('invite dialog with its errors shown', async () => {
      await page.getByRole('button', { name: 'Invite by e-mail' }).click();
      const dialog = page.getByRole('dialog');
      await dialog.getByRole('button', { name: 'Send invitation' }).click();
      await dialog.locator('mat-error').first().waitFor();
      await settle(page);
      expect(blocking(await audit(page, 'admin: invite dialog, errors'))).to.deep.equal([]);
      await page.keyboard.press('Escape');
      await dialog.waitFor({ state: 'detached' });
    });
    it('a person’s action menu', async () => {
      await page.getByRole('button', { name: `Actions for ${author.displayName}` }).click();
      await page.getByRole('menu').waitFor();
      await check(page, 'admin: person action menu', null);
      await page.keyboard.press('Escape');
    });
    it('add person dialog', () => checkDialog(page, 'admin: add person dialog', (p) => p.getByRole('button', { name: 'Add person' }).click()));
    it('outbox', () => check(page, 'admin: outbox', '/outbox'));
    it('trail', () => check(page, 'admin: trail', '/trail', (p) => p.getByRole('row').nth(1).waitFor()));
  });

  describe('phone width (390 × 844)', () => {
    before(async () => {
      await as(operator);
      await page.setViewportSize({ width: 390, height: 844 });
    });

    it('finder', () => check(page, 'phone: finder', '/finder'));
    it('navigation menu', async () => {
      const menu = page.getByRole('button', { name: 'Show or hide the navigation' });
      await menu.click();
      await page.getByRole('navigation', { name: 'Sections' }).getByRole('link').first().waitFor();
      await check(page, 'phone: navigation open', null);
      await page.keyboard.press('Escape');
    });
    it('recipe page', () => check(page, 'phone: recipe', `/recipes/${id('KB-0001')}`, (p) => p.getByRole('tab').first().waitFor()));
    it('library', () => check(page, 'phone: library', '/library', (p) => p.getByRole('row').nth(1).waitFor()));
  });
});
