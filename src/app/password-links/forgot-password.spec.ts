import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { csrfInterceptor } from '../core/http/csrf-interceptor';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { ForgotPassword } from './forgot-password';

describe('ForgotPassword', () => {
  let fixture: ComponentFixture<ForgotPassword>;
  let backend: HttpTestingController;
  let root: HTMLElement;
  let notifier: { show: ReturnType<typeof vi.fn> };

  beforeEach(async () => {
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      imports: [ForgotPassword],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([csrfInterceptor, errorInterceptor])),
        provideHttpClientTesting(),
        { provide: Notifier, useValue: notifier },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ForgotPassword);
    root = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  function type(value: string): void {
    const input = root.querySelector<HTMLInputElement>('input[formcontrolname="email"]')!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  function submit(): void {
    root.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
  }

  async function text(testId: string): Promise<string> {
    await fixture.whenStable();
    return root.querySelector(`[data-testid="${testId}"]`)?.textContent?.trim() ?? '';
  }

  /** Submits, answers the anonymous-token request, and returns the forgot POST. */
  async function submitAndCatchPost() {
    submit();
    (await vi.waitFor(() => backend.expectOne('/api/session/csrf'))).flush({ csrfToken: 'anon' });
    return vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/password/forgot' }));
  }

  const SAME_ANSWER = 'If this address belongs to an active account, we have sent a link to it.';

  it("posts the address with the anonymous token and shows the server's message with a way back", async () => {
    type(' naoko@lab.example ');
    const post = await submitAndCatchPost();
    expect(post.request.body).toEqual({ email: 'naoko@lab.example' });
    expect(post.request.headers.get('x-csrf-token')).toBe('anon');
    post.flush({ message: SAME_ANSWER }, { status: 202, statusText: 'Accepted' });

    await vi.waitFor(async () => expect(await text('sent-message')).toBe(SAME_ANSWER));
    expect(root.querySelector('form')).toBeNull();
    expect(root.querySelector('a[href="/sign-in"]')?.textContent).toContain('Back to sign in');
  });

  it('shows the same message for an unknown address (the server answers alike)', async () => {
    type('nobody@elsewhere.example');
    (await submitAndCatchPost()).flush({ message: SAME_ANSWER }, { status: 202, statusText: 'Accepted' });
    await vi.waitFor(async () => expect(await text('sent-message')).toBe(SAME_ANSWER));
  });

  it('checks the address before sending', async () => {
    submit();
    expect(await text('email-error')).toBe('E-mail is required.');
    type('not-an-address');
    submit();
    expect(await text('email-error')).toBe('Enter a valid e-mail address.');
    backend.expectNone('/api/password/forgot');
  });

  it('puts a 400 field error on the field and a 429 in the form, without a snack bar', async () => {
    type('naoko@lab.example');
    (await submitAndCatchPost()).flush(
      { code: 'VALIDATION_FAILED', errors: [{ path: 'email', message: 'E-mail must be at most 200 characters.' }] },
      { status: 400, statusText: 'Bad Request' },
    );
    await vi.waitFor(async () => expect(await text('email-error')).toBe('E-mail must be at most 200 characters.'));

    type('naoko@lab.example');
    submit();
    (await vi.waitFor(() => backend.expectOne('/api/password/forgot'))).flush(
      { code: 'TOO_MANY_ATTEMPTS', errors: [{ path: '', message: 'Too many requests. Try again later.' }] },
      { status: 429, statusText: 'Too Many Requests' },
    );
    await vi.waitFor(async () => expect(await text('form-error')).toBe('Too many requests. Try again later.'));
    expect(notifier.show).not.toHaveBeenCalled();
  });
});
