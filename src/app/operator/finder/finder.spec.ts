import { MATERIAL_GROUP_LABELS } from '@shared/vocabulary';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { FinderHit } from '@shared/recipe-types';
import type { Role } from '@shared/roles';
import { aMachine, aMaterial, aRecipeSummary } from '../../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../../testing/user-fixture';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { Finder } from './finder';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

@Component({ template: 'elsewhere' })
class Elsewhere {}

describe('Finder', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;

  const hits: FinderHit[] = [
    {
      summary: aRecipeSummary({ id: 8, number: 'KB-0008', title: 'Hardened shafts, any section', version: 1, sizeMinMm: 5, sizeMaxMm: 80 }),
      score: 40,
      reasons: ['Material group: plain and low-alloy steel'],
    },
    {
      summary: aRecipeSummary({ id: 3, number: 'KB-0003', title: 'Tempered bar, transverse', version: 2 }),
      score: 90,
      reasons: ['Material: Tempered chromium-molybdenum steel', 'Size 30 mm within 10–40 mm'],
    },
  ];

  async function open(url: string, roles: Role[] = ['operator'], units: 'metric' | 'metric+imperial' = 'metric'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'finder', component: Finder },
            { path: '**', component: Elsewhere },
          ],
          withComponentInputBinding(),
        ),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        { provide: Session, useValue: { user: signal(aUser({ roles, units })), roles: signal(roles), clear: vi.fn() } },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    const materials = await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/materials'));
    expect(materials.request.params.get('archived')).toBe('no');
    materials.flush({ items: [aMaterial({ id: 5 })], total: 1, page: 0, pageSize: 200 });
    backend.expectOne((r) => r.url === '/api/machines').flush({ items: [aMachine({ id: 1 })], total: 1, page: 0, pageSize: 200 });
    await harness.fixture.whenStable();
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  function words(el: Element | null): string {
    return el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  function type(name: string, value: string): void {
    const el = root().querySelector<HTMLInputElement>(`[formcontrolname="${name}"]`)!;
    el.value = value;
    el.dispatchEvent(new Event('input'));
  }

  async function answerFinder(answer: FinderHit[]): Promise<Record<string, string>> {
    const req = await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/finder'));
    const sent = Object.fromEntries(req.request.params.keys().map((k) => [k, req.request.params.get(k)!]));
    req.flush(answer);
    await harness.fixture.whenStable();
    return sent;
  }

  afterEach(() => backend.verify());

  it('sends the query from the URL and shows the hits best first with why they match', async () => {
    await open('/finder?materialId=5&hardnessValue=32&hardnessScale=HRC&shape=round-bar&sizeMm=30&machineId=1');
    expect(await answerFinder(hits)).toEqual({ materialId: '5', hardnessValue: '32', hardnessScale: 'HRC', shape: 'round-bar', sizeMm: '30', machineId: '1' });

    const cards = Array.from(root().querySelectorAll<HTMLElement>('.kb-hit'));
    expect(cards.map((c) => c.dataset['recipe'])).toEqual(['3', '8']);
    const best = words(cards[0]);
    expect(best).toContain('KB-0003');
    expect(best).toContain('version 2');
    expect(best).toContain('Best match');
    expect(best).toContain('Tempered bar, transverse');
    expect(best).toContain('Bench saw B2');
    expect(best).toContain('Alumina 250 general steel');
    expect(best).toContain('10–40 mm');
    expect(Array.from(cards[0].querySelectorAll('.kb-why .kb-reason')).map(words)).toEqual([
      'Material: Tempered chromium-molybdenum steel',
      'Size 30 mm within 10–40 mm',
    ]);
    expect(cards[0].querySelector('a[aria-label="Open KB-0003"]')!.getAttribute('href')).toBe('/recipes/3?v=2');
    const sheet = cards[0].querySelector<HTMLAnchorElement>('a[aria-label="Print sheet for KB-0003"]')!;
    expect(sheet.getAttribute('href')).toBe('/api/recipes/3/versions/2/sheet.pdf');
    expect(sheet.getAttribute('target')).toBe('_blank');
    expect(cards[0].querySelector('button[aria-label="Log a cut with KB-0003"]')).not.toBeNull();
    // The form shows what was asked.
    expect(root().querySelector<HTMLInputElement>('[formcontrolname="material"]')!.value).toBe('Tempered chromium-molybdenum steel');
    expect(root().querySelector<HTMLInputElement>('[formcontrolname="sizeMm"]')!.value).toBe('30');
  });

  it('says what the disabled group field is set to when a material is picked', async () => {
    await open('/finder?materialId=5&sizeMm=30');
    await answerFinder(hits);
    const group = root().querySelector('.kb-f-group')!;
    expect(group.querySelector('mat-select')!.getAttribute('aria-disabled')).toBe('true');
    expect(words(group.querySelector('.mat-mdc-select-value'))).toBe(MATERIAL_GROUP_LABELS[aMaterial({ id: 5 }).group]);
    expect(words(group.querySelector('[data-testid="group-set-by"]'))).toBe(
      `Set to ${MATERIAL_GROUP_LABELS[aMaterial({ id: 5 }).group].toLowerCase()} by the material Tempered chromium-molybdenum steel; clear the material to choose another group.`,
    );
  });

  it('puts the typed query in the URL and searches with it', async () => {
    await open('/finder');
    backend.expectNone((r) => r.url === '/api/finder');
    type('sizeMm', '25');
    type('hardnessValue', '250');
    root().querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    expect(await answerFinder(hits)).toEqual({ sizeMm: '25', hardnessValue: '250', hardnessScale: 'HV' });
    expect(TestBed.inject(Router).url).toBe('/finder?hardnessValue=250&hardnessScale=HV&sizeMm=25');
  });

  it('refuses an empty search and a size the server would refuse, without asking it', async () => {
    await open('/finder');
    root().querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await harness.fixture.whenStable();
    expect(words(root().querySelector('[data-testid="form-error"]'))).toContain('Fill in at least one field');
    type('sizeMm', '2500');
    root().querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await harness.fixture.whenStable();
    expect(words(root().querySelector('mat-error'))).toBe('Size must be at most 2000 mm.');
    backend.expectNone((r) => r.url === '/api/finder');
  });

  it('says plainly when no current recipe covers the part and what to do', async () => {
    await open('/finder?group=cast-iron&sizeMm=300');
    await answerFinder([]);
    const empty = words(root().querySelector('[data-testid="finder-empty"]'));
    expect(empty).toContain('No current recipe covers this part — ask a quality engineer');
    expect(empty).toContain('Leave out the hardness or the machine');
    expect(root().querySelectorAll('.kb-hit')).toHaveLength(0);
  });

  it('shows imperial users the size in inches and leaves Log a cut to operators', async () => {
    await open('/finder?sizeMm=50.8', ['auditor'], 'metric+imperial');
    await answerFinder(hits);
    expect(words(root().querySelector('[data-testid="size-hint"]'))).toBe('50.8 mm = 2.00 in');
    expect(root().querySelector('button[aria-label^="Log a cut"]')).toBeNull();
    expect(root().querySelector('a[aria-label="Print sheet for KB-0008"]')).not.toBeNull();
  });
});
