import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { errorInterceptor } from '../http/error-interceptor';
import { Notifier } from '../notifier/notifier';
import { Session } from '../session/session';
import { LabDateFormat } from './lab-date-format';
import { LabDatePipe } from './lab-date-pipe';

describe('LabDateFormat', () => {
  let backend: HttpTestingController;
  let dates: LabDateFormat;
  let navigations: unknown[];

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: Session, useValue: { clear: vi.fn() } },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    dates = TestBed.inject(LabDateFormat);
    const router = TestBed.inject(Router);
    navigations = [];
    vi.spyOn(router, 'navigate').mockImplementation((commands) => (navigations.push(commands), Promise.resolve(true)));
    vi.spyOn(router, 'navigateByUrl').mockImplementation((url) => (navigations.push(url), Promise.resolve(true)));
  });

  afterEach(() => {
    backend.verify();
    vi.useRealTimers();
  });

  it("asks the lab's settings once and writes dates in the format they name", () => {
    const pipe = TestBed.runInInjectionContext(() => new LabDatePipe());
    expect(pipe.transform('2026-12-05T14:05:00.000Z', 'time')).toBe('2026-12-05 14:05 UTC');
    backend.expectOne({ method: 'GET', url: '/api/settings/lab' }).flush({ dateFormat: 'dmy-dot' });
    expect(pipe.transform('2026-12-05T14:05:00.000Z', 'time')).toBe('05.12.2026 14:05 UTC');
    expect(pipe.transform('2026-12-05')).toBe('05.12.2026');
    backend.expectNone('/api/settings/lab');
  });

  it('keeps ISO on a signed-out page: the 401 sends nobody to sign in, and the next ask waits', () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2026-12-05T14:05:00.000Z'));
    expect(dates.format()).toBe('iso');
    backend
      .expectOne('/api/settings/lab')
      .flush({ code: 'NOT_SIGNED_IN', errors: [{ path: '', message: 'Sign in first.' }] }, { status: 401, statusText: 'Unauthorized' });
    expect(navigations).toEqual([]);
    // Shown again and again (an impure pipe): no request storm.
    for (let i = 0; i < 5; i++) expect(dates.format()).toBe('iso');
    backend.expectNone('/api/settings/lab');
    vi.setSystemTime(new Date('2026-12-05T14:06:00.000Z'));
    dates.format();
    backend.expectOne('/api/settings/lab').flush({ dateFormat: 'mdy-slash' });
    expect(dates.format()).toBe('mdy-slash');
  });
});
