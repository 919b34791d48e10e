import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { SessionDto } from '@shared/api-types';
import { aUser } from '../../../testing/user-fixture';
import { csrfInterceptor } from '../http/csrf-interceptor';
import { errorInterceptor } from '../http/error-interceptor';
import { Notifier } from '../notifier/notifier';
import { Session } from './session';

describe('Session', () => {
  let session: Session;
  let http: HttpTestingController;
  let notifier: { show: ReturnType<typeof vi.fn> };

  beforeEach(() => {
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        { provide: Notifier, useValue: notifier },
        provideHttpClient(withInterceptors([csrfInterceptor, errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    session = TestBed.inject(Session);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('starts anonymous', () => {
    expect(session.isSignedIn()).toBe(false);
    expect(session.user()).toBeNull();
    expect(session.roles()).toEqual([]);
    expect(session.csrfToken()).toBeNull();
  });

  it('load() takes the user and token from GET /api/session', async () => {
    const loading = session.load();
    const body: SessionDto = { user: aUser({ roles: ['admin', 'auditor'] }), csrfToken: 'tok-1', devOutbox: true, signatureNeedsUsername: false };
    http.expectOne({ method: 'GET', url: '/api/session' }).flush(body);
    await loading;

    expect(session.isSignedIn()).toBe(true);
    expect(session.user()?.displayName).toBe('Ragna Lindqvist');
    expect(session.roles()).toEqual(['admin', 'auditor']);
    expect(session.csrfToken()).toBe('tok-1');
    expect(session.mustChangePassword()).toBe(false);
    // This server session already has a signing with username and password.
    expect(session.signatureNeedsUsername()).toBe(false);
    expect(session.devOutbox()).toBe(true);
  });

  it('postAnonymous() fetches a token when there is none, and retries once with a fresh one when it was stale', async () => {
    const posting = session.postAnonymous<{ message: string }>('/api/password/forgot', { email: 'a@lab.example' }, 400);
    (await vi.waitFor(() => http.expectOne('/api/session/csrf'))).flush({ csrfToken: 'stale' });
    const first = await vi.waitFor(() => http.expectOne({ method: 'POST', url: '/api/password/forgot' }));
    expect(first.request.headers.get('x-csrf-token')).toBe('stale');
    first.flush({ code: 'CSRF_INVALID', errors: [{ path: '', message: 'Bad token.' }] }, { status: 403, statusText: 'Forbidden' });
    (await vi.waitFor(() => http.expectOne('/api/session/csrf'))).flush({ csrfToken: 'good' });
    const retry = await vi.waitFor(() => http.expectOne({ method: 'POST', url: '/api/password/forgot' }));
    expect(retry.request.headers.get('x-csrf-token')).toBe('good');
    expect(retry.request.body).toEqual({ email: 'a@lab.example' });
    retry.flush({ message: 'Sent.' });
    await expect(posting).resolves.toEqual({ message: 'Sent.' });
    expect(notifier.show).not.toHaveBeenCalled();
  });

  it('load() on 401 stays anonymous and fetches the anonymous CSRF token', async () => {
    const loading = session.load();
    http
      .expectOne('/api/session')
      .flush({ code: 'NOT_SIGNED_IN', errors: [{ path: '', message: 'Sign in first.' }] }, { status: 401, statusText: 'Unauthorized' });
    const csrf = await vi.waitFor(() => http.expectOne({ method: 'GET', url: '/api/session/csrf' }));
    csrf.flush({ csrfToken: 'anon-tok' });
    await loading;

    expect(session.isSignedIn()).toBe(false);
    expect(session.csrfToken()).toBe('anon-tok');
  });

  it('load() never rejects, even when the server is down', async () => {
    const loading = session.load();
    http
      .expectOne('/api/session')
      .flush({ code: 'DATABASE_UNAVAILABLE', errors: [{ path: '', message: 'Down.' }] }, { status: 503, statusText: 'Unavailable' });
    await expect(loading).resolves.toBeUndefined();
    expect(session.isSignedIn()).toBe(false);
    expect(notifier.show).toHaveBeenCalledWith('Down.');
  });

  it('signIn() posts the credentials with the anonymous token and keeps the fresh token', async () => {
    const loading = session.load();
    http.expectOne('/api/session').flush({ code: 'NOT_SIGNED_IN', errors: [] }, { status: 401, statusText: 'Unauthorized' });
    (await vi.waitFor(() => http.expectOne('/api/session/csrf'))).flush({ csrfToken: 'anon-tok' });
    await loading;

    const signingIn = session.signIn('rlindqvist', 'correct horse');
    const req = http.expectOne({ method: 'POST', url: '/api/session' });
    expect(req.request.body).toEqual({ username: 'rlindqvist', password: 'correct horse' });
    expect(req.request.headers.get('x-csrf-token')).toBe('anon-tok');
    req.flush({ user: aUser({ mustChangePassword: true }), csrfToken: 'fresh-tok' });
    const user = await signingIn;

    expect(user.username).toBe('rlindqvist');
    expect(session.isSignedIn()).toBe(true);
    expect(session.csrfToken()).toBe('fresh-tok');
    expect(session.mustChangePassword()).toBe(true);
  });

  it('signIn() fetches a new token and tries once more when the token was stale', async () => {
    const signingIn = session.signIn('rlindqvist', 'pw');
    (await vi.waitFor(() => http.expectOne('/api/session/csrf'))).flush({ csrfToken: 'stale' });
    (await vi.waitFor(() => http.expectOne({ method: 'POST', url: '/api/session' }))).flush(
      { code: 'CSRF_INVALID', errors: [{ path: '', message: 'Bad token.' }] },
      { status: 403, statusText: 'Forbidden' },
    );
    (await vi.waitFor(() => http.expectOne('/api/session/csrf'))).flush({ csrfToken: 'good' });
    const retry = await vi.waitFor(() => http.expectOne({ method: 'POST', url: '/api/session' }));
    expect(retry.request.headers.get('x-csrf-token')).toBe('good');
    retry.flush({ user: aUser(), csrfToken: 'after' });

    await signingIn;
    expect(session.csrfToken()).toBe('after');
  });

  it('signIn() rejects with the server error and stays anonymous on wrong credentials', async () => {
    const signingIn = session.signIn('rlindqvist', 'wrong');
    (await vi.waitFor(() => http.expectOne('/api/session/csrf'))).flush({ csrfToken: 'anon' });
    (await vi.waitFor(() => http.expectOne({ method: 'POST', url: '/api/session' }))).flush(
      { code: 'BAD_CREDENTIALS', errors: [{ path: '', message: 'Wrong username or password.' }] },
      { status: 401, statusText: 'Unauthorized' },
    );
    await expect(signingIn).rejects.toMatchObject({ status: 401, code: 'BAD_CREDENTIALS' });
    expect(session.isSignedIn()).toBe(false);
  });

  it('signOut() deletes the server session and forgets the user', async () => {
    const loading = session.load();
    http.expectOne('/api/session').flush({ user: aUser(), csrfToken: 'tok' });
    await loading;

    const signingOut = session.signOut();
    const req = http.expectOne({ method: 'DELETE', url: '/api/session' });
    expect(req.request.headers.get('x-csrf-token')).toBe('tok');
    req.flush(null, { status: 204, statusText: 'No Content' });
    await signingOut;

    expect(session.isSignedIn()).toBe(false);
    expect(session.csrfToken()).toBeNull();
  });

  it('changePassword() and setUnits() take the new session state from the answer', async () => {
    const loading = session.load();
    http.expectOne('/api/session').flush({ user: aUser({ mustChangePassword: true }), csrfToken: 'tok' });
    await loading;

    const changing = session.changePassword({ currentPassword: 'temporary-123', newPassword: 'my own long one' });
    const pw = http.expectOne({ method: 'POST', url: '/api/session/password' });
    expect(pw.request.body).toEqual({ currentPassword: 'temporary-123', newPassword: 'my own long one' });
    pw.flush({ user: aUser({ mustChangePassword: false }), csrfToken: 'tok2' });
    await changing;
    expect(session.mustChangePassword()).toBe(false);
    expect(session.csrfToken()).toBe('tok2');

    const setting = session.setUnits('metric+imperial');
    const prefs = http.expectOne({ method: 'PATCH', url: '/api/session/preferences' });
    expect(prefs.request.body).toEqual({ units: 'metric+imperial' });
    prefs.flush({ user: aUser({ units: 'metric+imperial' }), csrfToken: 'tok2' });
    await setting;
    expect(session.user()?.units).toBe('metric+imperial');
  });
});
