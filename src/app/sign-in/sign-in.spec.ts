import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { aUser } from '../../testing/user-fixture';
import { csrfInterceptor } from '../core/http/csrf-interceptor';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Session } from '../core/session/session';
import { SignIn } from './sign-in';

describe('SignIn', () => {
  let fixture: ComponentFixture<SignIn>;
  let backend: HttpTestingController;
  let router: Router;
  let root: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [SignIn],
      providers: [provideRouter([]), provideHttpClient(withInterceptors([csrfInterceptor, errorInterceptor])), provideHttpClientTesting()],
    });
    backend = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    fixture = TestBed.createComponent(SignIn);
    root = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  function type(name: string, value: string): void {
    const input = root.querySelector<HTMLInputElement>(`input[formcontrolname="${name}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  }

  function submit(): void {
    root.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
  }

  /** Submits, answers the anonymous-token request, and returns the sign-in POST. */
  async function submitAndCatchPost() {
    submit();
    (await vi.waitFor(() => backend.expectOne('/api/session/csrf'))).flush({ csrfToken: 'anon' });
    return vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/session' }));
  }

  async function formError(): Promise<string> {
    await fixture.whenStable();
    return root.querySelector('[data-testid="form-error"]')?.textContent?.trim() ?? '';
  }

  it('shows required-field messages and sends nothing when empty', async () => {
    submit();
    await fixture.whenStable();
    const errors = Array.from(root.querySelectorAll('mat-error')).map((e) => e.textContent?.trim());
    expect(errors).toEqual(['Username is required.', 'Password is required.']);
    backend.expectNone('/api/session');
  });

  it('posts the username and password and goes to the returnUrl', async () => {
    fixture.componentRef.setInput('returnUrl', '/people?status=all');
    const navigate = vi.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    type('username', 'rlindqvist');
    type('password', 'correct horse battery');
    const post = await submitAndCatchPost();
    expect(post.request.body).toEqual({ username: 'rlindqvist', password: 'correct horse battery' });
    expect(post.request.headers.get('x-csrf-token')).toBe('anon');
    post.flush({ user: aUser(), csrfToken: 'fresh' });

    await vi.waitFor(() => expect(navigate).toHaveBeenCalledWith('/people?status=all'));
  });

  it('sends someone already signed in straight on to the returnUrl', async () => {
    const loading = TestBed.inject(Session).load();
    backend.expectOne('/api/session').flush({ user: aUser(), csrfToken: 'tok' });
    await loading;
    const navigate = vi.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    const again = TestBed.createComponent(SignIn);
    again.componentRef.setInput('returnUrl', '/account');
    await again.whenStable();
    expect(navigate).toHaveBeenCalledWith('/account');
  });

  it('ignores a returnUrl that leaves the app', async () => {
    fixture.componentRef.setInput('returnUrl', '//elsewhere.example/phish');
    const navigate = vi.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    type('username', 'rlindqvist');
    type('password', 'pw');
    (await submitAndCatchPost()).flush({ user: aUser(), csrfToken: 'fresh' });
    await vi.waitFor(() => expect(navigate).toHaveBeenCalledWith('/today'));
  });

  it('sends an operator to the Finder when no page was asked for', async () => {
    const navigate = vi.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    type('username', 'kmensah');
    type('password', 'pw');
    (await submitAndCatchPost()).flush({ user: aUser({ roles: ['operator'] }), csrfToken: 'fresh' });
    await vi.waitFor(() => expect(navigate).toHaveBeenCalledWith('/finder'));
  });

  it('sends a user with a temporary password to the account page', async () => {
    const navigate = vi.spyOn(router, 'navigate').mockResolvedValue(true);
    type('username', 'rlindqvist');
    type('password', 'temporary-pass');
    (await submitAndCatchPost()).flush({ user: aUser({ mustChangePassword: true }), csrfToken: 'fresh' });
    await vi.waitFor(() => expect(navigate).toHaveBeenCalledWith(['/account'], { queryParams: { returnUrl: '/today' } }));
  });

  it("shows the server's wrong-credentials message in the form", async () => {
    type('username', 'rlindqvist');
    type('password', 'wrong');
    (await submitAndCatchPost()).flush(
      { code: 'BAD_CREDENTIALS', errors: [{ path: '', message: 'Unknown username or wrong password.' }] },
      { status: 401, statusText: 'Unauthorized' },
    );
    await vi.waitFor(async () => expect(await formError()).toBe('Unknown username or wrong password.'));
  });

  it("shows the server's too-many-attempts message in the form", async () => {
    type('username', 'rlindqvist');
    type('password', 'guess');
    (await submitAndCatchPost()).flush(
      { code: 'TOO_MANY_ATTEMPTS', errors: [{ path: '', message: 'Too many attempts. Try again in 15 minutes.' }] },
      { status: 429, statusText: 'Too Many Requests' },
    );
    await vi.waitFor(async () => expect(await formError()).toBe('Too many attempts. Try again in 15 minutes.'));
  });

  it('shows the deactivated-account message', async () => {
    type('username', 'old.hand');
    type('password', 'whatever');
    (await submitAndCatchPost()).flush(
      { code: 'FORBIDDEN', errors: [{ path: '', message: 'This account is deactivated.' }] },
      { status: 403, statusText: 'Forbidden' },
    );
    await vi.waitFor(async () => expect(await formError()).toBe('This account is deactivated.'));
  });

  it('puts 400 field errors beside their fields', async () => {
    type('username', 'rlindqvist');
    type('password', 'x');
    (await submitAndCatchPost()).flush(
      { code: 'VALIDATION_FAILED', errors: [{ path: 'password', message: 'Password is too long.' }] },
      { status: 400, statusText: 'Bad Request' },
    );
    await vi.waitFor(async () => {
      await fixture.whenStable();
      expect(root.querySelector('mat-error')?.textContent).toContain('Password is too long.');
    });
  });

  it('links to the forgot-password page', () => {
    expect(root.querySelector('a[href="/forgot-password"]')?.textContent).toContain('Forgot password?');
  });

  it('fills in the username and says the password is set after a mail link', async () => {
    const again = TestBed.createComponent(SignIn);
    again.componentRef.setInput('username', 'ntakeda');
    again.componentRef.setInput('passwordSet', 'yes');
    await again.whenStable();
    const page: HTMLElement = again.nativeElement;
    expect(page.querySelector<HTMLInputElement>('input[formcontrolname="username"]')!.value).toBe('ntakeda');
    expect(page.querySelector('[data-testid="password-set"]')?.textContent).toContain('Your password is set.');
    expect(root.querySelector('[data-testid="password-set"]')).toBeNull();
  });
});
