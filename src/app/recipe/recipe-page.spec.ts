import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTabGroupHarness } from '@angular/material/tabs/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import type { Role } from '../../../shared/roles';
import { aMachine, aMaterial, aRecipeVersion, aWheel } from '../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../testing/user-fixture';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { RecipePage } from './recipe-page';

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
      { id: 'feed-ceiling', severity: 'warning', message: 'Feed 0.5 mm/s is above the lab ceiling of 0.3 mm/s.', reason: 'Start low and raise with experience (common practice).', path: 'cutting.feedMmS' },
      { id: 'rim-note', severity: 'note', message: 'Lowering rpm only helps consumable wheels.', reason: 'Common practice.', path: null },
      { id: 'wheel-overspeed', severity: 'blocker', message: 'The wheel would run at 94 m/s; it is marked for 80 m/s.', reason: 'EN 12413: never exceed the marked speed.', path: 'cutting.wheelRpm' },
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

  async function open(url: string, roles: Role[] = ['author']): Promise<void> {
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
    await harness.fixture.whenStable();
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  afterEach(() => backend.verify());

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
    expect(labels.map((l) => l.replace(/\d+/g, '').trim())).toEqual(['Parameters', 'Computed', 'Checks', 'Instructions', 'Attachments ()']);

    const parameters = root().querySelector('.kb-cards')!.textContent!;
    expect(parameters).toContain('Tempered chromium-molybdenum steel');
    expect(parameters).toContain('Bench saw B2');
    expect(parameters).toContain('A60K5B');
    expect(parameters).toContain('3000 rpm');
    expect(parameters).toContain('0.50 mm/s');
    expect(parameters).toContain('Vise with backstop');
    expect(parameters).toContain('5 % v/v');
    // The standard cautions sit under the tabs, with the line that local rules take precedence.
    expect(root().querySelector('kb-standard-cautions')!.textContent).toContain("the machine's manual and the lab's licensed safety practice take precedence");
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
    await tabs.selectTab({ label: 'Computed' });
    await harness.fixture.whenStable();

    // π × 250 mm × 3000 rpm / 60 000 = 39.27 m/s; 80 − 39.27 = 40.73 m/s to spare.
    const values = root().querySelector('.kb-values')!.textContent!;
    expect(values).toMatch(/Peripheral speed\s*39\.3 m\/s/);
    expect(values).toMatch(/Margin to the marked maximum\s*40\.7 m\/s/);
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
});
