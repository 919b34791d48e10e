import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, type TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { provideRouter } from '@angular/router';
import type { Page, UserDto } from '@shared/api-types';
import { aMachine } from '../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../testing/user-fixture';
import { Notifier } from '../core/notifier/notifier';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Session } from '../core/session/session';
import { LIST_SEARCH_DEBOUNCE_MS } from '../ui/paged-list';
import { PeopleList } from './people-list';
import { provideLabDateFormat } from '../../testing/lab-date-format';

describe('PeopleList', () => {
  let fixture: ComponentFixture<PeopleList>;
  let backend: HttpTestingController;
  let root: HTMLElement;

  const people: UserDto[] = [
    aUser({ id: 1, username: 'admin.kowalczyk', displayName: 'Iwona Kowalczyk', roles: ['admin', 'approver'], lastSignInAt: '2026-11-30T07:15:00.000Z' }),
    aUser({ id: 2, username: 'sbrandt', displayName: 'Sven Brandt', email: '', roles: ['operator'], active: false, machineIds: [1, 4] }),
  ];
  let notifier: { show: ReturnType<typeof vi.fn> };

  function page(total: number, index = 0, items = people): Page<UserDto> {
    return { items, total, page: index, pageSize: 25 };
  }

  /** The one list request now open, as a plain object of its query parameters. */
  async function nextListRequest(): Promise<{ req: TestRequest; params: Record<string, string> }> {
    const req = await vi.waitFor(() => backend.expectOne((r) => r.method === 'GET' && r.url === '/api/users'));
    const params: Record<string, string> = {};
    for (const key of req.request.params.keys()) params[key] = req.request.params.get(key)!;
    return { req, params };
  }

  beforeEach(async () => {
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      imports: [PeopleList],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        { provide: Session, useValue: { user: signal(people[0]), roles: signal(['admin']), clear: vi.fn() } },
        { provide: Notifier, useValue: notifier },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(PeopleList);
    root = fixture.nativeElement;
    // Machine names for the operators' rows: every machine, archived ones too.
    const machines = await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/machines'));
    expect(machines.request.params.get('archived')).toBe('all');
    machines.flush({
      items: [aMachine({ id: 1, name: 'Bench saw B2' }), aMachine({ id: 4, name: 'Floor saw F1', archived: true })],
      total: 2,
      page: 0,
      pageSize: 200,
    });
  });

  afterEach(() => backend.verify());

  it('asks for the first page of active people sorted by username, and renders the rows', async () => {
    const { req, params } = await nextListRequest();
    expect(params).toEqual({ page: '0', pageSize: '25', sort: 'username', dir: 'asc', status: 'active' });
    req.flush(page(2));
    await fixture.whenStable();

    const rows = Array.from(root.querySelectorAll('tr.mat-mdc-row'));
    expect(rows).toHaveLength(2);
    const first = rows[0].textContent!;
    expect(first).toContain('admin.kowalczyk');
    expect(first).toContain('Iwona Kowalczyk');
    expect(first).toContain('Active');
    const chips = Array.from(rows[0].querySelectorAll('mat-chip')).map((c) => c.textContent?.trim());
    expect(chips).toEqual(['Admin', 'Approver']);
    const second = rows[1].textContent!;
    expect(second).toContain('Inactive');
    expect(second).toContain('never');
    expect(rows[1].querySelector('button[aria-label="Actions for Sven Brandt"]')).not.toBeNull();
  });

  it('sorts on the server when a column header is clicked', async () => {
    (await nextListRequest()).req.flush(page(2));
    const sort = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSortHarness);
    const [name] = await sort.getSortHeaders({ label: 'Name' });

    // Harnesses wait for the page to settle, which it does once the list they ask for is answered.
    let clicking = name.click();
    const asc = await nextListRequest();
    expect(asc.params).toMatchObject({ sort: 'displayName', dir: 'asc', page: '0' });
    asc.req.flush(page(2));
    await clicking;

    clicking = name.click();
    const desc = await nextListRequest();
    expect(desc.params).toMatchObject({ sort: 'displayName', dir: 'desc' });
    desc.req.flush(page(2));
    await clicking;
  });

  it('pages on the server, and goes back to the first page when a filter changes', async () => {
    (await nextListRequest()).req.flush(page(60));
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const paginator = await loader.getHarness(MatPaginatorHarness);

    const paging = paginator.goToNextPage();
    const second = await nextListRequest();
    expect(second.params).toMatchObject({ page: '1', pageSize: '25' });
    second.req.flush(page(60, 1));
    await paging;

    const [, status] = await loader.getAllHarnesses(MatSelectHarness);
    const choosing = status.clickOptions({ text: 'Inactive' });
    const filtered = await nextListRequest();
    expect(filtered.params).toMatchObject({ page: '0', status: 'inactive' });
    filtered.req.flush(page(1, 0, [people[1]]));
    await choosing;
  });

  it('filters by role', async () => {
    (await nextListRequest()).req.flush(page(2));
    const [role] = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatSelectHarness);
    const choosing = role.clickOptions({ text: 'Operator' });
    const { req, params } = await nextListRequest();
    expect(params).toMatchObject({ role: 'operator', page: '0' });
    req.flush(page(1, 0, [people[1]]));
    await choosing;
  });

  it('searches once typing pauses, with the trimmed text', async () => {
    (await nextListRequest()).req.flush(page(2));
    vi.useFakeTimers();
    try {
      const input = root.querySelector<HTMLInputElement>('input[placeholder="Username, name or e-mail"]')!;
      for (const text of ['k', 'ko', ' kow ']) {
        input.value = text;
        input.dispatchEvent(new Event('input'));
        vi.advanceTimersByTime(100);
      }
      backend.expectNone('/api/users');
      vi.advanceTimersByTime(LIST_SEARCH_DEBOUNCE_MS);
    } finally {
      vi.useRealTimers();
    }
    const { req, params } = await nextListRequest();
    expect(params).toMatchObject({ q: 'kow', page: '0' });
    req.flush(page(1, 0, [people[0]]));
  });

  it("lists an operator's machines by name", async () => {
    (await nextListRequest()).req.flush(page(2));
    await fixture.whenStable();
    const rows = Array.from(root.querySelectorAll('tr.mat-mdc-row'));
    const names = [...rows[1].querySelectorAll('.mat-column-machines .kb-machine')].map((e) => e.textContent?.trim());
    expect(names).toEqual(['Bench saw B2', 'Floor saw F1']);
    expect(rows[0].querySelector('.mat-column-machines')?.textContent?.trim()).toBe('');
  });

  it('shows an invited person as Invited, and sends the invitation again from the row menu', async () => {
    const invited = aUser({ id: 9, username: 'ntakeda', displayName: 'Naoko Takeda', invitationPending: true, lastSignInAt: null });
    (await nextListRequest()).req.flush(page(1, 0, [invited]));
    await fixture.whenStable();
    const row = root.querySelector('tr.mat-mdc-row')!;
    expect(row.querySelector('.mat-column-status')?.textContent).toContain('Invited');

    row.querySelector<HTMLButtonElement>('button[aria-label="Actions for Naoko Takeda"]')!.click();
    await fixture.whenStable();
    const again = Array.from(document.querySelectorAll<HTMLButtonElement>('.mat-mdc-menu-panel button')).find((b) =>
      b.textContent?.includes('Send invitation again'),
    )!;
    again.click();
    const post = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/users/9/invitation' }));
    post.flush({ message: 'A new invitation was sent to naoko@lab.example.' });
    await vi.waitFor(() => expect(notifier.show).toHaveBeenCalledWith('A new invitation was sent to naoko@lab.example.', 'OK', 8000));
    (await nextListRequest()).req.flush(page(1, 0, [invited]));
  });

  it('offers no "Send invitation again" for someone who has set a password', async () => {
    (await nextListRequest()).req.flush(page(2));
    await fixture.whenStable();
    root.querySelector<HTMLButtonElement>('button[aria-label="Actions for Iwona Kowalczyk"]')!.click();
    await fixture.whenStable();
    const labels = Array.from(document.querySelectorAll('.mat-mdc-menu-panel button')).map((b) => b.textContent ?? '');
    expect(labels.some((l) => l.includes('Edit'))).toBe(true);
    expect(labels.some((l) => l.includes('Send invitation again'))).toBe(false);
  });
});
