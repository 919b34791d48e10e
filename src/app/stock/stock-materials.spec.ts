import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, type TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatDialog } from '@angular/material/dialog';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { provideRouter } from '@angular/router';
import { of } from 'rxjs';
import type { Page } from '@shared/api-types';
import type { Role } from '@shared/roles';
import type { MaterialRecord } from '@shared/stock-types';
import { aMaterial } from '../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../testing/user-fixture';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { StockMaterials } from './stock-materials';
import { provideLabDateFormat } from '../../testing/lab-date-format';

describe('StockMaterials', () => {
  let fixture: ComponentFixture<StockMaterials>;
  let backend: HttpTestingController;
  let root: HTMLElement;
  let notifier: { show: ReturnType<typeof vi.fn> };

  const materials: MaterialRecord[] = [
    aMaterial(),
    aMaterial({
      id: 9,
      name: 'Case-hardened gear steel',
      designation: '',
      group: 'hardened-tool-steel',
      condition: 'carburized',
      hardness: { value: 60, scale: 'HRC' },
      caseHardened: true,
      caseDepthMm: 0.8,
      heatSensitive: true,
      archived: true,
    }),
  ];

  function page(items = materials): Page<MaterialRecord> {
    return { items, total: items.length, page: 0, pageSize: 25 };
  }

  async function open(roles: Role[], units: 'metric' | 'metric+imperial' = 'metric'): Promise<void> {
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      imports: [StockMaterials],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        { provide: Session, useValue: { user: signal(aUser({ roles, units })), roles: signal(roles), clear: vi.fn() } },
        { provide: Notifier, useValue: notifier },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(StockMaterials);
    root = fixture.nativeElement;
  }

  async function nextListRequest(): Promise<{ req: TestRequest; params: Record<string, string> }> {
    const req = await vi.waitFor(() => backend.expectOne((r) => r.method === 'GET' && r.url === '/api/materials'));
    const params: Record<string, string> = {};
    for (const key of req.request.params.keys()) params[key] = req.request.params.get(key)!;
    return { req, params };
  }

  afterEach(() => backend.verify());

  it('lists the materials in use, by name, with hardness, flags and units', async () => {
    await open(['author'], 'metric+imperial');
    const { req, params } = await nextListRequest();
    expect(params).toEqual({ page: '0', pageSize: '25', sort: 'name', dir: 'asc', archived: 'no' });
    req.flush(page());
    await fixture.whenStable();

    const rows = Array.from(root.querySelectorAll('tr.mat-mdc-row'));
    expect(rows).toHaveLength(2);
    expect(rows[0].textContent).toContain('EN 1.7225');
    expect(rows[0].textContent).toContain('Plain and low-alloy steels');
    expect(rows[0].textContent).toContain('32 HRC');
    const second = rows[1].textContent!;
    expect(second).toContain('Archived');
    expect(second).toContain('60 HRC');
    expect(second).toContain('Case-hardened, 0.80 mm (0.031 in) deep');
    expect(second).toContain('Heat-sensitive');
    expect(second).not.toContain('Hazardous dust');
  });

  it('filters by group and archive state, and sorts on the server', async () => {
    await open(['admin']);
    (await nextListRequest()).req.flush(page());
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const [group, archived] = await loader.getAllHarnesses(MatSelectHarness);

    // Harnesses wait for the page to settle, which it does once the list they ask for is answered.
    let acting = group.clickOptions({ text: 'Hardened and tool steels' });
    const byGroup = await nextListRequest();
    expect(byGroup.params).toMatchObject({ group: 'hardened-tool-steel', page: '0' });
    byGroup.req.flush(page([materials[1]]));
    await acting;

    acting = archived.clickOptions({ text: 'All' });
    const all = await nextListRequest();
    expect(all.params).toMatchObject({ group: 'hardened-tool-steel', archived: 'all' });
    all.req.flush(page([materials[1]]));
    await acting;

    const [designation] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Designation' });
    acting = designation.click();
    const sorted = await nextListRequest();
    expect(sorted.params).toMatchObject({ sort: 'designation', dir: 'asc' });
    sorted.req.flush(page([materials[1]]));
    await acting;
  });

  it('gives an author the add button and a menu of edit, archive and delete on each row', async () => {
    await open(['author']);
    (await nextListRequest()).req.flush(page());
    await fixture.whenStable();

    expect(root.textContent).toContain('Add material');
    expect(root.querySelector('button[aria-label="Actions for Tempered chromium-molybdenum steel"]')).not.toBeNull();
    const [, archivedRowMenu] = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatMenuHarness);
    await archivedRowMenu.open();
    const items = await Promise.all((await archivedRowMenu.getItems()).map((i) => i.getText()));
    // The icon ligature (e.g. "edit") comes first in each item's text.
    expect(items.map((t) => t.replace(/^(edit|unarchive|archive|delete)/, ''))).toEqual(['Edit', 'Unarchive', 'Delete (or archive if a recipe uses it)']);
  });

  it('shows an operator the table without any edit action', async () => {
    await open(['operator']);
    (await nextListRequest()).req.flush(page());
    await fixture.whenStable();

    expect(root.querySelectorAll('tr.mat-mdc-row')).toHaveLength(2);
    expect(root.textContent).not.toContain('Add material');
    expect(root.querySelector('button[aria-label^="Actions for"]')).toBeNull();
    expect(root.querySelector('th.mat-column-actions')).toBeNull();
  });

  it('tells the user when a delete archived the material because a recipe uses it', async () => {
    await open(['author']);
    (await nextListRequest()).req.flush(page());
    await fixture.whenStable();
    vi.spyOn(TestBed.inject(MatDialog), 'open').mockReturnValue({ afterClosed: () => of(true) } as never);

    const [menu] = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatMenuHarness);
    await menu.clickItem({ text: /Delete/ });

    const del = await vi.waitFor(() => backend.expectOne({ method: 'DELETE', url: '/api/materials/5' }));
    del.flush({ archived: true });
    await vi.waitFor(() =>
      expect(notifier.show).toHaveBeenCalledWith('Tempered chromium-molybdenum steel is used by a recipe, so it was archived instead of deleted.', 'OK', 8000),
    );
    (await nextListRequest()).req.flush(page());
  });
});
