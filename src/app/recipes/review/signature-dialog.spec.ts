import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { aRecipeVersion } from '../../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../../testing/user-fixture';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { SignatureDialog, type SignatureDialogData } from './signature-dialog';
import { utcToday } from '../../core/dates/calendar';

describe('SignatureDialog', () => {
  let fixture: ComponentFixture<SignatureDialog>;
  let backend: HttpTestingController;
  let root: HTMLElement;
  let dialogRef: { close: ReturnType<typeof vi.fn> };
  let notifier: { show: ReturnType<typeof vi.fn> };
  let session: { noteFullSigning: ReturnType<typeof vi.fn>; noteUsernameNeeded: ReturnType<typeof vi.fn> };

  const version = aRecipeVersion({ version: 2, status: 'in-review', revision: 9, contentHash: 'e3b0c442'.repeat(8) });

  /** `firstInSession`: no signing with username and password yet in this session. */
  async function open(data: SignatureDialogData, firstInSession = false): Promise<void> {
    dialogRef = { close: vi.fn() };
    notifier = { show: vi.fn() };
    session = { noteFullSigning: vi.fn(), noteUsernameNeeded: vi.fn() };
    TestBed.configureTestingModule({
      imports: [SignatureDialog],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: MatDialogRef, useValue: dialogRef },
        { provide: MAT_DIALOG_DATA, useValue: data },
        { provide: Notifier, useValue: notifier },
        {
          provide: Session,
          useValue: {
            user: signal(aUser({ id: 9, displayName: 'Tomas Berg', roles: ['approver'] })),
            signatureNeedsUsername: signal(firstInSession),
            clear: vi.fn(),
            ...session,
          },
        },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SignatureDialog);
    root = fixture.nativeElement;
    await fixture.whenStable();
  }

  afterEach(() => backend.verify());

  function field(name: string): HTMLInputElement | HTMLTextAreaElement {
    return root.querySelector<HTMLInputElement | HTMLTextAreaElement>(`[formcontrolname="${name}"]`)!;
  }

  function type(name: string, value: string): void {
    field(name).value = value;
    field(name).dispatchEvent(new Event('input'));
  }

  async function text(testId: string): Promise<string> {
    // The answer is handled after a promise settles: let it, then render.
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
    return root.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  async function sign(): Promise<void> {
    root.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  }

  it('shows what is signed, by whom, what it means and that it binds like a handwritten signature', async () => {
    await open({ meaning: 'approved', version, acknowledgedWarnings: [] });
    expect(await text('sign-recipe')).toBe('KB-0003 · version 2');
    expect(await text('sign-hash')).toBe(version.contentHash);
    expect(await text('sign-name')).toBe('Tomas Berg');
    expect(await text('sign-meaning')).toBe('Approved — I have reviewed this version and approve it for use');
    expect(await text('sign-statement')).toContain('legally binding equivalent of your handwritten signature');
    expect(root.textContent).toContain('Tempered bar, transverse');
    // Effective today by default, and never earlier.
    expect(field('effectiveDate').value).toBe(utcToday());
    expect(field('effectiveDate').getAttribute('min')).toBe(utcToday());
  });

  it('sends the meaning, effective date, comment and acknowledged warnings with the password and revision', async () => {
    await open({ meaning: 'approved', version, acknowledgedWarnings: ['feed-heat-sensitive', 'coolant-concentration'] });
    type('password', 'demo-approver-2026');
    type('comment', 'Checked against the last three cuts.');
    type('effectiveDate', '2099-01-15');
    await sign();

    const req = backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' });
    expect(req.request.body).toEqual({
      revision: 9,
      password: 'demo-approver-2026',
      meaning: 'approved',
      comment: 'Checked against the last three cuts.',
      acknowledgedWarnings: ['feed-heat-sensitive', 'coolant-concentration'],
      effectiveDate: '2099-01-15',
    });
    const approved = { ...version, status: 'approved' as const, revision: 10 };
    req.flush(approved);
    await fixture.whenStable();
    expect(dialogRef.close).toHaveBeenCalledWith(approved);
  });

  it('shows a wrong password on the password field and stays open with everything else as typed', async () => {
    await open({ meaning: 'approved', version, acknowledgedWarnings: [] });
    type('password', 'not-my-password');
    type('comment', 'Looks right.');
    await sign();

    backend
      .expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' })
      .flush(
        { code: 'VALIDATION_FAILED', errors: [{ path: 'password', message: 'The password is not correct.' }] },
        { status: 400, statusText: 'Bad Request' },
      );
    expect(await text('password-error')).toBe('The password is not correct.');
    expect(await text('form-error')).toBe('');
    expect(dialogRef.close).not.toHaveBeenCalled();
    expect(notifier.show).not.toHaveBeenCalled();
    expect(field('comment').value).toBe('Looks right.');
    expect(field('effectiveDate').value).toBe(utcToday());
  });

  it('does not pin a wrong-password answer on a password retyped while the answer was on its way', async () => {
    await open({ meaning: 'approved', version, acknowledgedWarnings: [] });
    const approved = { ...version, status: 'approved' as const, revision: 10 };
    type('password', 'not-my-password');
    await sign();
    const first = backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' });
    type('password', 'demo-approver-2026');
    first.flush(
      { code: 'VALIDATION_FAILED', errors: [{ path: 'password', message: 'The password is not correct.' }] },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(await text('password-error')).not.toBe('The password is not correct.');

    await sign();
    const second = backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' });
    expect((second.request.body as { password: string }).password).toBe('demo-approver-2026');
    second.flush(approved);
    await fixture.whenStable();
    expect(dialogRef.close).toHaveBeenCalledWith(approved);
  });

  it('refuses to send without a password, or with an effective date in the past', async () => {
    await open({ meaning: 'approved', version, acknowledgedWarnings: [] });
    type('effectiveDate', '2001-01-01');
    await sign();
    backend.expectNone({ method: 'POST', url: '/api/recipes/3/versions/2/approve' });
    expect(await text('password-error')).toBe('Password is required.');
    expect(await text('effectiveDate-error')).toBe('The effective date cannot be in the past.');
  });

  it('says plainly when the signer authored or edited the version', async () => {
    await open({ meaning: 'approved', version, acknowledgedWarnings: [] });
    type('password', 'demo-approver-2026');
    await sign();
    backend
      .expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' })
      .flush({ code: 'OWN_VERSION', errors: [{ path: '', message: 'Not yours to approve.' }] }, { status: 403, statusText: 'Forbidden' });
    expect(await text('form-error')).toBe('You authored or edited this version, so someone else must approve it.');
    expect(dialogRef.close).not.toHaveBeenCalled();
    expect(notifier.show).not.toHaveBeenCalled();
  });

  it('on a changed version says so and offers a reload instead of signing', async () => {
    await open({ meaning: 'approved', version, acknowledgedWarnings: [] });
    type('password', 'demo-approver-2026');
    await sign();
    backend
      .expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' })
      .flush({ code: 'CONFLICT', errors: [{ path: 'revision', message: 'Stale.' }] }, { status: 409, statusText: 'Conflict' });
    expect(await text('form-error')).toContain('This version changed since you opened it; reload to see the current content.');
    expect(root.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(true);
    const reload = Array.from(root.querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Reload'))!;
    reload.click();
    expect(dialogRef.close).toHaveBeenCalledWith('reload');
  });

  it('withdraws with a required reason and the meaning "withdrawn"', async () => {
    const current = aRecipeVersion({ version: 1, status: 'approved', revision: 12 });
    await open({ meaning: 'withdrawn', version: current });
    expect(await text('sign-meaning')).toBe('Withdrawn — this version must no longer be used');
    expect(field('effectiveDate')).toBeNull();
    type('password', 'demo-approver-2026');
    await sign();
    backend.expectNone({ method: 'POST', url: '/api/recipes/3/versions/1/withdraw' });
    expect(await text('comment-error')).toBe('Reason is required.');

    type('comment', 'Wheel type discontinued by the supplier.');
    await sign();
    const req = backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/1/withdraw' });
    expect(req.request.body).toEqual({
      revision: 12,
      password: 'demo-approver-2026',
      meaning: 'withdrawn',
      reason: 'Wheel type discontinued by the supplier.',
    });
    req.flush({ ...current, status: 'withdrawn' });
    await fixture.whenStable();
    expect(dialogRef.close).toHaveBeenCalled();
  });

  describe('signature components in a session (21 CFR 11.200(a)(1))', () => {
    it('asks for the username and the password at the first signing in a session, and sends both', async () => {
      await open({ meaning: 'approved', version, acknowledgedWarnings: [] }, true);
      expect(field('username')).not.toBeNull();
      expect(await text('sign-statement')).toContain('with your username and password is your electronic signature');
      type('password', 'demo-approver-2026');
      await sign();
      backend.expectNone({ method: 'POST', url: '/api/recipes/3/versions/2/approve' });
      expect(await text('username-error')).toBe('This field is required.');

      type('username', 'tberg');
      await sign();
      const req = backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' });
      expect(req.request.body).toMatchObject({ username: 'tberg', password: 'demo-approver-2026', meaning: 'approved' });
      const approved = { ...version, status: 'approved' as const, revision: 10 };
      req.flush(approved);
      await fixture.whenStable();
      expect(session.noteFullSigning).toHaveBeenCalled();
      expect(dialogRef.close).toHaveBeenCalledWith(approved);
    });

    it('asks for the password only at a later signing in the same session', async () => {
      await open({ meaning: 'withdrawn', version: aRecipeVersion({ version: 1, status: 'approved', revision: 12 }) }, false);
      expect(field('username')).toBeNull();
      expect(await text('sign-statement')).toContain('with your password is your electronic signature');
    });

    it('shows a wrong username on the username field and keeps the dialog open', async () => {
      await open({ meaning: 'approved', version, acknowledgedWarnings: [] }, true);
      type('username', 'someone');
      type('password', 'demo-approver-2026');
      await sign();
      backend
        .expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' })
        .flush(
          { code: 'VALIDATION_FAILED', errors: [{ path: 'username', message: 'This is not the username you are signed in with.' }] },
          { status: 400, statusText: 'Bad Request' },
        );
      expect(await text('username-error')).toBe('This is not the username you are signed in with.');
      expect(dialogRef.close).not.toHaveBeenCalled();
      expect(session.noteFullSigning).not.toHaveBeenCalled();
    });

    it('shows the username field when the server says this session still needs it', async () => {
      await open({ meaning: 'approved', version, acknowledgedWarnings: [] }, false);
      type('password', 'demo-approver-2026');
      await sign();
      backend
        .expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/approve' })
        .flush(
          { code: 'VALIDATION_FAILED', errors: [{ path: 'username', message: 'Type your username as well as your password.' }] },
          { status: 400, statusText: 'Bad Request' },
        );
      await text('form-error');
      expect(field('username')).not.toBeNull();
      expect(session.noteUsernameNeeded).toHaveBeenCalled();
    });
  });
});
