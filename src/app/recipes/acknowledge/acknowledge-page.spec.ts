import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { ChangesSinceAcknowledgedDto, RecipeComparison, RecipeVersionDto } from '@shared/recipe-types';
import { aVersionToAcknowledge, anOperator, myAcknowledgement } from '../../../testing/acknowledgement-fixtures';
import { aMachine, aWheel } from '../../../testing/stock-and-recipe-fixtures';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { AcknowledgePage } from './acknowledge-page';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

@Component({ template: 'elsewhere' })
class Elsewhere {}

describe('AcknowledgePage', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;

  const neverAcknowledged: ChangesSinceAcknowledgedDto = { since: null, comparison: null };

  async function open(
    url: string,
    version: RecipeVersionDto,
    machineName = 'Bench saw B2',
    list?: RecipeVersionDto[],
    changes: ChangesSinceAcknowledgedDto = neverAcknowledged,
  ): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'recipes/:id/acknowledge', component: AcknowledgePage },
            { path: '**', component: Elsewhere },
          ],
          withComponentInputBinding(),
        ),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        { provide: Session, useValue: { user: signal(anOperator()), roles: signal(['operator']), clear: vi.fn() } },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    if (list) (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions' }))).flush(list);
    (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: `/api/recipes/3/versions/${version.version}` }))).flush(version);
    (await vi.waitFor(() => backend.expectOne('/api/wheels/2'))).flush(aWheel());
    backend.expectOne('/api/machines/1').flush(aMachine({ name: machineName }));
    // The operator's own comparison, asked for a later version they are to read.
    if (version.version > 1 && version.myAcknowledgement) {
      (await vi.waitFor(() => backend.expectOne(`/api/recipes/3/versions/${version.version}/changes-since-acknowledged`))).flush(changes);
    }
    await harness.fixture.whenStable();
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  function words(el: Element | null): string {
    return el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  function acknowledgeButton(): HTMLButtonElement | null {
    return root().querySelector<HTMLButtonElement>('[data-testid="acknowledge"] button');
  }

  afterEach(() => backend.verify());

  it('shows what changed, the key settings and the instructions, with the statement to confirm', async () => {
    await open('/recipes/3/acknowledge?v=2', aVersionToAcknowledge());

    const header = words(root().querySelector('header'));
    expect(header).toContain('KB-0003');
    expect(header).toContain('version 2');
    expect(header).toContain('Tempered bar, transverse');
    expect(header).toContain('Effective from 2026-11-30');
    expect(words(root().querySelector('[data-testid="change-reason"]'))).toBe('Slower feed for the harder batch.');
    expect(root().querySelector('[data-testid="compare-link"]')!.getAttribute('href')).toBe('/recipes/3/compare?from=1&to=2');

    const settings = words(root().querySelector('kb-key-parameters'));
    expect(settings).toContain('Bench saw B2');
    expect(settings).toContain('Alumina 250 general steel');
    expect(settings).toContain('3000 rpm');
    expect(settings).toContain('0.50 mm/s');
    expect(settings).toContain('Straight plunge');
    expect(settings).toContain('Vise with backstop');
    expect(settings).toContain('Water-soluble coolant');

    // Instructions go through the sanitized Markdown view.
    const steps = Array.from(root().querySelectorAll('kb-markdown-view li')).map(words);
    expect(steps).toEqual(['Clamp the bar.', 'Start the coolant.']);
    expect(words(root())).toContain('Keep the guard closed.');

    expect(words(root().querySelector('.kb-ack-hint'))).toContain('then acknowledge at the end of the page');
    expect(words(root().querySelector('#kb-ack-statement'))).toBe('I have read and understood version 2 of KB-0003.');
    expect(words(acknowledgeButton())).toContain('Acknowledge');
    expect(root().querySelector('[data-testid="print-sheet"]')).toBeNull();
  });

  it('posts the acknowledgement and confirms it with the time, the bench sheet and the finder', async () => {
    await open('/recipes/3/acknowledge?v=2', aVersionToAcknowledge());

    acknowledgeButton()!.click();
    const post = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/acknowledge' }));
    expect(post.request.body).toEqual({});
    post.flush(myAcknowledgement({ acknowledgedAt: '2026-12-01T09:15:00.000Z' }));
    await harness.fixture.whenStable();

    const done = root().querySelector('[data-testid="acknowledged"]')!;
    expect(words(done.querySelector('h2'))).toBe('Acknowledged');
    expect(words(done)).toContain('You acknowledged version 2 of KB-0003 on 2026-12-01 09:15 UTC.');
    const sheet = done.querySelector<HTMLAnchorElement>('[data-testid="print-sheet"]')!;
    expect(sheet.getAttribute('href')).toBe('/api/recipes/3/versions/2/sheet.pdf');
    expect(sheet.getAttribute('target')).toBe('_blank');
    expect(done.querySelector('a[href="/finder"]')!.textContent).toContain('Find a recipe');
    expect(acknowledgeButton()).toBeNull();
    // The button was at the end of the page: the confirmation at the top takes the focus.
    await vi.waitFor(() => expect(document.activeElement).toBe(done));
  });

  it("shows the server's reason when it refuses, and keeps the statement", async () => {
    await open('/recipes/3/acknowledge?v=2', aVersionToAcknowledge());

    acknowledgeButton()!.click();
    (await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/acknowledge' }))).flush(
      { code: 'CONFLICT', errors: [{ path: '', message: 'Version 2 of KB-0003 was withdrawn; there is nothing to acknowledge.' }] },
      { status: 409, statusText: 'Conflict' },
    );
    await harness.fixture.whenStable();

    expect(words(root().querySelector('[data-testid="refusal"]'))).toBe('Version 2 of KB-0003 was withdrawn; there is nothing to acknowledge.');
    expect(root().querySelector('[data-testid="refusal"]')!.getAttribute('role')).toBe('alert');
    expect(acknowledgeButton()!.disabled).toBe(false);
    expect(root().querySelector('[data-testid="acknowledged"]')).toBeNull();
    expect(TestBed.inject(Notifier).show).not.toHaveBeenCalled();
  });

  it('says when the version was already acknowledged, and asks nothing', async () => {
    await open('/recipes/3/acknowledge?v=2', aVersionToAcknowledge({ myAcknowledgement: myAcknowledgement({ acknowledgedAt: '2026-11-30T07:02:00.000Z' }) }));

    const done = root().querySelector('[data-testid="acknowledged"]')!;
    expect(words(done.querySelector('h2'))).toBe('Already acknowledged');
    expect(words(done)).toContain('You already acknowledged version 2 of KB-0003 on 2026-11-30 07:02 UTC.');
    expect(done.querySelector('[data-testid="print-sheet"]')).not.toBeNull();
    expect(acknowledgeButton()).toBeNull();
    backend.expectNone({ method: 'POST' });
  });

  it('explains when the version is not for one of their machines and links to the recipe', async () => {
    await open('/recipes/3/acknowledge?v=2', aVersionToAcknowledge({ myAcknowledgement: null }), 'Floor saw F1');

    const info = root().querySelector('[data-testid="not-required"]')!;
    expect(words(info)).toContain('runs on Floor saw F1, which is not one of your machines');
    expect(info.querySelector('a')!.getAttribute('href')).toBe('/recipes/3?v=2');
    expect(acknowledgeButton()).toBeNull();
    expect(root().querySelector('kb-markdown-view')).toBeNull();
  });

  it('takes the newest approved version when the link names none', async () => {
    const { myAcknowledgement: _unsaid, ...listed } = aVersionToAcknowledge();
    const draft = aVersionToAcknowledge({ version: 3, status: 'draft', myAcknowledgement: undefined });
    await open('/recipes/3/acknowledge', aVersionToAcknowledge(), 'Bench saw B2', [draft, listed]);
    expect(words(root().querySelector('#kb-ack-statement'))).toBe('I have read and understood version 2 of KB-0003.');
  });

  it('explains when the version is not approved', async () => {
    await open('/recipes/3/acknowledge?v=2', aVersionToAcknowledge({ status: 'superseded', myAcknowledgement: null }));
    expect(words(root().querySelector('[data-testid="not-required"]'))).toContain(
      'Version 2 of KB-0003 is superseded: only approved versions are acknowledged.',
    );
  });

  it('shows what changed since the version of the recipe the operator last acknowledged', async () => {
    const comparison: RecipeComparison = {
      recipeId: 3,
      number: 'KB-0003',
      from: { version: 1, status: 'superseded', title: 'Tempered bar, transverse' },
      to: { version: 2, status: 'approved', title: 'Tempered bar, transverse' },
      parameters: [{ path: 'cutting.feedMmS', label: 'Feed', before: '0.60 mm/s', after: '0.50 mm/s' }],
      texts: [],
    };
    await open('/recipes/3/acknowledge?v=2', aVersionToAcknowledge(), 'Bench saw B2', undefined, {
      since: { version: 1, acknowledgedAt: '2026-10-02T08:00:00.000Z' },
      comparison,
    });
    expect(words(root().querySelector('[data-testid="since"]'))).toBe('Since version 1, which you acknowledged on 2026-10-02:');
    const shown = words(root().querySelector('kb-comparison-view'));
    expect(shown).toContain('Feed');
    expect(shown).toContain('0.60 mm/s');
    expect(shown).toContain('0.50 mm/s');
    expect(root().querySelector('[data-testid="never-acknowledged"]')).toBeNull();
  });

  it('says so when the operator never acknowledged a version of the recipe, and shows the version as it is', async () => {
    await open('/recipes/3/acknowledge?v=2', aVersionToAcknowledge());
    expect(words(root().querySelector('[data-testid="never-acknowledged"]'))).toContain('You have not acknowledged a version of this recipe before');
    expect(root().querySelector('kb-comparison-view')).toBeNull();
    expect(words(root().querySelector('kb-key-parameters'))).toContain('Bench saw B2');
  });
});
