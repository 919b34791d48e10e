import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { Notifier } from '../notifier/notifier';
import { Session } from '../session/session';
import { ApiError, type ClientErrorCode } from './api-error';
import { callerHandles } from './caller-handles';
import { errorInterceptor } from './error-interceptor';

describe('errorInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let router: Router;
  let notifier: { show: ReturnType<typeof vi.fn> };
  let session: { clear: ReturnType<typeof vi.fn> };

  beforeEach(() => {
    notifier = { show: vi.fn() };
    session = { clear: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        { provide: Notifier, useValue: notifier },
        { provide: Session, useValue: session },
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
  });

  afterEach(() => backend.verify());

  async function fail(status: number, body: string | object, context = callerHandles()): Promise<ApiError> {
    const result = firstValueFrom(http.get('/api/users', { context }));
    backend.expectOne('/api/users').flush(body, { status, statusText: 'x' });
    try {
      await result;
    } catch (e) {
      return e as ApiError;
    }
    throw new Error('the request did not fail');
  }

  it('turns the error envelope into an ApiError', async () => {
    const error = await fail(403, { code: 'FORBIDDEN', errors: [{ path: '', message: 'Admins only.' }] });
    expect(error).toBeInstanceOf(ApiError);
    expect(error.status).toBe(403);
    expect(error.code).toBe<ClientErrorCode>('FORBIDDEN');
    expect(error.errors).toEqual([{ path: '', message: 'Admins only.' }]);
  });

  it('on 401 NOT_SIGNED_IN clears the session and goes to /sign-in with the way back', async () => {
    const navigate = vi.spyOn(router, 'navigate').mockResolvedValue(true);
    vi.spyOn(router, 'url', 'get').mockReturnValue('/people?status=inactive');
    await fail(401, { code: 'NOT_SIGNED_IN', errors: [{ path: '', message: 'Sign in first.' }] });

    expect(session.clear).toHaveBeenCalled();
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: '/people?status=inactive' } });
    expect(notifier.show).not.toHaveBeenCalled();
  });

  it('leaves a 401 alone when the caller handles it (the session load itself)', async () => {
    const navigate = vi.spyOn(router, 'navigate');
    const error = await fail(401, { code: 'NOT_SIGNED_IN', errors: [] }, callerHandles(401));
    expect(error.code).toBe<ClientErrorCode>('NOT_SIGNED_IN');
    expect(session.clear).not.toHaveBeenCalled();
    expect(navigate).not.toHaveBeenCalled();
  });

  it('sends a user who must change the password to the account page', async () => {
    const navigateByUrl = vi.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    await fail(403, { code: 'PASSWORD_CHANGE_REQUIRED', errors: [{ path: '', message: 'Change it first.' }] });
    expect(navigateByUrl).toHaveBeenCalledWith('/account');
  });

  it('shows other errors in a snack bar', async () => {
    await fail(409, { code: 'CONFLICT', errors: [{ path: 'username', message: 'Taken.' }] });
    expect(notifier.show).toHaveBeenCalledWith('username: Taken.');
  });

  it('shows no snack bar for statuses the caller shows in its form', async () => {
    const error = await fail(400, { code: 'VALIDATION_FAILED', errors: [{ path: 'email', message: 'Bad.' }] }, callerHandles(400));
    expect(error.errors[0].path).toBe('email');
    expect(notifier.show).not.toHaveBeenCalled();
  });

  it('describes an answer without an envelope', async () => {
    const error = await fail(502, '<html>gateway</html>');
    expect(error.code).toBe<ClientErrorCode>('HTTP_502');
    expect(notifier.show).toHaveBeenCalledWith(expect.stringContaining('502'));
  });
});
