import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTabGroupHarness } from '@angular/material/tabs/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { RecipeVersionDto } from '@shared/recipe-types';
import type { Role } from '@shared/roles';
import { aVersionToAcknowledge, anAcknowledgements, anOperator, myAcknowledgement } from '../../../testing/acknowledgement-fixtures';
import { aLabLimits, aMachine, aMaterial, aRecipeVersion, aWheel } from '../../../testing/stock-and-recipe-fixtures';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { RecipePage } from './recipe-page';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

@Component({ template: 'elsewhere' })
class Elsewhere {}

/** The recipe page's part in acknowledgements: the operator's banner and print gate, and the list for everyone else. */
describe('RecipePage acknowledgements', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let openTab: ReturnType<typeof vi.spyOn>;

  const previous = aRecipeVersion({ version: 1, status: 'superseded' });

  async function open(versions: RecipeVersionDto[], roles: Role[] = ['operator']): Promise<void> {
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
        provideLabDateFormat(),
        { provide: Session, useValue: { user: signal(anOperator({ roles })), roles: signal(roles), clear: vi.fn() } },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/recipes/3');
    (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions' }))).flush(versions);
    (await vi.waitFor(() => backend.expectOne('/api/materials/5'))).flush(aMaterial());
    backend.expectOne('/api/wheels/2').flush(aWheel());
    backend.expectOne('/api/machines/1').flush(aMachine());
    backend.expectOne('/api/settings/limits').flush(aLabLimits());
    await harness.fixture.whenStable();
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  function words(el: Element | null): string {
    return el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  function printSheet(): HTMLElement {
    return root().querySelector<HTMLElement>('[data-testid="print-sheet"]')!;
  }

  async function dialog(): Promise<HTMLElement> {
    await harness.fixture.whenStable();
    return vi.waitFor(() => {
      const el = document.querySelector<HTMLElement>('kb-acknowledge-dialog');
      expect(el).not.toBeNull();
      return el!;
    });
  }

  function dialogButton(el: HTMLElement, name: RegExp): HTMLButtonElement {
    return Array.from(el.querySelectorAll<HTMLButtonElement>('button')).find((b) => name.test(b.textContent ?? ''))!;
  }

  beforeEach(() => {
    openTab = vi.spyOn(window, 'open').mockReturnValue({ opener: window } as unknown as Window);
  });

  afterEach(() => {
    backend.verify();
    openTab.mockRestore();
    document.querySelectorAll('.cdk-overlay-container').forEach((el) => (el.innerHTML = ''));
  });

  describe('for an operator of the machine', () => {
    it('puts a banner at the top that leads to the acknowledge page', async () => {
      await open([aVersionToAcknowledge(), previous]);
      const banner = root().querySelector('[data-testid="acknowledge-banner"]')!;
      expect(words(banner)).toContain('New version for your machine — acknowledge before use');
      expect(banner.querySelector('a')!.getAttribute('href')).toBe('/recipes/3/acknowledge?v=2');
      // First thing on the page, above the header.
      expect(root().querySelector('.kb-recipe')!.firstElementChild).toBe(banner);
    });

    it('asks the shown version whether it waits for them, since the versions list does not say', async () => {
      const { myAcknowledgement: _unsaid, ...listed } = aVersionToAcknowledge();
      await open([listed, previous]);
      expect(root().querySelector('[data-testid="acknowledge-banner"]')).toBeNull();
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions/2' }))).flush(aVersionToAcknowledge());
      await harness.fixture.whenStable();
      expect(root().querySelector('[data-testid="acknowledge-banner"]')).not.toBeNull();
      expect(printSheet().tagName).toBe('BUTTON');
    });

    it('does not open the sheet while the version waits: the dialog asks first, and Cancel leaves it shut', async () => {
      await open([aVersionToAcknowledge(), previous]);
      expect(printSheet().tagName).toBe('BUTTON');
      expect(printSheet().getAttribute('href')).toBeNull();

      printSheet().click();
      const el = await dialog();
      expect(words(el.querySelector('[data-testid="ack-statement"]'))).toBe('I have read and understood version 2 of KB-0003.');
      expect(el.querySelector('[data-testid="read-first"]')!.getAttribute('href')).toBe('/recipes/3/acknowledge?v=2');
      dialogButton(el, /Cancel/).click();
      await harness.fixture.whenStable();
      await vi.waitFor(() => expect(document.querySelector('kb-acknowledge-dialog')).toBeNull());

      backend.expectNone({ method: 'POST' });
      expect(openTab).not.toHaveBeenCalled();
      expect(root().querySelector('[data-testid="acknowledge-banner"]')).not.toBeNull();
    });

    it('"Acknowledge and print" records the acknowledgement, then opens the sheet and lifts the gate', async () => {
      await open([aVersionToAcknowledge(), previous]);
      printSheet().click();
      const el = await dialog();
      dialogButton(el, /Acknowledge and print/).click();
      const post = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/acknowledge' }));
      expect(openTab).not.toHaveBeenCalled();
      post.flush(myAcknowledgement({ acknowledgedAt: '2026-12-01T09:15:00.000Z' }));
      await vi.waitFor(() => expect(openTab).toHaveBeenCalledWith('/api/recipes/3/versions/2/sheet.pdf', '_blank'));
      await vi.waitFor(() => expect(document.querySelector('kb-acknowledge-dialog')).toBeNull());
      await harness.fixture.whenStable();

      expect(root().querySelector('[data-testid="acknowledge-banner"]')).toBeNull();
      expect(printSheet().tagName).toBe('A');
      expect(printSheet().getAttribute('href')).toBe('/api/recipes/3/versions/2/sheet.pdf');
      expect(TestBed.inject(Notifier).show).toHaveBeenCalledWith('KB-0003 version 2 acknowledged.');
    });

    it("shows the server's refusal in the dialog and opens nothing", async () => {
      await open([aVersionToAcknowledge(), previous]);
      printSheet().click();
      const el = await dialog();
      dialogButton(el, /Acknowledge and print/).click();
      (await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/acknowledge' }))).flush(
        { code: 'CONFLICT', errors: [{ path: '', message: 'You are not assigned to Bench saw B2.' }] },
        { status: 409, statusText: 'Conflict' },
      );
      await vi.waitFor(() => expect(words(el.querySelector('[data-testid="ack-refusal"]'))).toBe('You are not assigned to Bench saw B2.'));
      expect(openTab).not.toHaveBeenCalled();
      expect(TestBed.inject(Notifier).show).not.toHaveBeenCalled();
    });

    it('offers a plain link when the browser blocks the new tab', async () => {
      openTab.mockReturnValue(null);
      await open([aVersionToAcknowledge(), previous]);
      printSheet().click();
      const el = await dialog();
      dialogButton(el, /Acknowledge and print/).click();
      (await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/acknowledge' }))).flush(
        myAcknowledgement({ acknowledgedAt: '2026-12-01T09:15:00.000Z' }),
      );
      await harness.fixture.whenStable();
      const link = await vi.waitFor(() => {
        const a = el.querySelector<HTMLAnchorElement>('[data-testid="sheet-link"]');
        expect(a).not.toBeNull();
        return a!;
      });
      expect(link.getAttribute('href')).toBe('/api/recipes/3/versions/2/sheet.pdf');
      expect(link.getAttribute('target')).toBe('_blank');
    });

    it('keeps the plain sheet link and no banner once acknowledged', async () => {
      await open([aVersionToAcknowledge({ myAcknowledgement: myAcknowledgement({ acknowledgedAt: '2026-11-30T07:02:00.000Z' }) }), previous]);
      expect(root().querySelector('[data-testid="acknowledge-banner"]')).toBeNull();
      expect(printSheet().getAttribute('href')).toBe('/api/recipes/3/versions/2/sheet.pdf');
    });

    it('has no Acknowledgements tab', async () => {
      await open([aVersionToAcknowledge(), previous]);
      const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
      const labels = await Promise.all((await tabs.getTabs()).map((t) => t.getLabel()));
      expect(labels).not.toContain('Acknowledgements');
    });
  });

  describe('for authors, approvers, auditors and admins', () => {
    async function openAcknowledgementsTab(): Promise<void> {
      const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
      await tabs.selectTab({ label: 'Acknowledgements' });
      await harness.fixture.whenStable();
    }

    it('lists who has not acknowledged an approved version yet and who has, with the time', async () => {
      await open([aVersionToAcknowledge({ myAcknowledgement: null }), previous], ['approver']);
      expect(root().querySelector('[data-testid="acknowledge-banner"]')).toBeNull();
      await openAcknowledgementsTab();
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions/2/acknowledgements' }))).flush(anAcknowledgements());
      await harness.fixture.whenStable();

      const pending = root().querySelector('[data-testid="pending"]')!;
      expect(words(pending.querySelector('h2'))).toContain('Not yet (2)');
      expect(Array.from(pending.querySelectorAll('li')).map(words)).toEqual(['Ines Duarte', 'Piet de Vries']);
      const done = root().querySelector('[data-testid="acknowledged"]')!;
      expect(Array.from(done.querySelectorAll('li')).map(words)).toEqual(['Kofi Mensah 2026-12-01 09:15 UTC']);
      expect(words(root().querySelector('kb-acknowledgements-panel'))).toContain('1 of 3 operators of Bench saw B2 have acknowledged version 2.');
    });

    it('says when no operator is assigned to the machine', async () => {
      await open([aVersionToAcknowledge({ myAcknowledgement: null }), previous], ['auditor']);
      await openAcknowledgementsTab();
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions/2/acknowledgements' }))).flush(
        anAcknowledgements({ acknowledged: [], pending: [] }),
      );
      await harness.fixture.whenStable();
      expect(words(root().querySelector('[data-testid="no-operators"]'))).toBe('No operators are assigned to Bench saw B2.');
      expect(root().querySelector('[data-testid="pending"]')).toBeNull();
    });

    it('has no Acknowledgements tab on a version that is not approved', async () => {
      await open([aRecipeVersion({ version: 2, status: 'in-review' }), aRecipeVersion({ version: 1, status: 'approved' })], ['author']);
      const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatTabGroupHarness);
      const labels = await Promise.all((await tabs.getTabs()).map((t) => t.getLabel()));
      expect(labels).not.toContain('Acknowledgements');
    });
  });

  it('puts the "not for use" banner above a withdrawn version an operator opens', async () => {
    await open([aRecipeVersion({ version: 1, status: 'withdrawn' })]);
    expect(words(root().querySelector('[data-testid="not-for-use"]'))).toContain('Not for use — KB-0003 has no version in use.');
  });
});
