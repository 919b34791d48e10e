import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { UserDto } from '@shared/api-types';
import type { FinderHit } from '@shared/recipe-types';
import { aVersionToAcknowledge, anOperator, myAcknowledgement } from '../../../testing/acknowledgement-fixtures';
import { aMachine, aMaterial, aRecipeSummary } from '../../../testing/stock-and-recipe-fixtures';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { Finder } from './finder';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

@Component({ template: 'elsewhere' })
class Elsewhere {}

/** The finder for a person at the saw: their own machine first, and the print gate of a version still to acknowledge. */
describe('Finder for operators', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let openTab: ReturnType<typeof vi.spyOn>;

  const hit: FinderHit = {
    summary: aRecipeSummary({ id: 3, number: 'KB-0003', title: 'Tempered bar, transverse', version: 2 }),
    score: 90,
    reasons: ['Size 30 mm within 10–40 mm'],
  };

  async function open(url: string, user: UserDto = anOperator({ machineIds: [4, 1] })): Promise<void> {
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
        { provide: Session, useValue: { user: signal(user), roles: signal(user.roles), clear: vi.fn() } },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    (await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/materials'))).flush({ items: [aMaterial()], total: 1, page: 0, pageSize: 200 });
    backend
      .expectOne((r) => r.url === '/api/machines')
      .flush({ items: [aMachine({ id: 1 }), aMachine({ id: 4, name: 'Precision saw P1' })], total: 2, page: 0, pageSize: 200 });
    await harness.fixture.whenStable();
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  /** The machine the select shows; empty for "Any machine" (null), which mat-select shows as no value. */
  function shownMachine(): string {
    return root().querySelector('[formcontrolname="machineId"] .mat-mdc-select-value')?.textContent?.trim() ?? '';
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

  beforeEach(() => {
    openTab = vi.spyOn(window, 'open').mockReturnValue({ opener: window } as unknown as Window);
  });

  afterEach(() => {
    backend.verify();
    openTab.mockRestore();
    document.querySelectorAll('.cdk-overlay-container').forEach((el) => (el.innerHTML = ''));
  });

  describe('machine filter', () => {
    it("starts on the operator's first assigned machine and searches with it", async () => {
      await open('/finder');
      expect(shownMachine()).toBe('Precision saw P1');
      type('sizeMm', '30');
      root().querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
      expect(await answerFinder([hit])).toEqual({ sizeMm: '30', machineId: '4' });
      expect(TestBed.inject(Router).url).toBe('/finder?sizeMm=30&machineId=4');
    });

    it('keeps "Any machine" when a search chose it', async () => {
      await open('/finder?sizeMm=30');
      expect(await answerFinder([hit])).toEqual({ sizeMm: '30' });
      expect(shownMachine()).toBe('');
    });

    it('keeps the machine the URL names', async () => {
      await open('/finder?machineId=1');
      expect(await answerFinder([hit])).toEqual({ machineId: '1' });
      expect(shownMachine()).toBe('Bench saw B2');
    });

    it('goes back to the own machine on Clear', async () => {
      await open('/finder?sizeMm=30');
      await answerFinder([hit]);
      Array.from(root().querySelectorAll<HTMLButtonElement>('button'))
        .find((b) => b.textContent?.trim() === 'Clear')!
        .click();
      await harness.fixture.whenStable();
      expect(shownMachine()).toBe('Precision saw P1');
      backend.expectNone((r) => r.url === '/api/finder');
    });

    it('has no default for an operator without machines, a session without the field, or someone who is not an operator', async () => {
      await open('/finder', anOperator({ machineIds: [] }));
      expect(shownMachine()).toBe('');
      TestBed.resetTestingModule();

      const { machineIds: _left, ...older } = anOperator();
      await open('/finder', older as UserDto);
      expect(shownMachine()).toBe('');
      TestBed.resetTestingModule();

      await open('/finder', anOperator({ roles: ['auditor'], machineIds: [4] }));
      expect(shownMachine()).toBe('');
    });
  });

  describe('print gate', () => {
    async function clickPrint(): Promise<void> {
      await open('/finder?sizeMm=30');
      await answerFinder([hit]);
      const sheet = root().querySelector<HTMLAnchorElement>('a[aria-label="Print sheet for KB-0003"]')!;
      expect(sheet.getAttribute('href')).toBe('/api/recipes/3/versions/2/sheet.pdf');
      sheet.click();
    }

    async function dialog(): Promise<HTMLElement> {
      await harness.fixture.whenStable();
      return vi.waitFor(() => {
        const el = document.querySelector<HTMLElement>('kb-acknowledge-dialog');
        expect(el).not.toBeNull();
        return el!;
      });
    }

    it('asks the version first and opens the sheet when nothing is left to acknowledge', async () => {
      await clickPrint();
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions/2' }))).flush(
        aVersionToAcknowledge({ myAcknowledgement: myAcknowledgement({ acknowledgedAt: '2026-11-30T07:02:00.000Z' }) }),
      );
      await vi.waitFor(() => expect(openTab).toHaveBeenCalledWith('/api/recipes/3/versions/2/sheet.pdf', '_blank'));
      expect(document.querySelector('kb-acknowledge-dialog')).toBeNull();
    });

    it('blocks the sheet of a version still to acknowledge until the dialog has recorded it', async () => {
      await clickPrint();
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions/2' }))).flush(aVersionToAcknowledge());
      const el = await dialog();
      expect(el.querySelector('[data-testid="ack-statement"]')!.textContent).toBe('I have read and understood version 2 of KB-0003.');
      expect(openTab).not.toHaveBeenCalled();

      Array.from(el.querySelectorAll<HTMLButtonElement>('button'))
        .find((b) => /Acknowledge and print/.test(b.textContent ?? ''))!
        .click();
      (await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/acknowledge' }))).flush(
        myAcknowledgement({ acknowledgedAt: '2026-12-01T09:15:00.000Z' }),
      );
      await vi.waitFor(() => expect(openTab).toHaveBeenCalledWith('/api/recipes/3/versions/2/sheet.pdf', '_blank'));
    });

    it('opens nothing when the operator cancels', async () => {
      await clickPrint();
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/recipes/3/versions/2' }))).flush(aVersionToAcknowledge());
      const el = await dialog();
      Array.from(el.querySelectorAll<HTMLButtonElement>('button'))
        .find((b) => b.textContent?.trim() === 'Cancel')!
        .click();
      await vi.waitFor(() => expect(document.querySelector('kb-acknowledge-dialog')).toBeNull());
      backend.expectNone({ method: 'POST' });
      expect(openTab).not.toHaveBeenCalled();
    });
  });
});
