import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, type TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Page } from '@shared/api-types';
import type { RecipeSummary } from '@shared/recipe-types';
import type { Role } from '@shared/roles';
import type { DateFormat } from '@shared/vocabulary';
import { aMachine, aRecipeSummary } from '../../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../../testing/user-fixture';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Session } from '../../core/session/session';
import { Library } from './library';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

@Component({ template: 'recipe page' })
class RecipeStub {}

describe('Library', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let router: Router;

  const recipes: RecipeSummary[] = [
    aRecipeSummary({ worstCheck: 'warning' }),
    aRecipeSummary({
      id: 8,
      number: 'KB-0008',
      title: 'Carbide insert blank',
      status: 'draft',
      group: 'cemented-carbide',
      materialName: null,
      shape: 'rectangular',
      sizeMinMm: 3,
      sizeMaxMm: 12,
      worstCheck: 'blocker',
      version: 1,
    }),
  ];

  function page(total: number, index = 0, items = recipes): Page<RecipeSummary> {
    return { items, total, page: index, pageSize: 25 };
  }

  /** `dateFormat`: the lab's date format, as the settings request would answer it. */
  async function open(url: string, roles: Role[] = ['author'], dateFormat: DateFormat = 'iso'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'library', component: Library },
          { path: 'recipes/:id', component: RecipeStub },
        ]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(dateFormat),
        { provide: Session, useValue: { user: signal(aUser({ roles })), roles: signal(roles), clear: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url, Library);
    (await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/machines'))).flush({
      items: [aMachine(), aMachine({ id: 4, name: 'Precision saw P1', machineClass: 'precision' })],
      total: 2,
      page: 0,
      pageSize: 200,
    });
  }

  async function nextListRequest(): Promise<{ req: TestRequest; params: Record<string, string> }> {
    const req = await vi.waitFor(() => backend.expectOne((r) => r.method === 'GET' && r.url === '/api/recipes'));
    const params: Record<string, string> = {};
    for (const key of req.request.params.keys()) params[key] = req.request.params.get(key)!;
    return { req, params };
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  function queryParams(): Record<string, string> {
    return router.parseUrl(router.url).queryParams;
  }

  afterEach(() => backend.verify());

  it('asks for the first page in number order and renders the rows', async () => {
    await open('/library');
    const { req, params } = await nextListRequest();
    expect(params).toEqual({ page: '0', pageSize: '25', sort: 'number', dir: 'asc' });
    req.flush(page(2));
    await harness.fixture.whenStable();

    const rows = Array.from(root().querySelectorAll('tr.mat-mdc-row'));
    expect(rows).toHaveLength(2);
    const first = rows[0].textContent!;
    expect(first).toContain('KB-0003');
    expect(first).toContain('Tempered bar, transverse');
    expect(first).toContain('Tempered chromium-molybdenum steel · Plain and low-alloy steels');
    expect(first).toContain('Round bar');
    expect(first).toContain('10.0 mm – 40.0 mm');
    expect(first).toContain('Bench saw B2');
    expect(first).toContain('v2');
    expect(rows[0].querySelector('kb-recipe-status-chip')?.textContent).toContain('Approved');
    expect(rows[0].querySelector('kb-check-severity span')?.textContent).toBe('Warning');
    expect(rows[1].querySelector('kb-recipe-status-chip')?.textContent).toContain('Draft');
    expect(rows[1].querySelector('kb-check-severity span')?.textContent).toBe('Blocker');
    expect(rows[1].textContent).toContain('Cemented carbides');
  });

  it('takes filters, order and page from the URL, converting the hardness to HV', async () => {
    await open(
      '/library?group=stainless-steel&shape=tube&machine=4&status=approved&review=overdue&size=30&hardness=38&scale=HRC&sort=updatedAt&dir=desc&page=2&q=flange',
    );
    const { req, params } = await nextListRequest();
    // ASTM E140 Table 1: 38 HRC ≈ 372 HV.
    expect(params).toEqual({
      page: '2',
      pageSize: '25',
      sort: 'updatedAt',
      dir: 'desc',
      q: 'flange',
      group: 'stainless-steel',
      shape: 'tube',
      machineId: '4',
      status: 'approved',
      review: 'overdue',
      size: '30',
      hardnessHv: '372',
    });
    req.flush(page(80, 2));
    await harness.fixture.whenStable();
    expect(root().querySelector('[data-testid="hardness-note"]')?.textContent).toContain('372 HV');
    const filters = await TestbedHarnessEnvironment.loader(harness.fixture).getAllHarnesses(MatSelectHarness.with({ ancestor: '.kb-filters' }));
    expect(await Promise.all(filters.map((s) => s.getValueText()))).toEqual([
      'Stainless steels',
      'HRC',
      'Tube',
      'Precision saw P1',
      'Approved',
      'Review overdue',
    ]);
  });

  it("writes the dates in the lab's format: 05.12.2026, no month names", async () => {
    await open('/library', ['author'], 'dmy-dot');
    (await nextListRequest()).req.flush(
      page(2, 0, [
        aRecipeSummary({ updatedAt: '2026-12-05T10:00:00.000Z', reviewDueOn: '2026-01-10', reviewOverdue: true }),
        aRecipeSummary({ id: 9, number: 'KB-0009', updatedAt: '2026-11-20T10:00:00.000Z', reviewDueOn: '2028-12-05' }),
      ]),
    );
    await harness.fixture.whenStable();
    const rows = Array.from(root().querySelectorAll<HTMLElement>('tr.mat-mdc-row'));
    expect(rows[0].querySelector('time')!.textContent!.trim()).toBe('05.12.2026');
    expect(rows[1].querySelector('time')!.textContent!.trim()).toBe('20.11.2026');
    const cells = Array.from(root().querySelectorAll('td.kb-review-due'));
    expect(cells[0].querySelector('kb-review-overdue-chip')?.getAttribute('title')).toBe('The periodic review was due on 10.01.2026');
    expect(cells[1].textContent?.trim()).toBe('05.12.2028');
    const table = root().querySelector('table')!.textContent!;
    expect(table).not.toMatch(
      /\b(Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)[a-z]* 20\d\d\b|\b\d{1,2} (Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)\b/,
    );
    expect(table).not.toMatch(/\b20\d\d-\d\d-\d\d\b/);
  });

  it('marks a recipe whose periodic review has passed, and filters to those', async () => {
    await open('/library');
    (await nextListRequest()).req.flush(
      page(2, 0, [aRecipeSummary({ reviewDueOn: '2026-01-10', reviewOverdue: true }), aRecipeSummary({ id: 9, number: 'KB-0009', reviewDueOn: '2027-06-01' })]),
    );
    await harness.fixture.whenStable();
    const cells = Array.from(root().querySelectorAll('td.kb-review-due'));
    expect(cells[0].querySelector('kb-review-overdue-chip')?.textContent).toContain('Review overdue');
    expect(cells[0].querySelector('kb-review-overdue-chip')?.getAttribute('title')).toBe('The periodic review was due on 2026-01-10');
    expect(cells[1].querySelector('kb-review-overdue-chip')).toBeNull();
    expect(cells[1].textContent?.trim()).toBe('2027-06-01');

    const review = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatSelectHarness.with({ selector: '.kb-review-filter' }));
    const choosing = review.clickOptions({ text: 'Review overdue' });
    const { req, params } = await nextListRequest();
    expect(params).toMatchObject({ review: 'overdue', page: '0' });
    expect(queryParams()).toEqual({ review: 'overdue' });
    req.flush(page(0, 0, []));
    await choosing;
  });

  it('puts a chosen filter in the URL and asks again from the first page', async () => {
    await open('/library?page=3');
    (await nextListRequest()).req.flush(page(100, 3));
    const [group] = await TestbedHarnessEnvironment.loader(harness.fixture).getAllHarnesses(MatSelectHarness);
    // Harnesses wait for the page to settle, which it does once the list asked for is answered.
    const choosing = group.clickOptions({ text: 'Cemented carbides' });

    const { req, params } = await nextListRequest();
    expect(params).toMatchObject({ group: 'cemented-carbide', page: '0' });
    expect(queryParams()).toEqual({ group: 'cemented-carbide' });
    req.flush(page(1, 0, [recipes[1]]));
    await choosing;
  });

  it('sorts and pages on the server, keeping both in the URL', async () => {
    await open('/library');
    (await nextListRequest()).req.flush(page(60));
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);

    const [title] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Title' });
    const sorting = title.click();
    const sorted = await nextListRequest();
    expect(sorted.params).toMatchObject({ sort: 'title', dir: 'asc', page: '0' });
    expect(queryParams()).toEqual({ sort: 'title' });
    sorted.req.flush(page(60));
    await sorting;

    const paging = (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    const second = await nextListRequest();
    expect(second.params).toMatchObject({ sort: 'title', page: '1' });
    expect(queryParams()).toEqual({ sort: 'title', page: '1' });
    second.req.flush(page(60, 1));
    await paging;
  });

  it('searches once typing pauses, with the trimmed text', async () => {
    await open('/library');
    (await nextListRequest()).req.flush(page(2));
    const input = root().querySelector<HTMLInputElement>('input[formcontrolname="q"]')!;
    for (const text of ['c', 'ca', ' carbide ']) {
      input.value = text;
      input.dispatchEvent(new Event('input'));
    }
    backend.expectNone('/api/recipes');
    const { req, params } = await nextListRequest();
    expect(params).toMatchObject({ q: 'carbide', page: '0' });
    expect(queryParams()).toEqual({ q: 'carbide' });
    req.flush(page(1, 0, [recipes[1]]));
  });

  it('says when a hardness has no HV conversion and leaves it out of the query', async () => {
    await open('/library?hardness=80&scale=HRC');
    const { req, params } = await nextListRequest();
    expect(params['hardnessHv']).toBeUndefined();
    req.flush(page(0, 0, []));
    await harness.fixture.whenStable();
    expect(root().querySelector('[data-testid="hardness-note"]')?.textContent).toContain('hardness is not filtered');
  });

  it('opens the recipe when a row is clicked', async () => {
    await open('/library');
    (await nextListRequest()).req.flush(page(2));
    await harness.fixture.whenStable();
    root().querySelectorAll<HTMLElement>('tr.mat-mdc-row')[1].click();
    await vi.waitFor(() => expect(router.url).toBe('/recipes/8'));
  });

  it('offers "New recipe" to authors only', async () => {
    await open('/library', ['author']);
    (await nextListRequest()).req.flush(page(2));
    await harness.fixture.whenStable();
    const link = root().querySelector<HTMLAnchorElement>('a[href="/recipes/new"]');
    expect(link?.textContent).toContain('New recipe');
  });

  it('shows no "New recipe" to an operator', async () => {
    await open('/library', ['operator']);
    (await nextListRequest()).req.flush(page(2));
    await harness.fixture.whenStable();
    expect(root().querySelector('a[href="/recipes/new"]')).toBeNull();
    expect(root().textContent).not.toContain('New recipe');
  });
});
