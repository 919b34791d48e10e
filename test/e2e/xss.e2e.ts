/// <reference lib="dom" />
/**
 * Hostile text in the browser and on the bench sheet. The OWASP filter-evasion vectors
 * (support/xss-vectors.ts) go, through the API, into every field a person can write:
 * the recipe's title, notes, rules and its three Markdown texts, review comments, the
 * return and approval comments, the change reason, a cut's specimen id, part and notes,
 * the names and notes of a material, wheel, machine and wheel-selection row, and a
 * person's name. Then each screen that shows them is opened in chromium with the
 * content security policy switched OFF (bypassCSP), so only the app's own escaping and
 * sanitizing stand between the text and the page. Nothing may run (no xssHit call, no
 * dialog, no request to another host), no live handler, script, frame or script link may
 * be in the page, and plain-text fields must read back exactly as typed. The mails the
 * scene sends are rendered the same way, and the bench sheet PDF must carry the vectors
 * as plain text and no PDF action.
 */
import { expect } from 'chai';
import sharp from 'sharp';
import type { Browser, Page } from 'playwright-core';
import type { Page as ListPage, UserDto } from '../../shared/api-types';
import type { RecipeVersionDto } from '../../shared/recipe-types';
import type { MachineRecord, MaterialRecord, WheelRecord } from '../../shared/stock-types';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { type ApiSession, apiSignIn } from './support/api';
import { settle } from './support/axe';
import { BASE_URL, launch } from './support/browser';
import { waitForMail } from './support/mailbox';
import { readPdfText } from './support/pdf-text';
import { signIn } from './support/steps';
import { VECTORS, allVectors, compact, vector } from './support/xss-vectors';

const author = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'))!;
const approver = DEMO_ACCOUNTS.find((a) => a.roles.includes('approver'))!;
const auditor = DEMO_ACCOUNTS.find((a) => a.roles.includes('auditor'))!;
const admin = DEMO_ACCOUNTS.find((a) => a.roles.includes('admin'))!;

const stamp = Date.now().toString(36);
const M = `XSS-${stamp}`;

/** What each plain-text field holds; each must read back exactly, as text. */
const TEXT = {
  title: `${M} title <img src=x onerror="xssHit(8)"> "><script>xssHit(22)</script>`,
  orientationNote: `${vector('svg onload')} ${vector('Angular template expression')}`,
  placement: `${vector('mixed case')} ${vector('body onload')}`,
  orientationRule: vector('iframe srcdoc'),
  materialName: `${M} mat ${vector('alert in onerror')}`,
  designation: vector('svg onload'),
  condition: vector('details ontoggle'),
  machineName: `${M} saw ${vector('basic script')}`,
  wheelName: `${M} wheel ${vector('image javascript: source')}`,
  selectionNote: `${M} ${vector('meta refresh')} ${vector('autofocus onfocus')}`,
  personName: `Op ${vector('alert in onerror')} ${stamp}`,
  changeReason: `${M} ${vector('attribute breakout')} ${vector('half-open tag')}`,
  specimenId: `${stamp}${vector('image onerror')}`,
  partRef: vector('external script'),
  caption: `${M} ${vector('hex entities')}`,
  fileName: `"><img src=x onerror=xssHit(8)>.png`,
};
/** The long fields get every vector (notes, comments) — plain text or Markdown. */
const LONG = (field: string) => allVectors(`${M} ${field}`);

interface Scene {
  recipeId: number;
  number: string;
  withdrawnId: number;
  operator: { username: string; password: string };
}
let scene: Scene;

/** Values of a stock record as its create body takes them (the record adds id, archived, timestamps). */
function bodyOf<T extends object>(record: T, drop: string[]): Record<string, unknown> {
  return Object.fromEntries(Object.entries(record).filter(([k]) => !drop.includes(k)));
}
const STORED = ['id', 'archived', 'createdAt', 'updatedAt', 'archivedAt', 'usedBy', 'inUse'];

async function first<T>(api: ApiSession, path: string, name: string): Promise<T> {
  const page = await api.get<ListPage<T & { name: string }>>(path);
  const found = page.items.find((i) => i.name === name);
  if (!found) throw new Error(`${name} is not in ${path}`);
  return found;
}

/** Builds the hostile scene through the API, as the people of the lab would. */
async function buildScene(): Promise<Scene> {
  const asAuthor = await apiSignIn(author.username, author.password);
  const saw = await first<MachineRecord>(asAuthor, '/api/machines?pageSize=200', 'Clean-room precision saw');
  const rim = await first<WheelRecord>(asAuthor, '/api/wheels?pageSize=200', 'Diamond rim 200 metal bond');
  const material = await asAuthor.post<MaterialRecord>('/api/materials', {
    name: TEXT.materialName,
    designation: TEXT.designation,
    group: 'electronics-mixed',
    condition: TEXT.condition,
    notes: LONG('material notes'),
  });
  const machine = await asAuthor.post<MachineRecord>('/api/machines', { ...bodyOf(saw, STORED), name: TEXT.machineName, notes: LONG('machine notes') });
  const wheel = await asAuthor.post<WheelRecord>('/api/wheels', { ...bodyOf(rim, STORED), name: TEXT.wheelName, notes: LONG('wheel notes') });
  await asAuthor.post('/api/selection-rows', { group: 'electronics-mixed', hardness: null, wheelId: wheel.id, note: TEXT.selectionNote });

  const content = {
    scope: {
      materialId: material.id,
      group: 'electronics-mixed',
      hardness: null,
      shape: 'round-bar',
      sizeMinMm: 5,
      sizeMaxMm: 20,
      widthMm: null,
      wallMm: null,
      orientation: 'transverse',
      orientationNote: TEXT.orientationNote,
    },
    cutting: {
      machineId: machine.id,
      wheelId: wheel.id,
      wheelRpm: 3900,
      feedMmS: 0.05,
      entryFeedMmS: null,
      entryLengthMm: null,
      cutMotion: 'straight-plunge',
      passes: null,
    },
    clamping: {
      method: 'adhesive-wax-mount',
      placement: TEXT.placement,
      bothSides: true,
      softInserts: false,
      supportBlocks: false,
      orientationRule: TEXT.orientationRule,
    },
    coolant: { type: 'water-soluble', concentrationPct: 3, flowLMin: null },
    instructionsMd: LONG('instructions'),
    acceptanceMd: LONG('acceptance'),
    cautionsMd: LONG('cautions'),
    changeReason: '',
  };
  let v = await asAuthor.post<RecipeVersionDto>('/api/recipes', { title: TEXT.title, content });
  const { recipeId, number } = v;
  const path = `/api/recipes/${recipeId}/versions/1`;
  const photo = await sharp({ create: { width: 16, height: 16, channels: 3, background: '#808080' } })
    .png()
    .toBuffer();
  await asAuthor.upload(`${path}/attachments`, { role: 'setup', caption: TEXT.caption }, { name: TEXT.fileName, mimeType: 'image/png', buffer: photo });
  v = await asAuthor.get<RecipeVersionDto>(path);
  v = await asAuthor.post<RecipeVersionDto>(`${path}/submit`, { revision: v.revision });

  // Review: a comment, a return with comments, a fix, a second submission, the signature.
  const asApprover = await apiSignIn(approver.username, approver.password);
  await asApprover.post(`${path}/comments`, { body: LONG('review comment'), path: 'instructionsMd' });
  v = await asApprover.post<RecipeVersionDto>(`${path}/return`, { revision: v.revision, comment: LONG('return comment') });
  v = await asAuthor.put<RecipeVersionDto>(path, {
    revision: v.revision,
    title: TEXT.title,
    content: { ...content, coolant: { ...content.coolant, flowLMin: 2 } },
  });
  v = await asAuthor.post<RecipeVersionDto>(`${path}/submit`, { revision: v.revision });
  const warnings = v.checks.filter((c) => c.severity === 'warning').map((c) => c.id);
  await asApprover.post(`${path}/approve`, {
    revision: v.revision,
    username: approver.username,
    password: approver.password,
    meaning: 'approved',
    comment: LONG('approval').slice(0, 2000),
    acknowledgedWarnings: warnings,
  });

  // A second recipe, approved and then withdrawn with a hostile reason.
  let w = await asAuthor.post<RecipeVersionDto>('/api/recipes', { title: `${M} withdrawn ${vector('svg onload')}`, content });
  w = await asAuthor.post<RecipeVersionDto>(`/api/recipes/${w.recipeId}/versions/1/submit`, { revision: w.revision });
  w = await asApprover.post<RecipeVersionDto>(`/api/recipes/${w.recipeId}/versions/1/approve`, {
    revision: w.revision,
    password: approver.password,
    meaning: 'approved',
    acknowledgedWarnings: w.checks.filter((c) => c.severity === 'warning').map((c) => c.id),
  });
  await asApprover.post(`/api/recipes/${w.recipeId}/versions/1/withdraw`, {
    revision: w.revision,
    password: approver.password,
    meaning: 'withdrawn',
    reason: LONG('withdrawal').slice(0, 2000),
  });
  await asApprover.close();

  // Version 2, with a hostile change reason, left in review (the review page shows it).
  const v2 = await asAuthor.post<RecipeVersionDto>(`/api/recipes/${recipeId}/versions`, { fromVersion: 1, changeReason: TEXT.changeReason });
  const saved = await asAuthor.put<RecipeVersionDto>(`/api/recipes/${recipeId}/versions/2`, {
    revision: v2.revision,
    title: TEXT.title,
    content: { ...v2.content, instructionsMd: LONG('instructions v2') },
  });
  await asAuthor.post(`/api/recipes/${recipeId}/versions/2/submit`, { revision: saved.revision });
  await asAuthor.close();

  // An operator of the hostile saw whose name is hostile too.
  const operator = { username: `xss.${stamp}`, password: `Xss-temp-${stamp}-1`, own: `Xss-own-${stamp}-22` };
  const asAdmin = await apiSignIn(admin.username, admin.password);
  await asAdmin.post<UserDto>('/api/users', {
    username: operator.username,
    displayName: TEXT.personName,
    email: '',
    roles: ['operator'],
    temporaryPassword: operator.password,
    machineIds: [machine.id],
  });
  await asAdmin.close();
  const newcomer = await apiSignIn(operator.username, operator.password);
  await newcomer.post('/api/session/password', { currentPassword: operator.password, newPassword: operator.own });
  await newcomer.close();
  return { recipeId, number, withdrawnId: w.recipeId, operator: { username: operator.username, password: operator.own } };
}

describe('hostile text in chromium and on the bench sheet (OWASP XSS vectors)', () => {
  let browser: Browser;
  let page: Page;
  /** Every sign that a vector ran, for the screen being checked. */
  let hits: string[] = [];
  let foreign: string[] = [];

  before(async function () {
    this.timeout(120_000);
    scene = await buildScene();
    browser = await launch();
  });
  after(async () => {
    await browser?.close();
  });

  async function as(who: { username: string; password: string }): Promise<void> {
    await page?.context().close();
    // CSP off: the app's escaping and sanitizing must hold on their own.
    const context = await browser.newContext({ bypassCSP: true, viewport: { width: 1440, height: 1000 } });
    await context.exposeFunction('xssHit', (n: unknown) => hits.push(`xssHit(${String(n)}) ran`));
    page = await context.newPage();
    page.on('dialog', (d) => {
      hits.push(`a ${d.type()} dialog opened: ${d.message()}`);
      void d.dismiss();
    });
    const origin = new URL(BASE_URL).origin;
    page.on('request', (r) => {
      if (!r.url().startsWith(origin) && !/^(data|blob):/.test(r.url())) foreign.push(r.url());
    });
    await signIn(page, who.username, who.password);
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  }

  /** Nothing ran, nothing live in the page, and every plain-text value reads back as typed. */
  async function expectInert(screen: string, texts: string[] = []): Promise<void> {
    await settle(page);
    // Give a timer-, focus- or load-driven payload the chance to fire.
    await page.waitForTimeout(300);
    const live = await page.evaluate(() => {
      const found: string[] = [];
      for (const el of document.body.querySelectorAll('*')) {
        const tag = el.tagName.toLowerCase();
        // The app's own bundles are the only scripts allowed: same origin, no inline code.
        const ownBundle = tag === 'script' && (el as HTMLScriptElement).src.startsWith(location.origin + '/') && !el.textContent?.trim();
        if (ownBundle) continue;
        if (['script', 'iframe', 'frame', 'object', 'embed', 'meta', 'base'].includes(tag)) found.push(`<${tag}> in the body`);
        for (const a of el.attributes) {
          if (/^on/i.test(a.name)) found.push(`<${tag} ${a.name}="${a.value}">`);
          if (a.name === 'srcdoc') found.push(`<${tag} srcdoc>`);
          if (
            /^(href|src|action|formaction|data|xlink:href|background|poster)$/i.test(a.name) &&
            /^\s*(javascript|vbscript|data:text\/html)/i.test(a.value.replace(/[\u0000-\u0020]/g, ''))
          ) {
            found.push(`<${tag} ${a.name}="${a.value}">`);
          }
          if (a.name === 'style' && /expression|javascript:/i.test(a.value)) found.push(`<${tag} style="${a.value}">`);
        }
      }
      return found;
    });
    expect(live, `live markup on ${screen}`).to.deep.equal([]);
    expect(hits, `script ran on ${screen}`).to.deep.equal([]);
    expect(foreign, `requests to other hosts on ${screen}`).to.deep.equal([]);
    const shown = compact(await page.locator('body').innerText());
    for (const t of texts) expect(shown, `"${t}" shown as text on ${screen}`).to.contain(compact(t));
  }

  async function open(screen: string, path: string, ready: string | null, texts: string[] = []): Promise<void> {
    await page.goto(`${BASE_URL}${path}`);
    if (ready) await page.getByText(ready, { exact: false }).first().waitFor();
    await expectInert(screen, texts);
  }

  async function tab(name: RegExp, screen: string, texts: string[] = []): Promise<void> {
    await page.getByRole('tab', { name }).click();
    await expectInert(screen, texts);
  }

  afterEach(() => {
    hits = [];
    foreign = [];
  });

  it('the detector sees a vector planted past the app (the check can fail)', async () => {
    await as(author);
    await open('Today', '/today', 'Today');
    await page.evaluate(() => document.body.insertAdjacentHTML('beforeend', '<img src="x" onerror="xssHit(99)">'));
    const failure = await expectInert('Today with a planted vector').then(
      () => '',
      (err: Error) => err.message,
    );
    expect(failure).to.match(/live markup on Today with a planted vector/);
    await page.waitForTimeout(200);
    expect(hits).to.deep.equal(['xssHit(99) ran']);
  });

  it('the author’s screens: library, recipe tabs, editor, compare, Today, stock', async () => {
    await as(author);
    const recipe = `/recipes/${scene.recipeId}`;
    await open('library', `/library?q=${M}`, M, [TEXT.title]);
    await open('recipe v1', `${recipe}?v=1`, M, [
      `${M} approval`,
      TEXT.title,
      TEXT.materialName,
      TEXT.machineName,
      TEXT.wheelName,
      TEXT.orientationNote,
      TEXT.placement,
      TEXT.orientationRule,
    ]);
    await tab(/Instructions/, 'recipe v1, instructions', [`${M} instructions`, `${M} acceptance`, `${M} cautions`]);
    await tab(/Comments/, 'recipe v1, comments', [LONG('review comment'), LONG('return comment')]);
    await tab(/Attachments/, 'recipe v1, attachments', [TEXT.caption]);
    await tab(/History/, 'recipe v1, history', [TEXT.changeReason]);
    await tab(/Checks/, 'recipe v1, checks');
    await tab(/Computed/, 'recipe v1, computed');
    await open('recipe v2 (in review)', recipe, M, [TEXT.title]);
    await open('withdrawn recipe', `/recipes/${scene.withdrawnId}`, M, [`${M} withdrawn ${vector('svg onload')}`, `${M} withdrawal`]);
    await open('compare v1 → v2', `${recipe}/compare?from=1&to=2`, M, [TEXT.title]);
    await open('compare inline', `${recipe}/compare?from=1&to=2&layout=inline`, M);
    await open('Today', '/today', 'Today');
    // The editor: locked while in review, then a new recipe on the hostile stock, whose
    // Markdown preview renders next to the raw text.
    await open('editor (locked, in review)', `${recipe}/edit`, M);
    await open('new recipe editor with the hostile stock', '/recipes/new', 'New recipe');
    await page.getByRole('combobox', { name: 'Material', exact: true }).click();
    await page.getByRole('option', { name: new RegExp(M) }).click();
    await page.getByTestId('material-facts').waitFor();
    await expectInert('editor, hostile material chosen', [TEXT.materialName]);
    await page.getByLabel('Steps for the operator').fill(LONG('typed in the editor'));
    await expectInert('editor, Markdown preview', [`${M} typed in the editor`]);
    await page.keyboard.press('Escape');
  });

  it('the stock screens show hostile names and notes as text', async () => {
    await as(author);
    for (const [path, texts] of [
      ['/stock/materials', [TEXT.materialName, TEXT.designation, TEXT.condition]],
      ['/stock/wheels', [TEXT.wheelName, `${M} wheel notes`]],
      ['/stock/machines', [TEXT.machineName]],
    ] as const) {
      await page.goto(`${BASE_URL}${path}`);
      await page.getByLabel('Search').fill(M);
      await page.getByText(M).first().waitFor();
      await expectInert(path, [...texts]);
    }
    await open('wheel selection', '/stock/wheel-selection', TEXT.wheelName, [TEXT.wheelName, TEXT.selectionNote]);
  });

  it('the approver’s review page of version 2', async () => {
    await as(approver);
    await open('review', `/recipes/${scene.recipeId}/review?v=2`, M, [TEXT.title, TEXT.changeReason, `${M} instructions v2`]);
  });

  it('the hostile operator: acknowledge, finder, cut log, specimen trace, check a sheet', async () => {
    await as(scene.operator);
    await open('acknowledge', `/recipes/${scene.recipeId}/acknowledge?v=1`, M, [TEXT.title, `${M} instructions`, `${M} cautions`]);
    const asOperator = await apiSignIn(scene.operator.username, scene.operator.password);
    await asOperator.post(`/api/recipes/${scene.recipeId}/versions/1/acknowledge`, {});
    await asOperator.post(`/api/recipes/${scene.recipeId}/versions/1/cuts`, {
      specimenId: TEXT.specimenId,
      partRef: TEXT.partRef,
      quantity: 1,
      outcome: 'other',
      notes: LONG('cut notes'),
    });
    await asOperator.close();
    await open('finder', '/finder?group=electronics-mixed&sizeMm=10', M, [TEXT.title]);
    await open('recipe as operator', `/recipes/${scene.recipeId}?v=1`, M, [TEXT.title, TEXT.materialName]);
    await tab(/Cuts/, 'recipe, cuts', [TEXT.specimenId, TEXT.partRef, TEXT.personName]);
    await open('specimen trace', `/cuts?specimen=${encodeURIComponent(TEXT.specimenId)}`, stamp, [
      TEXT.specimenId,
      TEXT.partRef,
      TEXT.personName,
      `${M} cut notes`,
    ]);
    await open('Today (operator)', '/today', 'Today');
    // The check code printed on the sheet, as its QR code opens it.
    const sheet = await page.request.get(`${BASE_URL}/api/recipes/${scene.recipeId}/versions/1/sheet.pdf`);
    expect(sheet.status()).to.equal(200);
    const code = /\b[0-9A-HJKMNP-TV-Z]{4}-[0-9A-HJKMNP-TV-Z]{4}\b/.exec(await readPdfText(await sheet.body()))?.[0];
    expect(code, 'check code on the sheet').to.be.a('string');
    await open('check a sheet', `/check/${code}`, scene.number, [TEXT.title]);
  });

  it('the mails the scene caused: HTML part rendered in chromium runs nothing, text reads as typed', async function () {
    if (!process.env['E2E_MAIL_DIR']) this.skip();
    await as(author);
    for (const [to, kind] of [
      [approver.email, /Review requested/],
      [author.email, /Returned/],
      [author.email, /Cut flagged/],
    ] as const) {
      const mail = await waitForMail(to, (m) => m.subject.includes(M) && kind.test(m.subject));
      expect(mail.html, `HTML part of "${mail.subject}"`).to.be.a('string');
      await page.setContent(mail.html!);
      await expectInert(`mail "${mail.subject}"`, [TEXT.title]);
      expect(compact(mail.text)).to.contain(compact(TEXT.title));
    }
  });

  it('the author sees the hostile operator on the acknowledgements and cuts tabs', async () => {
    await as(author);
    await open('recipe v1 again', `/recipes/${scene.recipeId}?v=1`, M);
    await tab(/Acknowledgements/, 'acknowledgements', [TEXT.personName]);
    await tab(/Cuts/, 'cuts', [TEXT.personName, TEXT.specimenId]);
  });

  it('the auditor’s trail and the admin’s people list and outbox', async () => {
    await as(auditor);
    await open('trail', `/trail?recipe=${scene.number}`, scene.number);
    await as(admin);
    await page.goto(`${BASE_URL}/people`);
    await page.getByLabel('Search').fill(stamp);
    await page.getByText(TEXT.personName).first().waitFor();
    await expectInert('people', [TEXT.personName]);
    await open('outbox', '/outbox', 'Outbox');
    await open('trail (admin)', `/trail?recipe=${scene.number}`, scene.number);
  });

  it('the bench sheet PDF carries every vector as plain text and no PDF action', async () => {
    const context = await browser.newContext();
    const p = await context.newPage();
    await signIn(p, author.username, author.password);
    await p.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    const res = await p.request.get(`${BASE_URL}/api/recipes/${scene.recipeId}/versions/1/sheet.pdf`);
    expect(res.status()).to.equal(200);
    const pdf = await res.body();
    await context.close();
    const raw = pdf.toString('latin1');
    expect(raw, 'PDF JavaScript').to.not.match(/\/(JavaScript|JS|Launch|SubmitForm|ImportData)\b/);
    expect(raw, 'PDF links to script').to.not.match(/\/URI\s*\(\s*(javascript|data|file):/i);
    const text = compact(await readPdfText(pdf));
    for (const t of [TEXT.title, TEXT.materialName, TEXT.machineName, TEXT.wheelName, TEXT.placement, TEXT.orientationRule]) {
      expect(text, `"${t}" on the sheet`).to.contain(compact(t));
    }
    // Markdown fields: HTML is printed as typed (entities decoded, links as text and address).
    for (const field of ['instructions', 'acceptance', 'cautions']) expect(text).to.contain(compact(`${M} ${field}`));
    const literal = VECTORS.filter((v) => !v.text.includes('&#') && !/^!?\[/.test(v.text));
    const missing = literal.filter((v) => !text.includes(compact(v.text))).map((v) => `${v.name}: ${v.text}`);
    expect(missing, 'vectors not printed as typed').to.deep.equal([]);
  });
});
