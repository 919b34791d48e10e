import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { CheckCodeResult } from '@shared/recipe-types';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { CheckPage } from './check-page';

@Component({ template: 'elsewhere' })
class Elsewhere {}

describe('CheckPage', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let notifier: { show: ReturnType<typeof vi.fn> };

  const result = (overrides: Partial<CheckCodeResult>): CheckCodeResult => ({
    code: '7KQ2M9XD',
    recipeId: 3,
    number: 'KB-0003',
    title: 'Tempered bar, transverse',
    version: 2,
    state: 'current',
    currentVersion: null,
    message: 'Version 2 is the version in force.',
    ...overrides,
  });

  async function open(url: string): Promise<void> {
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'check/:code', component: CheckPage },
            { path: 'check', component: CheckPage },
            { path: '**', component: Elsewhere },
          ],
          withComponentInputBinding(),
        ),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: Notifier, useValue: notifier },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
  }

  async function answer(code: string, body: object, status = 200): Promise<void> {
    const req = await vi.waitFor(() => backend.expectOne({ method: 'GET', url: `/api/check/${code}` }));
    req.flush(body, { status, statusText: status === 200 ? 'OK' : 'Error' });
    await harness.fixture.whenStable();
  }

  function root(): HTMLElement {
    return harness.routeNativeElement!;
  }

  function verdict(): HTMLElement {
    return root().querySelector<HTMLElement>('[data-testid="check-verdict"]')!;
  }

  function words(el: Element | null): string {
    return el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  afterEach(() => backend.verify());

  it('says a current version may be used, with an icon and words', async () => {
    await open('/check/7kq2-m9xd');
    await answer('7KQ2M9XD', result({}));
    expect(verdict().dataset['state']).toBe('current');
    expect(words(verdict().querySelector('h2'))).toBe('Current — this sheet may be used');
    expect(verdict().querySelector('mat-icon')!.textContent).toBe('verified');
    expect(words(verdict())).toContain('Code 7KQ2-M9XD is KB-0003 version 2 — Tempered bar, transverse');
    expect(words(verdict())).toContain('Version 2 is the version in force.');
  });

  it('says a pending version is not in force yet', async () => {
    await open('/check/7KQ2M9XD');
    await answer('7KQ2M9XD', result({ state: 'pending', currentVersion: 1, message: 'Becomes current on 2026-12-15.' }));
    expect(words(verdict().querySelector('h2'))).toBe('Approved, not yet in force — do not use it yet');
    expect(verdict().querySelector('mat-icon')!.textContent).toBe('schedule');
    expect(verdict().querySelector('a[href="/recipes/3?v=1"]')!.textContent).toContain('Open the current version (1)');
  });

  it('says not to use a superseded sheet and links to the current version', async () => {
    await open('/check/7KQ2-M9XD');
    await answer('7KQ2M9XD', result({ state: 'superseded', version: 1, currentVersion: 2, message: 'Version 2 replaced it.' }));
    expect(words(verdict().querySelector('h2'))).toBe('Superseded — do not use this sheet');
    expect(verdict().querySelector('mat-icon')!.textContent).toBe('history');
    const link = verdict().querySelector<HTMLAnchorElement>('a[href="/recipes/3?v=2"]')!;
    expect(words(link)).toContain('Open the current version (2)');
  });

  it('says not to use a withdrawn sheet, and that there is no version in force', async () => {
    await open('/check/7KQ2-M9XD');
    await answer('7KQ2M9XD', result({ state: 'withdrawn', currentVersion: null, message: 'Withdrawn on 2026-11-02.' }));
    expect(words(verdict().querySelector('h2'))).toBe('Withdrawn — do not use this sheet');
    expect(verdict().querySelector('mat-icon')!.textContent).toBe('block');
    expect(words(verdict())).toContain('KB-0003 has no version in force now.');
  });

  it('explains a malformed code without asking the server and lets the code be typed again', async () => {
    await open('/check/HELLO');
    expect(words(root().querySelector('[data-testid="check-malformed"]'))).toContain('That is not a check code.');
    backend.expectNone(() => true);

    const input = root().querySelector<HTMLInputElement>('input')!;
    input.value = ' 7kq2m9xd ';
    input.dispatchEvent(new Event('input'));
    root().querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await answer('7KQ2M9XD', result({}));
    expect(TestBed.inject(Router).url).toBe('/check/7KQ2-M9XD');
    expect(verdict().dataset['state']).toBe('current');
  });

  it('says where the code really is on the sheet: under the QR code at the top right, and at the foot of every page', async () => {
    await open('/check/HELLO');
    for (const where of [words(root().querySelector('[data-testid="check-malformed"]')), words(root().querySelector('mat-hint'))]) {
      expect(where).toContain('under the QR code at the top right of the bench sheet');
      expect(where).toContain('at the foot of every page');
    }
  });

  it('says when no sheet has the code, without a snack bar', async () => {
    await open('/check/7KQ2-M9XE');
    await answer('7KQ2M9XE', { code: 'NOT_FOUND', errors: [{ path: '', message: 'No version has this check code.' }] }, 404);
    expect(words(root().querySelector('[data-testid="check-unknown"]'))).toContain('No sheet has the code 7KQ2-M9XE.');
    expect(notifier.show).not.toHaveBeenCalled();
    expect(root().querySelector('input')).not.toBeNull();
  });
});
