import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, type TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { MatTooltipHarness } from '@angular/material/tooltip/testing';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Page } from '@shared/api-types';
import type { PersonNameDto, TrailEventDto, TrailPage, RecipeSummary } from '@shared/recipe-types';
import type { Role } from '@shared/roles';
import { aRecipeSummary } from '../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../testing/user-fixture';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { Trail } from './trail';
import { provideLabDateFormat } from '../../testing/lab-date-format';

describe('Trail', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let router: Router;

  function anEvent(overrides: Partial<TrailEventDto> = {}): TrailEventDto {
    return {
      id: 900,
      occurredAt: '2026-11-30T07:15:04.000Z',
      actorId: 4,
      actorName: 'Ines Author',
      type: 'recipe.draft_saved',
      entityType: 'recipe_version',
      entityId: '17',
      before: { revision: 3, status: 'returned' },
      after: { revision: 4, status: 'draft', changed: ['cutting'] },
      clientAddress: '10.0.0.8',
      what: 'KB-0017 v2',
      prevHash: 'a'.repeat(64),
      hash: 'b'.repeat(64),
      ...overrides,
    };
  }

  const events = [
    anEvent(),
    anEvent({
      id: 899,
      type: 'recipe.created',
      entityType: 'recipe',
      entityId: '12',
      before: null,
      after: { number: 'KB-0012', title: 'Thin-wall tube', version: 1, status: 'draft' },
      what: 'KB-0012 · Thin-wall tube',
    }),
  ];

  function aPage(items: TrailEventDto[], nextBefore: number | null): TrailPage {
    return { items, nextBefore };
  }

  async function open(url: string, roles: Role[] = ['auditor']): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'trail', component: Trail }]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        { provide: Session, useValue: { user: signal(aUser({ roles })), roles: signal(roles), clear: vi.fn() } },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url, Trail);
    // Auditors and admins alike pick a person by name from the trail's own list.
    (await vi.waitFor(() => backend.expectOne('/api/trail/people'))).flush({ items: PEOPLE });
  }

  const PEOPLE: PersonNameDto[] = [
    { id: 4, displayName: 'Ines Author', active: true },
    { id: 9, displayName: 'Ruth Auditor', active: false },
  ];

  function paramsOf(req: TestRequest): Record<string, string> {
    const params: Record<string, string> = {};
    for (const key of req.request.params.keys()) params[key] = req.request.params.get(key)!;
    return params;
  }

  async function nextEvents(): Promise<{ req: TestRequest; params: Record<string, string> }> {
    const req = await vi.waitFor(() => backend.expectOne((r) => r.method === 'GET' && r.url === '/api/trail'));
    return { req, params: paramsOf(req) };
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  function queryParams(): Record<string, string> {
    return router.parseUrl(router.url).queryParams;
  }

  function button(text: string): HTMLButtonElement {
    const found = Array.from(root().querySelectorAll('button')).find((b) => b.textContent?.trim().includes(text));
    if (!found) throw new Error(`no button "${text}"`);
    return found;
  }

  async function settle(): Promise<void> {
    await harness.fixture.whenStable();
  }

  afterEach(() => backend.verify());

  it('asks for the newest page and shows each event compactly, with its detail on demand', async () => {
    await open('/trail');
    const { req, params } = await nextEvents();
    expect(params).toEqual({ limit: '50' });
    req.flush(aPage(events, 899));
    await settle();

    const rows = Array.from(root().querySelectorAll('tr.kb-event-row'));
    expect(rows).toHaveLength(2);
    const cells = Array.from(rows[0].querySelectorAll('td'));
    expect(cells[0].querySelector('time')?.textContent).toBe('2026-11-30 07:15 UTC');
    expect(cells[0].querySelector('time')?.getAttribute('datetime')).toBe('2026-11-30T07:15:04.000Z');
    expect(cells[0].querySelector('.kb-sub')?.textContent).toBe('#900');
    expect(cells[1].textContent?.trim()).toMatch(/^Ines Author\s+user 4$/);
    // The event in words, its stored code at hand in a tooltip; the record by the name people know.
    expect(cells[2].textContent?.trim()).toBe('Draft saved');
    const tooltip = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTooltipHarness.with({ selector: '.kb-event-900' }));
    await tooltip.show();
    expect(await tooltip.getTooltipText()).toBe('recipe.draft_saved');
    await tooltip.hide();
    expect(cells[3].textContent?.trim()).toBe('KB-0017 v2');
    expect(Array.from(cells[4].querySelectorAll('.kb-change-line')).map((line) => line.textContent)).toEqual([
      'revision: 3 → 4',
      'status: returned → draft',
      'changed: — → cutting',
    ]);
    expect(rows[1].textContent).toContain('new:');
    expect(rows[1].textContent).toContain('number: KB-0012');
    expect(rows[1].textContent).toContain('and 1 more');

    // An auditor picks a person by name too, without the admin's list of accounts.
    expect(root().textContent).not.toContain('User id');
    backend.expectNone('/api/users');

    const toggle = root().querySelector<HTMLButtonElement>('button[aria-label="Details of event 900"]')!;
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    expect(root().querySelector('#kb-event-900')).toBeNull();
    toggle.click();
    await settle();
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
    const detail = root().querySelector('#kb-event-900')!;
    const [before, after] = Array.from(detail.querySelectorAll('pre')).map((pre) => JSON.parse(pre.textContent!));
    expect(before).toEqual(events[0].before);
    expect(after).toEqual(events[0].after);
    expect(detail.textContent).toContain('b'.repeat(64));
  });

  it('sends the URL filters to the list and to the CSV link', async () => {
    await open('/trail?recipe=12&user=4&type=recipe.created&from=2026-11-01&to=2026-11-30');
    const { req, params } = await nextEvents();
    expect(params).toEqual({ recipeId: '12', userId: '4', type: 'recipe.created', from: '2026-11-01', to: '2026-11-30', limit: '50' });
    req.flush(aPage([events[1]], null));
    await settle();

    const csv = Array.from(root().querySelectorAll('a')).find((a) => a.textContent?.includes('Export CSV'))!;
    expect(csv.getAttribute('href')).toBe('/api/trail.csv?recipeId=12&userId=4&type=recipe.created&from=2026-11-01&to=2026-11-30');
    expect(csv.hasAttribute('download')).toBe(true);
    expect(root().querySelector<HTMLInputElement>('input[formcontrolname="recipe"]')!.value).toBe('12');
    expect(root().querySelector<HTMLInputElement>('input[formcontrolname="from"]')!.value).toBe('2026-11-01');
    expect(root().textContent).toContain('No older events match these filters.');
  });

  it('finds a recipe by its number before asking for its events', async () => {
    await open('/trail?recipe=KB-0012');
    const lookup = await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/recipes'));
    expect(paramsOf(lookup)).toMatchObject({ q: 'KB-0012' });
    const found: Page<RecipeSummary> = {
      items: [aRecipeSummary({ id: 120, number: 'KB-0120' }), aRecipeSummary({ id: 12, number: 'KB-0012' })],
      total: 2,
      page: 0,
      pageSize: 25,
    };
    lookup.flush(found);
    const { req, params } = await nextEvents();
    expect(params).toEqual({ recipeId: '12', limit: '50' });
    req.flush(aPage([events[1]], null));
  });

  it('says so when no recipe has the typed number, and asks for no events', async () => {
    await open('/trail?recipe=KB-9999');
    (await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/recipes'))).flush({ items: [], total: 0, page: 0, pageSize: 25 });
    await settle();
    backend.expectNone('/api/trail');
    expect(root().textContent).toContain('No recipe numbered “KB-9999”.');
  });

  it('loads older events with the keyset, and goes back to the newest', async () => {
    await open('/trail?type=recipe.created');
    (await nextEvents()).req.flush(aPage(events, 899));
    await settle();

    button('Older events').click();
    const older = await nextEvents();
    expect(older.params).toEqual({ type: 'recipe.created', before: '899', limit: '50' });
    expect(queryParams()).toEqual({ type: 'recipe.created', before: '899' });
    older.req.flush(aPage([anEvent({ id: 850 })], null));
    await settle();
    expect(root().querySelectorAll('tr.kb-event-row')).toHaveLength(1);
    expect(root().textContent).toContain('Events older than 899');
    expect(Array.from(root().querySelectorAll('button')).some((b) => b.textContent?.includes('Older events'))).toBe(false);

    button('Newest').click();
    const newest = await nextEvents();
    expect(newest.params).toEqual({ type: 'recipe.created', limit: '50' });
    expect(queryParams()).toEqual({ type: 'recipe.created' });
    newest.req.flush(aPage(events, 899));
  });

  it('puts a typed filter into the URL and starts again from the newest event', async () => {
    await open('/trail?before=899');
    (await nextEvents()).req.flush(aPage(events, 850));
    const type = root().querySelector<HTMLInputElement>('input[formcontrolname="type"]')!;
    type.value = 'user.created';
    type.dispatchEvent(new Event('input'));
    const { req, params } = await nextEvents();
    expect(params).toEqual({ type: 'user.created', limit: '50' });
    expect(queryParams()).toEqual({ type: 'user.created' });
    req.flush(aPage([], null));
    await settle();
    expect(root().textContent).toContain('No events match these filters.');
  });

  for (const role of ['auditor', 'admin'] as const) {
    it(`lets an ${role} pick the person by name from the list of people`, async () => {
      await open('/trail', [role]);
      (await nextEvents()).req.flush(aPage(events, null));

      const select = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatSelectHarness.with({ selector: '.kb-person' }));
      await select.open();
      expect((await select.getOptions()).length).toBe(3);
      // The harness waits for the page to settle, which it does once the new page of events is answered.
      const choosing = select.clickOptions({ text: 'Ruth Auditor · inactive' });
      const { req, params } = await nextEvents();
      expect(params).toEqual({ userId: '9', limit: '50' });
      expect(queryParams()).toEqual({ user: '9' });
      req.flush(aPage([], null));
      await choosing;
    });
  }

  it('filters by family of events and can hide sign-ins, in the URL, the list and the CSV link', async () => {
    await open('/trail');
    (await nextEvents()).req.flush(aPage(events, null));
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);

    const family = await loader.getHarness(MatSelectHarness.with({ selector: '.kb-family' }));
    const choosing = family.clickOptions({ text: 'Signatures' });
    const picked = await nextEvents();
    expect(picked.params).toEqual({ family: 'signatures', limit: '50' });
    expect(queryParams()).toEqual({ family: 'signatures' });
    picked.req.flush(aPage([], null));
    await choosing;

    const hide = await loader.getHarness(MatSlideToggleHarness.with({ label: 'Hide sign-ins' }));
    const toggling = hide.toggle();
    const hidden = await nextEvents();
    expect(hidden.params).toEqual({ family: 'signatures', hideSignIns: 'true', limit: '50' });
    expect(queryParams()).toEqual({ family: 'signatures', signIns: 'hidden' });
    hidden.req.flush(aPage([], null));
    await toggling;
    await settle();
    const csv = Array.from(root().querySelectorAll('a')).find((a) => a.textContent?.includes('Export CSV'))!;
    expect(csv.getAttribute('href')).toBe('/api/trail.csv?family=signatures&hideSignIns=true');
  });

  it('opens a link with a family and hidden sign-ins as it was sent', async () => {
    await open('/trail?family=stock&signIns=hidden');
    const { req, params } = await nextEvents();
    expect(params).toEqual({ family: 'stock', hideSignIns: 'true', limit: '50' });
    req.flush(aPage([], null));
  });

  it('ignores an unknown family in the URL rather than sending it', async () => {
    await open('/trail?family=everything');
    const { req, params } = await nextEvents();
    expect(params).toEqual({ limit: '50' });
    req.flush(aPage([], null));
  });

  it('reports an intact chain with the number of events checked', async () => {
    await open('/trail');
    (await nextEvents()).req.flush(aPage(events, null));
    button('Verify chain').click();
    backend.expectOne('/api/trail/verify').flush({ ok: true, checked: 1234, firstBroken: null });
    await settle();
    const result = root().querySelector('[data-testid="verify-result"]')!;
    expect(result.getAttribute('role')).toBe('status');
    expect(result.querySelector('span')?.textContent?.replace(/\s+/g, ' ').trim()).toBe('Chain intact — 1234 events checked.');
    expect(result.querySelector('mat-icon')?.getAttribute('aria-hidden')).toBe('true');
  });

  it('raises an alarm naming the first broken event and its reason, and can open the trail there', async () => {
    await open('/trail?type=user.created');
    (await nextEvents()).req.flush(aPage(events, null));
    button('Verify chain').click();
    backend.expectOne('/api/trail/verify').flush({ ok: false, checked: 57, firstBroken: { id: 57, reason: 'stored hash does not match the row' } });
    await settle();
    const result = root().querySelector('[data-testid="verify-result"]')!;
    expect(result.getAttribute('role')).toBe('alert');
    expect(result.textContent).toContain('Chain broken');
    expect(result.textContent).toContain('at event 57: stored hash does not match the row');
    expect(result.textContent).not.toContain('intact');

    button('Show event 57').click();
    const { req, params } = await nextEvents();
    expect(params).toEqual({ before: '58', limit: '50' });
    expect(queryParams()).toEqual({ before: '58' });
    req.flush(aPage([anEvent({ id: 57 })], 56));
  });
});
