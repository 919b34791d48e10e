/// <reference lib="dom" />
/**
 * The machine's top speed against the wheel's marked maximum, in chromium (OSHA 29 CFR
 * 1910.215(d)(1): the spindle speed is checked before a wheel is mounted). An author picks a
 * wheel the machine can over-speed and sees the blocker with its reason; Stock shows the same
 * mismatch on the wheel and on the machine; the bench sheet of an approved recipe carries
 * "never above N rpm on this machine" beside the rpm (read from the PDF's text).
 */
import { expect } from 'chai';
import type { Browser } from 'playwright-core';
import type { Page as ListPage } from '../../shared/api-types';
import type { RecipeSummary, RecipeVersionDto } from '../../shared/recipe-types';
import { neverAboveRpm } from '../../shared/spindle-speed';
import type { MachineRecord, WheelRecord } from '../../shared/stock-types';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { type ApiSession, apiSignIn } from './support/api';
import { BASE_URL, type WatchedPage, launch, openPage, screenshot } from './support/browser';
import { readPdfText } from './support/pdf-text';
import { choose, signIn, unexpectedErrors } from './support/steps';

const author = DEMO_ACCOUNTS.find((a) => a.roles.includes('author'))!;
const SAW = 'Clean-room precision saw';
// A 200 mm blade marked 4400 rpm: the saw's spindle limit (4500 rpm in the demo) is above it.
const bladeName = `E2E blade 200 marked 4400 rpm ${Date.now().toString(36)}`;

describe('machine speed against the wheel marking, in chromium', () => {
  let browser: Browser;
  let w: WatchedPage;
  let api: ApiSession;
  let blade: WheelRecord;

  before(async () => {
    api = await apiSignIn(author.username, author.password);
    blade = await api.post<WheelRecord>('/api/wheels', {
      name: bladeName,
      kind: 'rim',
      specification: 'D151N100M',
      diameterMm: 200,
      thicknessMm: 0.8,
      boreMm: 12.7,
      maxSpeedMarkedIn: 'rpm',
      maxSpeedRpm: 4400,
      restrictions: ['wet-use-only'],
      notes: 'Added by the over-speed journey; archived at its end.',
    });
    browser = await launch();
    w = await openPage(browser, { width: 1440, height: 1000 });
    await signIn(w.page, author.username, author.password);
    await w.page.waitForURL(/\/today/);
  });

  after(async () => {
    // Archived, not left on offer for the other journeys.
    if (blade) await api.post(`/api/wheels/${blade.id}/archive`);
    await api?.close();
    await browser?.close();
  });

  it('an author picks a wheel the machine can over-speed and sees the blocker with its reason; a safe wheel clears it', async () => {
    const { page } = w;
    await page.goto(`${BASE_URL}/recipes/new`);
    await page.getByLabel('Title', { exact: true }).fill('Over-speed probe (e2e)');
    await choose(page, 'Material', /Alumina 99\.5/);
    await page.getByLabel('Smallest size').fill('5');
    await page.getByLabel('Largest size').fill('20');
    await choose(page, 'Machine', new RegExp(SAW));
    await choose(page, 'Wheel', new RegExp(bladeName));
    await choose(page, 'Clamping method', /Adhesive or wax mount/);
    await page.getByLabel('Feed', { exact: true }).fill('0.05');
    await page.getByLabel('Concentration').fill('3');
    // 3000 rpm is well within the blade's marking: only the machine can over-speed it.
    await page.getByLabel('Wheel speed').fill('3000');

    const blocker = page.getByRole('button', { name: /Blocker.*limited to 4500 rpm.*above the 4400 rpm marked/ });
    await blocker.waitFor();
    const said = await blocker.innerText();
    expect(said).to.match(/Have a spindle speed limit at or below 4400 rpm/);
    expect(said).to.match(/OSHA 29 CFR 1910\.215\(d\)\(1\)/);
    // A diamond blade: its European standard is the superabrasive one.
    expect(said).to.match(/EN 13236/);
    expect(await page.getByTestId('never-above').innerText()).to.match(/Never above 4400 rpm/);
    expect(await page.getByTestId('marked-maximum').innerText()).to.equal('4400 rpm (marked) · 46.1 m/s at 200 mm');
    await screenshot(page, '40-editor-machine-overspeeds-wheel');

    await choose(page, 'Wheel', /Diamond rim 200 metal bond/);
    await blocker.waitFor({ state: 'detached' });
    await page.getByTestId('no-blockers').waitFor();
    expect(unexpectedErrors(w.consoleErrors), 'console errors').to.deep.equal([]);
  });

  it('Stock shows the mismatch on the wheel and on the machine', async () => {
    const { page } = w;
    await page.goto(`${BASE_URL}/stock/wheels`);
    const wheelRow = page.getByRole('row', { name: new RegExp(bladeName) });
    await wheelRow.waitFor();
    const onWheel = await wheelRow.getByTestId('overspeed').innerText();
    expect(onWheel).to.match(new RegExp(`${SAW} can turn it to 4500 rpm \\(its spindle limit\\)`));
    expect(await wheelRow.getByTestId('restrictions').innerText()).to.match(/For wet use only/);
    await screenshot(page, '41-stock-wheels-overspeed');

    await page.goto(`${BASE_URL}/stock/machines`);
    const sawRow = page.getByRole('row', { name: new RegExp(SAW) });
    await sawRow.waitFor();
    expect(await sawRow.getByTestId('spindle-limit').innerText()).to.match(/limited to 4500 rpm, set by Maintenance, work order 2291/);
    expect(await sawRow.getByTestId('overspeed').innerText()).to.match(new RegExp(`Can turn ${bladeName} to 4500 rpm`));
    await screenshot(page, '42-stock-machines-overspeed');
  });

  it('the bench sheet of an approved recipe carries "never above N rpm on this machine" beside the rpm', async () => {
    const { page } = w;
    // An approved demo recipe on the precision saw: N is the lower of the wheel's marking and the saw's 4500 rpm limit.
    const list = await api.get<ListPage<RecipeSummary>>('/api/recipes?status=approved&pageSize=100');
    const onSaw = list.items.find((r) => r.machineName === SAW);
    expect(onSaw, 'an approved demo recipe on the precision saw').to.not.equal(undefined);
    const versions = await api.get<RecipeVersionDto[]>(`/api/recipes/${onSaw!.id}/versions`);
    const v = versions.find((x) => x.status === 'approved')!;
    const machine = await api.get<MachineRecord>(`/api/machines/${v.content.cutting.machineId}`);
    const wheel = await api.get<WheelRecord>(`/api/wheels/${v.content.cutting.wheelId}`);
    const n = neverAboveRpm(machine, wheel);
    expect(n).to.equal(4500);

    await page.goto(`${BASE_URL}/recipes/${v.recipeId}`);
    const print = page.getByTestId('print-sheet');
    await print.waitFor();
    const href = (await print.getAttribute('href'))!;
    const sheet = await page.request.get(new URL(href, BASE_URL).toString());
    expect(sheet.status()).to.equal(200);
    const text = (await readPdfText(await sheet.body())).replace(/\s+/g, ' ');
    expect(text).to.include(`${v.content.cutting.wheelRpm} rpm never above ${n} rpm on this machine`);
    await screenshot(page, '43-recipe-page-never-above');
  });
});
