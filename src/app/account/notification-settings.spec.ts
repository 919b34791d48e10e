import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { provideRouter } from '@angular/router';
import type { NotificationPreferenceDto } from '@shared/api-types';
import { aUser } from '../../testing/user-fixture';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { NotificationSettings } from './notification-settings';

describe('NotificationSettings', () => {
  let fixture: ComponentFixture<NotificationSettings>;
  let backend: HttpTestingController;
  let root: HTMLElement;
  let notifier: { show: ReturnType<typeof vi.fn> };

  const items: NotificationPreferenceDto[] = [
    { kind: 'review-outcome', label: 'My version was returned or approved', audience: 'authors', optional: true, enabled: true },
    { kind: 'cut-flagged', label: 'An operator flagged a cut on my recipe', audience: 'authors', optional: true, enabled: false },
    {
      kind: 'version-current',
      label: 'A new version is in use on my machine (acknowledge it)',
      audience: 'operators',
      optional: false,
      enabled: true,
    },
  ];

  beforeEach(async () => {
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      imports: [NotificationSettings],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: Notifier, useValue: notifier },
        { provide: Session, useValue: { user: signal(aUser()), clear: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(NotificationSettings);
    root = fixture.nativeElement;
    await fixture.whenStable();
    backend.expectOne({ method: 'GET', url: '/api/session/notifications' }).flush({ items });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  async function toggle(label: string): Promise<MatSlideToggleHarness> {
    return TestbedHarnessEnvironment.loader(fixture).getHarness(MatSlideToggleHarness.with({ label }));
  }

  it('shows one switch per kind, with its audience; the acknowledgement mail cannot be turned off', async () => {
    const all = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatSlideToggleHarness);
    expect(await Promise.all(all.map((t) => t.isChecked()))).toEqual([true, false, true]);
    expect(await Promise.all(all.map((t) => t.isDisabled()))).toEqual([false, false, true]);
    const always = root.querySelector('[data-kind="version-current"]')!.textContent!;
    expect(always).toContain('For operators.');
    expect(always).toContain('Always sent: you must acknowledge new versions for your machines.');
  });

  it('PATCHes the one kind changed and confirms', async () => {
    const flagged = await toggle('An operator flagged a cut on my recipe');
    await flagged.toggle();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'PATCH', url: '/api/session/notifications' }));
    expect(req.request.body).toEqual({ 'cut-flagged': true });
    req.flush({ items: items.map((i) => (i.kind === 'cut-flagged' ? { ...i, enabled: true } : i)) });
    await vi.waitFor(() => expect(notifier.show).toHaveBeenCalledWith('You will get mails for "An operator flagged a cut on my recipe".', 'OK', 4000));
    expect(await flagged.isChecked()).toBe(true);
  });

  it('puts the switch back when the server refuses', async () => {
    const outcome = await toggle('My version was returned or approved');
    await outcome.toggle();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'PATCH', url: '/api/session/notifications' }));
    expect(req.request.body).toEqual({ 'review-outcome': false });
    req.flush({ code: 'DATABASE_UNAVAILABLE', errors: [{ path: '', message: 'Try again later.' }] }, { status: 503, statusText: 'x' });
    await vi.waitFor(async () => expect(await outcome.isChecked()).toBe(true));
    expect(notifier.show).toHaveBeenCalledWith('Try again later.');
  });
});
