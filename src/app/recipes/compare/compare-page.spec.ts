import { Clipboard } from '@angular/cdk/clipboard';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, type TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonToggleGroupHarness } from '@angular/material/button-toggle/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { RecipeComparison } from '@shared/recipe-types';
import { aRecipeVersion } from '../../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../../testing/user-fixture';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { ComparePage } from './compare-page';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

@Component({ template: 'recipe page' })
class RecipeStub {}

describe('ComparePage', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let router: Router;
  let copied: string[];
  let notifier: { show: ReturnType<typeof vi.fn> };

  const versions = [
    aRecipeVersion({ version: 3, status: 'draft', contentHash: null }),
    aRecipeVersion({ version: 2, status: 'approved' }),
    aRecipeVersion({ version: 1, status: 'superseded' }),
  ];

  function aComparison(from: number, to: number): RecipeComparison {
    return {
      recipeId: 3,
      number: 'KB-0003',
      from: { version: from, status: 'approved', title: 'Tempered bar, transverse' },
      to: { version: to, status: 'draft', title: 'Tempered bar, transverse' },
      parameters: [{ path: 'cutting.wheelRpm', label: 'Wheel speed', before: '2800 rpm', after: '2500 rpm' }],
      texts: [{ path: 'instructions', label: 'Instructions', parts: [{ value: 'Dress the wheel ' }, { value: 'first', added: true }] }],
    };
  }

  async function open(url: string): Promise<void> {
    copied = [];
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'recipes/:id/compare', component: ComparePage },
            { path: 'recipes/:id', component: RecipeStub },
          ],
          withComponentInputBinding(),
        ),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        { provide: Session, useValue: { user: signal(aUser({ roles: ['auditor'] })), roles: signal(['auditor']), clear: vi.fn() } },
        { provide: Notifier, useValue: notifier },
        { provide: Clipboard, useValue: { copy: (text: string) => copied.push(text) > 0 } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions' }))).flush(versions);
  }

  async function nextCompare(): Promise<{ req: TestRequest; params: Record<string, string> }> {
    const req = await vi.waitFor(() => backend.expectOne((r) => r.method === 'GET' && r.url === '/api/recipes/3/compare'));
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

  it('compares the versions the URL names, in the layout it names', async () => {
    await open('/recipes/3/compare?from=1&to=3&layout=inline');
    const { req, params } = await nextCompare();
    expect(params).toEqual({ from: '1', to: '3' });
    req.flush(aComparison(1, 3));
    await harness.fixture.whenStable();

    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const [from, to] = await loader.getAllHarnesses(MatSelectHarness);
    expect(await from.getValueText()).toContain('v1 · Superseded');
    expect(await to.getValueText()).toContain('v3 · Draft');
    const layout = await loader.getHarness(MatButtonToggleGroupHarness);
    const [checked] = await layout.getToggles({ checked: true });
    expect(await checked.getText()).toContain('Inline');

    expect(root().querySelector('[data-testid="inline-text"]')).not.toBeNull();
    expect(root().querySelector('table.kb-params tbody')?.textContent).toContain('2800 rpm');
    expect(root().querySelector('h1')?.textContent).toContain('KB-0003 · Tempered bar, transverse');
    expect(root().querySelector<HTMLAnchorElement>('a.kb-back')?.getAttribute('href')).toBe('/recipes/3');
  });

  it('without parameters, compares the newest version with the one before it, side by side', async () => {
    await open('/recipes/3/compare');
    const { req, params } = await nextCompare();
    expect(params).toEqual({ from: '2', to: '3' });
    req.flush(aComparison(2, 3));
    await harness.fixture.whenStable();
    expect(root().querySelector('[data-testid="old-text"]')).not.toBeNull();
    expect(root().querySelector('[data-testid="inline-text"]')).toBeNull();
  });

  it('writes a picked version into the URL and asks for the new pair', async () => {
    await open('/recipes/3/compare?from=2&to=3');
    (await nextCompare()).req.flush(aComparison(2, 3));

    const [from] = await TestbedHarnessEnvironment.loader(harness.fixture).getAllHarnesses(MatSelectHarness);
    // The harness waits for the page to settle, which it does once the new pair is answered.
    const picking = from.clickOptions({ text: /^v1 ·/ });
    const { req, params } = await nextCompare();
    expect(params).toEqual({ from: '1', to: '3' });
    expect(queryParams()).toEqual({ from: '1', to: '3', layout: 'side-by-side' });
    req.flush(aComparison(1, 3));
    await picking;
  });

  it('switches the layout in the URL without asking the server again', async () => {
    await open('/recipes/3/compare?from=2&to=3');
    (await nextCompare()).req.flush(aComparison(2, 3));

    const layout = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatButtonToggleGroupHarness);
    const [, inline] = await layout.getToggles();
    await inline.check();
    await vi.waitFor(() => expect(queryParams()).toEqual({ from: '2', to: '3', layout: 'inline' }));
    await harness.fixture.whenStable();
    expect(root().querySelector('[data-testid="inline-text"]')).not.toBeNull();
    backend.expectNone((r) => r.url === '/api/recipes/3/compare');
  });

  it('swaps the two sides', async () => {
    await open('/recipes/3/compare?from=2&to=3');
    (await nextCompare()).req.flush(aComparison(2, 3));
    root().querySelector<HTMLButtonElement>('button[aria-label="Swap the two versions"]')!.click();
    const { req, params } = await nextCompare();
    expect(params).toEqual({ from: '3', to: '2' });
    req.flush(aComparison(3, 2));
  });

  it('copies a link that opens the same comparison', async () => {
    await open('/recipes/3/compare');
    (await nextCompare()).req.flush(aComparison(2, 3));
    const copy = Array.from(root().querySelectorAll('button')).find((b) => b.textContent?.includes('Copy link'))!;
    copy.click();
    expect(copied).toEqual([`${location.origin}/recipes/3/compare?from=2&to=3&layout=side-by-side`]);
    expect(notifier.show).toHaveBeenCalledWith('Link to this comparison copied.', 'OK', 4000);
  });

  it('asks nothing when both sides name the same version', async () => {
    await open('/recipes/3/compare?from=2&to=2');
    await harness.fixture.whenStable();
    backend.expectNone((r) => r.url === '/api/recipes/3/compare');
    expect(root().querySelector('[role="status"]')?.textContent).toContain('Both sides show version 2');
  });
});
