import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { LinkInfoDto } from '@shared/api-types';
import { csrfInterceptor } from '../core/http/csrf-interceptor';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { SetPassword } from './set-password';
import { provideLabDateFormat } from '../../testing/lab-date-format';

/** 43 base64url characters, the shape of a real link token. */
const TOKEN = 'abcdefghijklmnopqrstuvwxyzABCDEFGHIJ0123456';

describe('SetPassword', () => {
  let fixture: ComponentFixture<SetPassword>;
  let backend: HttpTestingController;
  let router: Router;
  let root: HTMLElement;
  let notifier: { show: ReturnType<typeof vi.fn> };

  const invitation: LinkInfoDto = {
    purpose: 'invitation',
    username: 'ntakeda',
    displayName: 'Naoko Takeda',
    expiresAt: '2026-12-05T09:30:00.000Z',
  };

  async function open(token: string | undefined): Promise<void> {
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      imports: [SetPassword],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([csrfInterceptor, errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        { provide: Notifier, useValue: notifier },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    fixture = TestBed.createComponent(SetPassword);
    if (token !== undefined) fixture.componentRef.setInput('token', token);
    root = fixture.nativeElement;
    await fixture.whenStable();
  }

  /** Answers the anonymous-token request and returns the link inspection POST. */
  async function linkRequest() {
    (await vi.waitFor(() => backend.expectOne('/api/session/csrf'))).flush({ csrfToken: 'anon' });
    return vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/password/link' }));
  }

  async function text(testId: string): Promise<string> {
    await fixture.whenStable();
    return root.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  function type(name: string, value: string): void {
    const input = root.querySelector<HTMLInputElement>(`input[formcontrolname="${name}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  function submit(): void {
    root.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
  }

  afterEach(() => backend.verify());

  it('greets an invited person by name and shows until when the link works', async () => {
    await open(TOKEN);
    const req = await linkRequest();
    expect(req.request.body).toEqual({ token: TOKEN });
    req.flush(invitation);
    await vi.waitFor(async () => expect(await text('greeting')).toBe('Welcome, Naoko Takeda'));
    expect(root.querySelector('[data-testid="expiry"]')?.getAttribute('datetime')).toBe(invitation.expiresAt);
    expect(await text('expiry')).toContain('2026');
  });

  it('names the account for a reset link', async () => {
    await open(TOKEN);
    (await linkRequest()).flush({ ...invitation, purpose: 'password-reset' });
    await vi.waitFor(async () => expect(await text('greeting')).toBe('Set a new password for ntakeda'));
  });

  it('posts the new password and goes to sign-in with the username filled in', async () => {
    await open(TOKEN);
    (await linkRequest()).flush(invitation);
    await vi.waitFor(async () => expect(await text('greeting')).toContain('Welcome'));
    const navigate = vi.spyOn(router, 'navigate').mockResolvedValue(true);

    type('newPassword', 'bench saw at dawn');
    type('repeatPassword', 'bench saw at dawn');
    submit();
    const post = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/password/set' }));
    expect(post.request.body).toEqual({ token: TOKEN, newPassword: 'bench saw at dawn' });
    expect(post.request.headers.get('x-csrf-token')).toBe('anon');
    post.flush({ message: 'Your password is set.' });
    await vi.waitFor(() => expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { username: 'ntakeda', passwordSet: 'yes' } }));
  });

  it('checks length and that both passwords match before sending', async () => {
    await open(TOKEN);
    (await linkRequest()).flush(invitation);
    await vi.waitFor(async () => expect(await text('greeting')).toContain('Welcome'));
    type('newPassword', 'short');
    type('repeatPassword', 'shorter');
    submit();
    expect(await text('newPassword-error')).toBe('Password must be at least 10 characters.');
    expect(await text('repeatPassword-error')).toBe('The two passwords are not the same.');
    backend.expectNone('/api/password/set');
  });

  const refusals = [
    { code: 'LINK_INVALID', status: 400, title: 'This link does not work' },
    { code: 'LINK_USED', status: 410, title: 'This link has already been used' },
    { code: 'LINK_EXPIRED', status: 410, title: 'This link has expired' },
  ];

  for (const { code, status, title } of refusals) {
    it(`explains ${code} when the link is inspected, and offers a new reset link`, async () => {
      await open(TOKEN);
      (await linkRequest()).flush({ code, errors: [{ path: '', message: 'Refused.' }] }, { status, statusText: 'x' });
      await vi.waitFor(async () => expect(await text('problem-title')).toBe(title));
      expect(await text('problem')).toContain('Ask them to send the invitation again');
      expect(root.querySelector('a[href="/forgot-password"]')).not.toBeNull();
      expect(root.querySelector('form')).toBeNull();
      expect(notifier.show).not.toHaveBeenCalled();
    });
  }

  it('explains a link that expired while the person was typing', async () => {
    await open(TOKEN);
    (await linkRequest()).flush(invitation);
    await vi.waitFor(async () => expect(await text('greeting')).toContain('Welcome'));
    type('newPassword', 'bench saw at dawn');
    type('repeatPassword', 'bench saw at dawn');
    submit();
    (await vi.waitFor(() => backend.expectOne('/api/password/set'))).flush(
      { code: 'LINK_EXPIRED', errors: [{ path: '', message: 'This link has expired.' }] },
      { status: 410, statusText: 'Gone' },
    );
    await vi.waitFor(async () => expect(await text('problem-title')).toBe('This link has expired'));
  });

  it('refuses a missing or mangled token without asking the server', async () => {
    await open('too-short');
    expect(await text('problem-title')).toBe('This link does not work');
    backend.expectNone('/api/password/link');
  });
});
