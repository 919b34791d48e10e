import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTabGroupHarness } from '@angular/material/tabs/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { CutRecordDto, RecipeVersionDto, SignatureDto, VersionWorkflowDto } from '@shared/recipe-types';
import type { Role } from '@shared/roles';
import type { DateFormat } from '@shared/vocabulary';
import { aLabLimits, aMachine, aMaterial, aRecipeVersion, aWheel } from '../../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../../testing/user-fixture';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { RecipePage } from './recipe-page';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

@Component({ template: 'elsewhere' })
class Elsewhere {}

describe('RecipePage', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let router: Router;

  const draft: RecipeVersionDto = aRecipeVersion({
    version: 2,
    status: 'draft',
    contentHash: null,
    checks: [
      {
        id: 'feed-ceiling',
        severity: 'warning',
        message: 'Feed 0.5 mm/s is above the lab ceiling of 0.3 mm/s.',
        reason: 'Start low and raise with experience (common practice).',
        path: 'cutting.feedMmS',
      },
      { id: 'rim-note', severity: 'note', message: 'Lowering rpm only helps consumable wheels.', reason: 'Common practice.', path: null },
      {
        id: 'wheel-overspeed',
        severity: 'blocker',
        message: 'The wheel would run at 94 m/s; it is marked for 80 m/s.',
        reason: 'EN 12413: never exceed the marked speed.',
        path: 'cutting.wheelRpm',
      },
    ],
    attachments: [
      {
        id: 11,
        role: 'setup',
        caption: 'Bar in the vise, clamps both sides',
        fileName: 'setup.jpg',
        mimeType: 'image/jpeg',
        sizeBytes: 120_000,
        sha256: 'b'.repeat(64),
        width: 1600,
        height: 1200,
        url: '/api/attachments/11',
        thumbnailUrl: '/api/attachments/11/thumbnail',
      },
    ],
  });
  const approved: RecipeVersionDto = aRecipeVersion({ version: 1, status: 'approved' });

  /** `dateFormat`: the lab's date format, as the settings request would answer it. */
  async function open(url: string, roles: Role[] = ['author'], dateFormat: DateFormat = 'iso'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'recipes/:id', component: RecipePage },
            { path: '**', component: Elsewhere },
          ],
          withComponentInputBinding(),
        ),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(dateFormat),
        { provide: Session, useValue: { user: signal(aUser({ roles })), roles: signal(roles), clear: vi.fn() } },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
  }

  async function answerVersions(versions: RecipeVersionDto[]): Promise<void> {
    (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions' }))).flush(versions);
  }

  async function answerStock(): Promise<void> {
    (await vi.waitFor(() => backend.expectOne('/api/materials/5'))).flush(aMaterial());
    backend.expectOne('/api/wheels/2').flush(aWheel());
    backend.expectOne('/api/machines/1').flush(aMachine());
    backend.expectOne('/api/settings/limits').flush(aLabLimits());
    await harness.fixture.whenStable();
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  /** An operator's page asks the shown approved version whether they must still acknowledge it (the list does not say). */
  async function answerMine(version: RecipeVersionDto): Promise<void> {
    (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: `/api/recipes/3/versions/${version.version}` }))).flush({
      ...version,
      myAcknowledgement: null,
    });
    await harness.fixture.whenStable();
  }

  afterEach(() => {
    backend.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((el) => (el.innerHTML = ''));
  });

  it('shows the marking as marked, the restriction marks, and the cautions a titanium recipe calls for with their basis', async () => {
    await open('/recipes/3');
    const ti = aRecipeVersion({ version: 1, status: 'approved' });
    ti.content = { ...ti.content, scope: { ...ti.content.scope, group: 'titanium' } };
    await answerVersions([ti]);
    (await vi.waitFor(() => backend.expectOne('/api/materials/5'))).flush(aMaterial({ name: 'Ti-6Al-4V', group: 'titanium', combustibleFines: true }));
    backend.expectOne('/api/wheels/2').flush(aWheel({ restrictions: ['no-side-grinding'] }));
    backend.expectOne('/api/machines/1').flush(aMachine());
    backend.expectOne('/api/settings/limits').flush(aLabLimits());
    await harness.fixture.whenStable();

    // 60 000·80/(π·250) = 6111.5 rpm, floored.
    expect(root().querySelector('[data-testid="marked-maximum"]')!.textContent!.trim()).toBe('80 m/s (marked) · 6111 rpm at 250 mm');
    expect(root().querySelector('[data-testid="restrictions"]')!.textContent!.trim()).toBe('Not for side grinding');
    await (await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness)).selectTab({ label: 'Instructions' });
    const cautions = root().querySelector('kb-standard-cautions')!;
    const fire = cautions.querySelector('[data-caution="combustible-fines"]')!.textContent!;
    expect(fire).toContain('Metal fines that can burn');
    expect(fire).toContain('Basis: NFPA 484');
    // A bonded wheel: its standard is EN 12413, not the superabrasive EN 13236.
    expect(cautions.textContent).toContain('EN 12413');
    expect(cautions.textContent).not.toContain('EN 13236');
  });

  it('shows the newest version with its header, stock names and tabs', async () => {
    await open('/recipes/3');
    await answerVersions([draft, approved]);
    await answerStock();

    const header = root().querySelector('header')!.textContent!;
    expect(header).toContain('KB-0003');
    expect(header).toContain('Tempered bar, transverse');
    expect(header).toContain('Draft');
    expect(header).toContain('Version 2 ');
    const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
    const labels = await Promise.all((await tabs.getTabs()).map((t) => t.getLabel()));
    expect(labels.map((l) => l.replace(/\d+/g, '').trim())).toEqual([
      'Parameters',
      'Computed',
      'Checks',
      'Instructions',
      'Attachments ()',
      'Comments',
      'History',
      'Cuts',
    ]);

    const parameters = root().querySelector('.kb-cards')!.textContent!;
    expect(parameters).toContain('Tempered chromium-molybdenum steel');
    expect(parameters).toContain('Bench saw B2');
    expect(parameters).toContain('A60K5B');
    expect(parameters).toContain('3000 rpm');
    expect(parameters).toContain('0.50 mm/s');
    expect(parameters).toContain('Vise with backstop');
    expect(parameters).toContain('5 % v/v');
    // The standard cautions sit once on the page, in the Instructions tab beside the recipe's own,
    // with the line that local rules take precedence.
    expect(root().querySelector('kb-standard-cautions')).toBeNull();
    await tabs.selectTab({ label: 'Instructions' });
    expect(root().querySelectorAll('kb-standard-cautions')).toHaveLength(1);
    expect(root().querySelector('kb-standard-cautions')!.textContent).toContain("the machine's manual and the lab's licensed safety practice take precedence");
  });

  it('shows the cut motion’s settings under Speeds and motion, and "not given" for content stored without them', async () => {
    await open('/recipes/3');
    const pulsed = aRecipeVersion({ version: 2, status: 'draft' });
    pulsed.content = { ...pulsed.content, cutting: { ...pulsed.content.cutting, cutMotion: 'pulsed-plunge', pulseAdvanceMm: 0.5, pulseRetractMm: 0.2 } };
    // Version 1 as an older Kerfbook stored it: a rocking cut, no setting keys at all.
    const older = aRecipeVersion({ version: 1, status: 'approved' });
    const { rockingAngleDeg: _a, rockingStrokeMm: _s, ...cuttingWithout } = { ...older.content.cutting, cutMotion: 'rocking' as const };
    older.content = { ...older.content, cutting: cuttingWithout as typeof older.content.cutting };
    await answerVersions([pulsed, older]);
    await answerStock();
    const speeds = root().querySelector('[aria-labelledby="kb-speeds"]')!;
    const rows = Array.from(speeds.querySelectorAll('dt')).map((dt) => `${dt.textContent!.trim()}: ${dt.nextElementSibling!.textContent!.trim()}`);
    expect(rows.slice(-3)).toEqual(['Cut motion: Pulsed plunge', 'Advance per pulse: 0.50 mm', 'Retract per pulse: 0.20 mm']);
    expect(speeds.querySelector('[data-testid="motion-settings-missing"]')).toBeNull();

    await harness.navigateByUrl('/recipes/3?v=1');
    await harness.fixture.whenStable();
    await vi.waitFor(() => expect(root().querySelector('[data-testid="motion-settings-missing"]')?.textContent).toBe('Not given'));
    expect(root().querySelector('[data-testid="motion-pulseAdvanceMm"]')).toBeNull();
  });

  it('shows the standard cautions once, in the Instructions tab only, not under every tab', async () => {
    await open('/recipes/3');
    await answerVersions([draft, approved]);
    await answerStock();
    const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
    const found: string[] = [];
    for (const label of ['Parameters', 'Computed', 'Checks', 'Instructions']) {
      await tabs.selectTab({ label: new RegExp(`^${label}`) });
      const count = root().querySelectorAll('kb-standard-cautions').length;
      if (count) found.push(`${label}: ${count}`);
    }
    expect(found).toEqual(['Instructions: 1']);
  });

  it('lists the checks worst first, each with an icon and a word for its severity', async () => {
    await open('/recipes/3');
    await answerVersions([draft, approved]);
    await answerStock();
    const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
    await tabs.selectTab({ label: /Checks/ });
    await harness.fixture.whenStable();

    const items = Array.from(root().querySelectorAll<HTMLElement>('.kb-check'));
    expect(items.map((i) => i.dataset['severity'])).toEqual(['blocker', 'warning', 'note']);
    expect(items.map((i) => i.querySelector('kb-check-severity span')!.textContent)).toEqual(['Blocker', 'Warning', 'Note']);
    expect(items.map((i) => i.querySelector('kb-check-severity mat-icon')!.textContent)).toEqual(['block', 'warning', 'info']);
    expect(items[0].textContent).toContain('The wheel would run at 94 m/s; it is marked for 80 m/s.');
    expect(items[0].textContent).toContain('EN 12413: never exceed the marked speed.');
  });

  it('computes peripheral speed and margin from the wheel and rpm', async () => {
    await open('/recipes/3');
    await answerVersions([draft, approved]);
    await answerStock();
    const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
    // The page asked for the lab's limits once (answerStock); the tab's blocks share that answer.
    await tabs.selectTab({ label: 'Computed' });
    await harness.fixture.whenStable();

    // π × 250 mm × 3000 rpm / 60 000 = 39.27 m/s; 80 − 39.27 = 40.73 m/s to spare.
    const values = root().querySelector('.kb-values')!.textContent!;
    expect(values).toMatch(/Peripheral speed\s*39\.3 m\/s/);
    expect(values).toMatch(/Margin to the marked maximum\s*40\.7 m\/s/);
    // (250 − 80)/2 − 5 = 80 mm for the Ø40 bar, by the wheel's radius beyond the flange.
    expect(root().querySelector('[data-testid="capacity"]')!.textContent).toContain('Limit: Wheel radius beyond the flange');
    // Worn to the lab's 70 %: 175 mm, (175 − 80)/2 − 5 = 42.5 mm; kerf 1.5 + 0.2 mm. Computed by hand.
    const worn = root().querySelector('[data-testid="worn-wheel"]')!.textContent!.replace(/\s+/g, ' ');
    expect(worn).toContain('175 mm');
    expect(worn).toContain('Up to 42.5 mm');
    expect(worn).toContain('1.70 mm');
  });

  it("shows the cutting power figures and plot with the lab's specific energy, as the editor does", async () => {
    await open('/recipes/3');
    await answerVersions([draft, approved]);
    (await vi.waitFor(() => backend.expectOne('/api/materials/5'))).flush(aMaterial());
    backend.expectOne('/api/wheels/2').flush(aWheel());
    backend.expectOne('/api/machines/1').flush(aMachine({ motorPowerKw: 2.2 }));
    backend.expectOne('/api/settings/limits').flush(aLabLimits({ specificEnergyJMm3: { 'plain-low-alloy-steel': 30 } }));
    await harness.fixture.whenStable();
    const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
    await tabs.selectTab({ label: 'Computed' });
    await harness.fixture.whenStable();

    // Ø40 bar, 1.5 mm wheel, 0.5 mm/s: Q = 30 mm³/s; × 30 J/mm³ = 900 W (P = Q·u, Malkin & Guo), 41 % of 2.2 kW;
    // F_t = 900 / 39.27 = 22.9 N; h_eq = (30 / 1.5) / 39.27 = 0.509 µm — computed by hand.
    const block = root().querySelector('kb-recipe-cut-power')!;
    const text = block.textContent!.replace(/\s+/g, ' ');
    expect(text).toContain('Cutting power and heat');
    expect(text).toContain('Peak cutting power 900 W');
    expect(text).toContain('41 % of the 2.20 kW motor');
    expect(text).toContain('22.9 N');
    expect(text).toContain('0.509 µm');
    expect(text).toContain('30 J/mm³');
    expect(block.querySelector('kb-cut-power-plot path[data-series="power"]')).not.toBeNull();
  });

  it('offers "Edit draft" to an author on a draft, not on an older approved version', async () => {
    await open('/recipes/3');
    await answerVersions([draft, approved]);
    await answerStock();
    expect(root().querySelector('a[href="/recipes/3/edit"]')?.textContent).toContain('Edit draft');

    await harness.navigateByUrl('/recipes/3?v=1');
    await harness.fixture.whenStable();
    expect(root().querySelector('header')!.textContent).toContain('Approved');
    expect(root().querySelector('header')!.textContent).toContain('(not the latest)');
    expect(root().querySelector('a[href="/recipes/3/edit"]')).toBeNull();
    expect(router.url).toBe('/recipes/3?v=1');
  });

  it('shows no "Edit draft" to an operator', async () => {
    await open('/recipes/3', ['operator']);
    await answerVersions([draft, approved]);
    await answerStock();
    expect(root().querySelector('a[href="/recipes/3/edit"]')).toBeNull();
  });

  it('says so when the recipe does not exist', async () => {
    await open('/recipes/3');
    (await vi.waitFor(() => backend.expectOne('/api/recipes/3/versions'))).flush(
      { code: 'NOT_FOUND', errors: [{ path: '', message: 'No such recipe.' }] },
      { status: 404, statusText: 'Not Found' },
    );
    await harness.fixture.whenStable();
    expect(root().querySelector('h1')!.textContent).toBe('Recipe not found');
    expect(TestBed.inject(Notifier).show).not.toHaveBeenCalled();
  });

  describe('workflow', () => {
    const signature: SignatureDto = {
      id: 40,
      signerName: 'Tomas Berg',
      signerId: 9,
      meaning: 'approved',
      comment: 'Fine for the bench saws.',
      signedAt: '2026-11-03T14:05:00.000Z',
      contentHash: 'c0ffee'.repeat(10) + 'abcd',
    };
    const workflow = (overrides: Partial<VersionWorkflowDto> = {}): VersionWorkflowDto => ({
      signatures: [],
      effectiveFrom: null,
      reviewDueOn: null,
      submittedAt: null,
      supersededAt: null,
      withdrawnAt: null,
      withdrawnReason: null,
      editorIds: [7],
      ...overrides,
    });
    const approvedV1 = aRecipeVersion({
      version: 1,
      status: 'approved',
      workflow: workflow({ signatures: [signature], submittedAt: '2026-11-01T09:00:00.000Z', effectiveFrom: '2026-11-04', reviewDueOn: '2028-11-04' }),
    });
    const cleanDraft = aRecipeVersion({ version: 2, status: 'draft', revision: 6, contentHash: null, checks: [], workflow: workflow() });

    function button(name: RegExp): HTMLButtonElement | undefined {
      return Array.from(root().querySelectorAll<HTMLButtonElement>('header button, header a')).find((b) => name.test(b.textContent ?? '')) as
        HTMLButtonElement | undefined;
    }

    it('shows every signature in the header: printed name, UTC date and time, meaning, comment and short content hash', async () => {
      await open('/recipes/3', ['operator']);
      await answerVersions([approvedV1]);
      await answerStock();
      await answerMine(approvedV1);

      const item = root().querySelector('header .kb-signature')!;
      const text = item.textContent!.replace(/\s+/g, ' ');
      expect(text).toContain('Approved by Tomas Berg on 2026-11-03 14:05 UTC');
      expect(text).toContain('I have reviewed this version and approve it for use');
      expect(text).toContain('“Fine for the bench saws.”');
      expect(item.querySelector('code')!.textContent).toBe('c0ffeec0ffee…');
      expect(item.querySelector('code')!.getAttribute('title')).toBe(signature.contentHash);
      expect(root().querySelector('[data-testid="workflow-facts"]')!.textContent).toContain('Effective from 2026-11-04');
      // An operator gets no workflow action.
      expect(button(/Submit for review|Start a new version|Review|Withdraw/)).toBeUndefined();
    });

    it('keeps "Submit for review" disabled and lists the blockers while they stand', async () => {
      await open('/recipes/3');
      await answerVersions([draft, approved]);
      await answerStock();

      expect(button(/Submit for review/)!.disabled).toBe(true);
      const blockers = root().querySelector('[data-testid="submit-blockers"]')!.textContent!;
      expect(blockers).toContain('The wheel would run at 94 m/s; it is marked for 80 m/s.');
      expect(blockers).not.toContain('Feed 0.5 mm/s');
    });

    it('submits a blocker-free draft with the revision the author saw, and shows the answer', async () => {
      await open('/recipes/3');
      await answerVersions([cleanDraft, approvedV1]);
      await answerStock();

      button(/Submit for review/)!.click();
      const submit = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/submit' }));
      expect(submit.request.body).toEqual({ revision: 6 });
      submit.flush({ ...cleanDraft, status: 'in-review', revision: 7, workflow: workflow({ submittedAt: '2026-11-20T08:00:00.000Z' }) });
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions' }))).flush([
        { ...cleanDraft, status: 'in-review', revision: 7 },
        approvedV1,
      ]);
      await harness.fixture.whenStable();
      expect(root().querySelector('header kb-recipe-status-chip')!.textContent).toContain('In review');
      expect(button(/Submit for review/)).toBeUndefined();
    });

    it('lists the blockers the server names when it refuses the submission', async () => {
      await open('/recipes/3');
      await answerVersions([cleanDraft, approvedV1]);
      await answerStock();

      button(/Submit for review/)!.click();
      (await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/submit' }))).flush(
        { code: 'BLOCKERS', errors: [{ path: 'cutting.machineId', message: 'No machine is chosen.' }] },
        { status: 409, statusText: 'Conflict' },
      );
      await harness.fixture.whenStable();
      expect(root().querySelector('[data-testid="submit-error"]')!.textContent).toContain('No machine is chosen.');
      expect(TestBed.inject(Notifier).show).not.toHaveBeenCalled();
    });

    it('offers an approver "Review" on a version in review and "Withdraw…" on an approved one, and no author action', async () => {
      const inReview = aRecipeVersion({ version: 2, status: 'in-review', workflow: workflow({ submittedAt: '2026-11-20T08:00:00.000Z' }) });
      await open('/recipes/3', ['approver']);
      await answerVersions([inReview, approvedV1]);
      await answerStock();

      expect(root().querySelector('header a[href="/recipes/3/review?v=2"]')!.textContent).toContain('Review');
      expect(button(/Withdraw/)).toBeUndefined();
      expect(button(/Submit for review|Start a new version/)).toBeUndefined();

      await harness.navigateByUrl('/recipes/3?v=1');
      await harness.fixture.whenStable();
      expect(button(/Withdraw/)).toBeDefined();
      expect(root().querySelector('header a[href^="/recipes/3/review"]')).toBeNull();
    });

    it('starts a new version from an approved one with a change reason and opens the editor', async () => {
      await open('/recipes/3');
      await answerVersions([approvedV1]);
      await answerStock();

      button(/Start a new version/)!.click();
      await harness.fixture.whenStable();
      const dialog = await vi.waitFor(() => {
        const el = document.querySelector<HTMLElement>('kb-reason-dialog');
        expect(el).not.toBeNull();
        return el!;
      });
      // The change reason is required: nothing is sent without it.
      dialog.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
      await harness.fixture.whenStable();
      backend.expectNone({ method: 'POST', url: '/api/recipes/3/versions' });
      expect(dialog.querySelector('[data-testid="text-error"]')!.textContent).toContain('required');

      const reason = dialog.querySelector<HTMLTextAreaElement>('textarea')!;
      reason.value = 'Slower feed for the harder batch.';
      reason.dispatchEvent(new Event('input'));
      dialog.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
      const create = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions' }));
      expect(create.request.body).toEqual({ fromVersion: 1, changeReason: 'Slower feed for the harder batch.' });
      create.flush(aRecipeVersion({ version: 2, status: 'draft', contentHash: null }), { status: 201, statusText: 'Created' });
      await vi.waitFor(() => expect(router.url).toBe('/recipes/3/edit'));
    });

    it('puts the approver’s comments in front of the author on a returned version', async () => {
      const returned = aRecipeVersion({ version: 2, status: 'returned', contentHash: 'd'.repeat(64), workflow: workflow() });
      await open('/recipes/3');
      await answerVersions([returned, approvedV1]);
      await answerStock();
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions/2/comments' }))).flush([
        { id: 1, authorName: 'Tomas Berg', authorId: 9, body: 'Feed is too high for this hardness.', path: '', createdAt: '2026-11-21T10:00:00.000Z' },
      ]);
      await harness.fixture.whenStable();
      const panel = root().querySelector('[data-testid="returned-comments"]')!;
      expect(panel.textContent).toContain('Returned with comments');
      expect(panel.textContent).toContain('Feed is too high for this hardness.');
      expect(panel.textContent).toContain('Tomas Berg');
    });

    it('lists every version in the History tab with its signatures and a link to compare with the one before', async () => {
      const superseded = aRecipeVersion({
        version: 1,
        status: 'superseded',
        workflow: workflow({ signatures: [signature], supersededAt: '2026-12-01T00:00:00.000Z' }),
      });
      const current = aRecipeVersion({
        version: 2,
        status: 'approved',
        content: { ...approvedV1.content, changeReason: 'Slower feed for the harder batch.' },
        workflow: workflow({ signatures: [{ ...signature, id: 41, signedAt: '2026-12-01T09:30:00.000Z' }] }),
      });
      await open('/recipes/3', ['auditor']);
      await answerVersions([current, superseded]);
      await answerStock();
      const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
      await tabs.selectTab({ label: 'History' });
      await harness.fixture.whenStable();

      const items = Array.from(root().querySelectorAll<HTMLElement>('.kb-history-item'));
      expect(items.map((i) => i.dataset['version'])).toEqual(['2', '1']);
      expect(items[0].textContent).toContain('Slower feed for the harder batch.');
      expect(items[0].textContent).toContain('2026-12-01 09:30 UTC');
      expect(Array.from(items[0].querySelectorAll('a')).map((a) => a.getAttribute('href'))).toContain('/recipes/3/compare?from=1&to=2');
      expect(items[1].textContent).toContain('Superseded');
      expect(items[1].querySelector('a[href="/recipes/3?v=1"]')).not.toBeNull();
      expect(items[1].querySelector('a[href*="compare"]')).toBeNull();
    });

    it("writes every date on the page and in History in the lab's format: 05.12.2026, no month names, no other order", async () => {
      const superseded = aRecipeVersion({
        version: 1,
        status: 'superseded',
        createdAt: '2026-10-02T08:00:00.000Z',
        workflow: workflow({
          signatures: [signature],
          submittedAt: '2026-11-01T09:00:00.000Z',
          effectiveFrom: '2026-11-04',
          supersededAt: '2026-12-05T00:00:00.000Z',
        }),
      });
      const current = aRecipeVersion({
        version: 2,
        status: 'approved',
        createdAt: '2026-11-20T08:00:00.000Z',
        workflow: workflow({
          signatures: [{ ...signature, id: 41, signedAt: '2026-12-05T14:05:00.000Z' }],
          submittedAt: '2026-12-04T16:30:00.000Z',
          effectiveFrom: '2026-12-05',
          reviewDueOn: '2028-12-05',
        }),
      });
      await open('/recipes/3', ['auditor'], 'dmy-dot');
      await answerVersions([current, superseded]);
      await answerStock();

      const header = root().querySelector('header')!.textContent!.replace(/\s+/g, ' ');
      expect(header).toContain('Approved by Tomas Berg on 05.12.2026 14:05 UTC');
      const facts = root().querySelector('[data-testid="workflow-facts"]')!.textContent!.replace(/\s+/g, ' ');
      expect(facts).toContain('Submitted 04.12.2026 16:30 UTC');
      expect(facts).toContain('Effective from 05.12.2026');
      expect(facts).toContain('Periodic review due 05.12.2028');

      const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
      await tabs.selectTab({ label: 'History' });
      await harness.fixture.whenStable();
      const items = Array.from(root().querySelectorAll<HTMLElement>('.kb-history-item')).map((i) => i.textContent!.replace(/\s+/g, ' '));
      // The facts are a <dl>: term and value touch in textContent.
      expect(items[0]).toContain('Created20.11.2026');
      expect(items[0]).toContain('Submitted04.12.2026');
      expect(items[0]).toContain('05.12.2026 14:05 UTC');
      expect(items[1]).toContain('Effective from04.11.2026');
      expect(items[1]).toContain('Superseded05.12.2026');

      const text = root().textContent!;
      expect(text).not.toMatch(
        /\b(Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)[a-z]* 20\d\d\b|\b\d{1,2} (Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)\b/,
      );
      expect(text).not.toMatch(/\b20\d\d-\d\d-\d\d\b/);
    });

    it('shows in the History tab each time a version was returned: who, when and the comment', async () => {
      const current = aRecipeVersion({
        version: 1,
        status: 'approved',
        workflow: workflow({
          signatures: [signature],
          returns: [
            { returnedAt: '2026-11-21T10:00:00.000Z', returnedBy: { id: 9, name: 'Tomas Berg' }, comment: 'Feed is too high for this hardness.' },
            { returnedAt: '2026-11-24T15:45:00.000Z', returnedBy: { id: 11, name: 'Aino Virta' }, comment: 'Give the clamp positions in mm.' },
          ],
        }),
      });
      await open('/recipes/3', ['auditor']);
      await answerVersions([current]);
      await answerStock();
      const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
      await tabs.selectTab({ label: 'History' });
      await harness.fixture.whenStable();

      const rounds = Array.from(root().querySelectorAll<HTMLElement>('.kb-history-item [data-testid="returned-round"]'));
      expect(rounds.map((r) => r.textContent!.replace(/\s+/g, ' ').trim())).toEqual([
        'Returned 2026-11-21 10:00 UTC by Tomas Berg: Feed is too high for this hardness.',
        'Returned 2026-11-24 15:45 UTC by Aino Virta: Give the clamp positions in mm.',
      ]);
      expect(root().querySelector('.kb-history-item')!.textContent).toContain('Returned to its author 2 times');
    });
  });

  describe('operator station', () => {
    const cut: CutRecordDto = {
      id: 71,
      recipeId: 3,
      number: 'KB-0003',
      version: 1,
      specimenId: 'SP-2026-118',
      partRef: 'Heat 44817',
      quantity: 2,
      outcome: 'burnt',
      notes: 'Blue tint on the lower half of the face.',
      operatorId: 12,
      operatorName: 'Kofi Mensah',
      cutAt: '2026-11-30T14:05:00.000Z',
      flagClearedAt: null,
    };

    it('offers an operator the bench sheet and Log a cut on the version in force', async () => {
      await open('/recipes/3', ['operator']);
      await answerVersions([approved]);
      await answerStock();
      await answerMine(approved);
      const sheet = root().querySelector<HTMLAnchorElement>('[data-testid="print-sheet"]')!;
      expect(sheet.textContent).toContain('Print bench sheet');
      expect(sheet.getAttribute('href')).toBe('/api/recipes/3/versions/1/sheet.pdf');
      expect(sheet.getAttribute('target')).toBe('_blank');
      const buttons = Array.from(root().querySelectorAll('header button')).map((b) => b.textContent!.trim());
      expect(buttons.some((b) => b.endsWith('Log a cut'))).toBe(true);
    });

    it('has no bench sheet for a draft and no Log a cut for an author', async () => {
      await open('/recipes/3', ['author']);
      await answerVersions([aRecipeVersion({ version: 2, status: 'draft' }), approved]);
      await answerStock();
      expect(root().querySelector('[data-testid="print-sheet"]')).toBeNull();
      expect(root().textContent).not.toContain('Log a cut');
    });

    it('opens the Cuts tab from ?tab=cuts on the version in force and lists its cuts', async () => {
      await open('/recipes/3?tab=cuts', ['author']);
      await answerVersions([aRecipeVersion({ version: 2, status: 'draft' }), approved]);
      await answerStock();
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions/1/cuts' }))).flush([
        cut,
        { ...cut, id: 70, specimenId: 'SP-2026-117', outcome: 'good', notes: '', partRef: '' },
      ]);
      await harness.fixture.whenStable();

      const rows = Array.from(root().querySelectorAll<HTMLElement>('tr[data-cut]'));
      expect(rows.map((r) => r.dataset['cut'])).toEqual(['71', '70']);
      const first = rows[0].textContent!;
      expect(first).toContain('2026-11-30 14:05 UTC');
      expect(first).toContain('SP-2026-118');
      expect(first).toContain('Heat 44817');
      expect(first).toContain('Discoloured or burnt');
      expect(first).toContain('Kofi Mensah');
      expect(first).toContain('Blue tint on the lower half of the face.');
      expect(rows[1].textContent).toContain('Good');
      expect(root().querySelector('[data-testid="cuts-csv"]')!.getAttribute('href')).toBe('/api/recipes/3/versions/1/cuts.csv');

      const seen = rows[0].querySelector('button')!;
      expect(seen.getAttribute('aria-label')).toBe('Mark the cut of specimen SP-2026-118 as seen');
      expect(rows[1].querySelector('button')).toBeNull();
      seen.click();
      backend.expectOne({ method: 'POST', url: '/api/cuts/71/clear-flag' }).flush({ ...cut, flagClearedAt: '2026-12-01T08:00:00.000Z' });
      await harness.fixture.whenStable();
      expect(root().querySelector('tr[data-cut="71"] button')).toBeNull();
      expect(root().querySelector('tr[data-cut="71"]')!.textContent).toContain('Seen 2026-12-01');
    });
  });
});
