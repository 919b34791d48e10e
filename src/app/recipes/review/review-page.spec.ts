import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { RecipeComparison, RecipeVersionDto } from '@shared/recipe-types';
import { aLabLimits, aMachine, aMaterial, aRecipeVersion, aWheel } from '../../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../../testing/user-fixture';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { ReviewPage, comparisonBase } from './review-page';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

@Component({ template: 'elsewhere' })
class Elsewhere {}

const APPROVER_ID = 9;

describe('ReviewPage', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let router: Router;

  const workflow = (editorIds: number[]) => ({
    signatures: [],
    effectiveFrom: null,
    reviewDueOn: null,
    submittedAt: '2026-11-20T08:00:00.000Z',
    supersededAt: null,
    withdrawnAt: null,
    withdrawnReason: null,
    editorIds,
  });
  const inReview: RecipeVersionDto = aRecipeVersion({
    version: 2,
    status: 'in-review',
    revision: 11,
    contentHash: 'f'.repeat(64),
    content: { ...aRecipeVersion().content, instructionsMd: '1. Clamp **both** sides.', changeReason: 'Harder batch from the new supplier.' },
    checks: [
      {
        id: 'feed-heat-sensitive',
        severity: 'warning',
        message: 'Feed 0.5 mm/s is fast for a heat-sensitive material.',
        reason: 'Common practice.',
        path: 'cutting.feedMmS',
      },
      { id: 'rim-low-rpm', severity: 'note', message: 'Lower rpm only helps consumable wheels.', reason: 'Common practice.', path: null },
      {
        id: 'coolant-concentration',
        severity: 'warning',
        message: 'Coolant at 8 % is above the usual 2–5 %.',
        reason: 'Common practice.',
        path: 'coolant.concentrationPct',
      },
    ],
    workflow: workflow([7]),
  });
  const approvedV1: RecipeVersionDto = aRecipeVersion({ version: 1, status: 'approved', workflow: { ...workflow([7]), submittedAt: null } });
  const comparison: RecipeComparison = {
    recipeId: 3,
    number: 'KB-0003',
    from: { version: 1, status: 'approved', title: 'Tempered bar, transverse' },
    to: { version: 2, status: 'in-review', title: 'Tempered bar, transverse' },
    parameters: [{ path: 'cutting.feedMmS', label: 'Feed', before: '0.30 mm/s', after: '0.50 mm/s' }],
    texts: [{ path: 'instructionsMd', label: 'Instructions', parts: [{ value: '1. Clamp ' }, { value: 'both ', added: true }, { value: 'sides.' }] }],
  };

  async function open(url: string, userId = APPROVER_ID): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'recipes/:id/review', component: ReviewPage },
            { path: '**', component: Elsewhere },
          ],
          withComponentInputBinding(),
        ),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        {
          provide: Session,
          useValue: {
            user: signal(aUser({ id: userId, displayName: 'Tomas Berg', roles: ['approver'] })),
            roles: signal(['approver']),
            signatureNeedsUsername: signal(false),
            noteFullSigning: vi.fn(),
            noteUsernameNeeded: vi.fn(),
            clear: vi.fn(),
          },
        },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
  }

  /** Answers the page's requests: versions, stock names, the comparison and the comments. */
  async function answer(versions: RecipeVersionDto[], from: number | null = 1): Promise<void> {
    (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions' }))).flush(versions);
    (await vi.waitFor(() => backend.expectOne('/api/materials/5'))).flush(aMaterial());
    backend.expectOne('/api/wheels/2').flush(aWheel());
    backend.expectOne('/api/machines/1').flush(aMachine());
    // The computed figures use the lab's limits, as the recipe page's do.
    (await vi.waitFor(() => backend.expectOne('/api/settings/limits'))).flush(aLabLimits());
    if (from !== null) {
      (await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/recipes/3/compare'))).flush(comparison);
    }
    (await vi.waitFor(() => backend.expectOne('/api/recipes/3/versions/2/comments'))).flush([]);
    await harness.fixture.whenStable();
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  function buttonNamed(name: string, scope: ParentNode = root()): HTMLButtonElement {
    const found = Array.from(scope.querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.trim().includes(name));
    if (!found) throw new Error(`no button "${name}"`);
    return found;
  }

  async function dialogElement(selector: string): Promise<HTMLElement> {
    return vi.waitFor(() => {
      const el = document.querySelector<HTMLElement>(selector);
      // Rendered once its form and buttons are in.
      expect(el?.querySelector('button[type="submit"]')).toBeTruthy();
      return el!;
    });
  }

  afterEach(() => {
    backend.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((el) => (el.innerHTML = ''));
  });

  it('shows the version, its checks, the comparison with the version it replaces and the change reason', async () => {
    await open('/recipes/3/review?v=2');
    await answer([inReview, approvedV1]);
    // One comparison, against the approved version 1, and nothing else asked.
    expect(backend.match(() => true)).toEqual([]);

    const text = root().textContent!.replace(/\s+/g, ' ');
    expect(text).toContain('Review: Tempered bar, transverse');
    expect(text).toContain('Tempered chromium-molybdenum steel');
    expect(text).toContain('Harder batch from the new supplier.');
    expect(root().querySelector('kb-markdown-view strong')!.textContent).toBe('both');
    expect(Array.from(root().querySelectorAll<HTMLElement>('.kb-check')).map((c) => c.dataset['severity'])).toEqual(['warning', 'warning', 'note']);
    expect(root().querySelector('kb-comparison-view')!.textContent).toContain('0.50 mm/s');
    expect(root().querySelector('kb-comparison-view ins, kb-comparison-view .kb-added, kb-comparison-view [class*="added"]')).not.toBeNull();
  });

  it('names the cut motion with its settings in the summary', async () => {
    await open('/recipes/3/review?v=2');
    const traverse = {
      ...inReview,
      content: { ...inReview.content, cutting: { ...inReview.content.cutting, cutMotion: 'traverse-pass' as const, depthPerPassMm: 0.5, passes: 40 } },
    };
    await answer([traverse, approvedV1]);
    const rows = Array.from(root().querySelectorAll('.kb-summary dt')).map((dt) => `${dt.textContent!.trim()}: ${dt.nextElementSibling!.textContent!.trim()}`);
    expect(rows).toContain('Cut motion: Traverse pass: depth per pass 0.50 mm, 40 passes');
  });

  /** The summary's value for a label, whitespace collapsed. */
  function summaryValue(label: string): string | undefined {
    const terms = Array.from(root().querySelectorAll<HTMLElement>('.kb-summary dt'));
    const term = terms.find((dt) => dt.textContent?.trim() === label);
    return term?.nextElementSibling?.textContent?.replace(/\s+/g, ' ').trim();
  }

  it('summarises the peripheral speed with its margin, the clamp placement and the entry, computed as the recipe page does', async () => {
    const withEntry: RecipeVersionDto = {
      ...inReview,
      content: {
        ...inReview.content,
        cutting: { ...inReview.content.cutting, entryFeedMmS: 0.2, entryLengthMm: 5 },
        clamping: { ...inReview.content.clamping, placement: 'Both sides, 10 mm from the cut' },
      },
    };
    await open('/recipes/3/review?v=2');
    await answer([withEntry, approvedV1]);
    // 250 mm wheel at 3000 rpm: v = π · 0.250 m · 3000 / 60 s = 39.27 m/s (v = π·D·n, any
    // machining textbook); marked maximum 80 m/s, so 80 − 39.27 = 40.73 m/s, 51 % of it. Hand-computed.
    expect(summaryValue('Peripheral speed')).toBe('39.3 m/s');
    expect(summaryValue('Margin to the marked maximum')).toBe('40.7 m/s (51 %) below 80.0 m/s');
    expect(summaryValue('Clamp placement')).toBe('Both sides, 10 mm from the cut');
    expect(summaryValue('Entry')).toBe('0.20 mm/s for the first 5.00 mm');
  });

  it('says when the wheel would run over its marked maximum', async () => {
    const tooFast: RecipeVersionDto = { ...inReview, content: { ...inReview.content, cutting: { ...inReview.content.cutting, wheelRpm: 7000 } } };
    await open('/recipes/3/review?v=2');
    await answer([tooFast, approvedV1]);
    // π · 0.250 · 7000 / 60 = 91.63 m/s, 11.63 m/s (15 %) over the marked 80 m/s. Hand-computed.
    expect(summaryValue('Peripheral speed')).toBe('91.6 m/s');
    expect(summaryValue('Margin to the marked maximum')).toBe('over 80.0 m/s by 11.6 m/s (15 %)');
    expect(summaryValue('Entry')).toBe('none: the whole cut at the feed');
  });

  it('keeps "Approve…" disabled until every warning is acknowledged, then signs with their ids', async () => {
    await open('/recipes/3/review?v=2');
    await answer([inReview, approvedV1]);
    const approve = buttonNamed('Approve…');
    expect(approve.disabled).toBe(true);
    expect(root().querySelector('[data-testid="ack-needed"]')).not.toBeNull();

    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const boxes = await loader.getAllHarnesses(MatCheckboxHarness.with({ label: 'I have considered this warning' }));
    expect(boxes.length).toBe(2);
    await boxes[0].check();
    expect(approve.disabled).toBe(true);
    await boxes[1].check();
    await harness.fixture.whenStable();
    expect(approve.disabled).toBe(false);

    approve.click();
    const dialog = await dialogElement('kb-signature-dialog');
    await vi.waitFor(() => expect(dialog.textContent).toContain('Approved — I have reviewed this version and approve it for use'));
    const password = dialog.querySelector<HTMLInputElement>('input[type="password"]')!;
    password.value = 'demo-approver-2026';
    password.dispatchEvent(new Event('input'));
    buttonNamed('Sign and approve', dialog).click();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' }));
    expect(req.request.body.acknowledgedWarnings).toEqual(['feed-heat-sensitive', 'coolant-concentration']);
    expect(req.request.body.revision).toBe(11);
    expect(req.request.body.meaning).toBe('approved');
    req.flush({ ...inReview, status: 'approved' });
    await vi.waitFor(() => expect(router.url).toBe('/recipes/3?v=2'));
  });

  it('returns the version only with a comment, and sends it with the revision', async () => {
    await open('/recipes/3/review?v=2');
    await answer([inReview, approvedV1]);

    buttonNamed('Return with comments').click();
    const dialog = await dialogElement('kb-reason-dialog');
    (await vi.waitFor(() => buttonNamed('Return to author', dialog))).click();
    await harness.fixture.whenStable();
    backend.expectNone({ method: 'POST', url: '/api/recipes/3/versions/2/return' });
    await vi.waitFor(() => expect(dialog.querySelector('[data-testid="text-error"]')?.textContent).toContain('required'));

    const box = dialog.querySelector<HTMLTextAreaElement>('textarea')!;
    box.value = 'Feed is too high for this hardness; start at 0.3 mm/s.';
    box.dispatchEvent(new Event('input'));
    buttonNamed('Return to author', dialog).click();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/return' }));
    expect(req.request.body).toEqual({ revision: 11, comment: 'Feed is too high for this hardness; start at 0.3 mm/s.' });
    req.flush({ ...inReview, status: 'returned', revision: 12 });
    await vi.waitFor(() => expect(router.url).toBe('/recipes/3?v=2'));
  });

  it('tells an approver who edited the version that someone else must approve it', async () => {
    await open('/recipes/3/review?v=2', 7);
    await answer([inReview, approvedV1]);
    expect(root().querySelector('[data-testid="own-version"]')!.textContent).toContain('someone else must approve it');
    expect(buttonNamed('Approve…').disabled).toBe(true);
  });

  it('compares with the approved version it replaces, else with the one before', () => {
    const v = (version: number, status: RecipeVersionDto['status']) => aRecipeVersion({ version, status });
    expect(comparisonBase([v(3, 'in-review'), v(2, 'withdrawn'), v(1, 'approved')], v(3, 'in-review'))).toBe(1);
    expect(comparisonBase([v(3, 'in-review'), v(2, 'withdrawn'), v(1, 'superseded')], v(3, 'in-review'))).toBe(2);
    expect(comparisonBase([v(1, 'in-review')], v(1, 'in-review'))).toBeNull();
  });
});
