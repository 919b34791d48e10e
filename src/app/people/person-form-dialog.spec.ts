import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import type { UserDto } from '@shared/api-types';
import { aMachine } from '../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../testing/user-fixture';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { PersonFormDialog, type PersonFormDialogData } from './person-form-dialog';

describe('PersonFormDialog', () => {
  let fixture: ComponentFixture<PersonFormDialog>;
  let backend: HttpTestingController;
  let root: HTMLElement;
  let dialogRef: { close: ReturnType<typeof vi.fn> };
  let notifier: { show: ReturnType<typeof vi.fn> };

  async function open(data: PersonFormDialogData, signedIn: UserDto | null = null): Promise<void> {
    dialogRef = { close: vi.fn() };
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      imports: [PersonFormDialog],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: MatDialogRef, useValue: dialogRef },
        { provide: MAT_DIALOG_DATA, useValue: data },
        { provide: Notifier, useValue: notifier },
        { provide: Session, useValue: { clear: vi.fn(), user: signal(signedIn) } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(PersonFormDialog);
    root = fixture.nativeElement;
    await fixture.whenStable();
  }

  afterEach(() => backend.verify());

  function input(name: string): HTMLInputElement {
    return root.querySelector<HTMLInputElement>(`input[formcontrolname="${name}"]`)!;
  }

  function type(name: string, value: string): void {
    input(name).value = value;
    input(name).dispatchEvent(new Event('input'));
  }

  /** Ticks a role's checkbox, found by its visible label (e.g. "Author"). */
  async function tick(label: string): Promise<void> {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatCheckboxHarness.with({ label: new RegExp(`^${label}`) }))).check();
  }

  function submit(): void {
    root.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
  }

  async function text(testId: string): Promise<string> {
    await fixture.whenStable();
    return root.querySelector(`[data-testid="${testId}"]`)?.textContent?.trim() ?? '';
  }

  async function fillNewPerson(): Promise<void> {
    type('username', 'NTakeda');
    type('displayName', 'Naoko Takeda');
    type('email', 'naoko@lab.example');
    await tick('Author');
    await tick('Operator');
    type('temporaryPassword', 'first-day-2026');
  }

  it('creates a person with the roles ticked', async () => {
    await open({});
    await fillNewPerson();
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/users' }));
    expect(req.request.body).toEqual({
      username: 'NTakeda',
      displayName: 'Naoko Takeda',
      email: 'naoko@lab.example',
      roles: ['author', 'operator'],
      temporaryPassword: 'first-day-2026',
      machineIds: [],
    });
    const saved: UserDto = aUser({ id: 12, username: 'ntakeda', roles: ['author', 'operator'] });
    req.flush(saved, { status: 201, statusText: 'Created' });
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalledWith(saved));
  });

  it("checks fields with the shared schemas' words before sending", async () => {
    await open({});
    await fillNewPerson();
    type('username', 'no spaces please');
    type('temporaryPassword', 'short');
    submit();
    expect(await text('username-error')).toBe('Username may only use the letters a–z, digits, dot, dash and underscore.');
    expect(await text('temporaryPassword-error')).toBe('Password must be at least 10 characters.');
    backend.expectNone('/api/users');
  });

  it('maps 400 field errors to their controls, without a snack bar', async () => {
    await open({});
    await fillNewPerson();
    submit();
    (await vi.waitFor(() => backend.expectOne('/api/users'))).flush(
      {
        code: 'VALIDATION_FAILED',
        errors: [
          { path: 'email', message: 'That mail domain is not accepted here.' },
          { path: 'roles.1', message: 'Role must be one of: author, approver.' },
          { path: '', message: 'Check the marked fields.' },
        ],
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await vi.waitFor(async () => expect(await text('email-error')).toBe('That mail domain is not accepted here.'));
    expect(await text('roles-error')).toBe('Role must be one of: author, approver.');
    expect(await text('form-error')).toBe('Check the marked fields.');
    expect(notifier.show).not.toHaveBeenCalled();
    expect(dialogRef.close).not.toHaveBeenCalled();
  });

  it('shows a 409 duplicate username on the username field', async () => {
    await open({});
    await fillNewPerson();
    submit();
    (await vi.waitFor(() => backend.expectOne('/api/users'))).flush(
      { code: 'CONFLICT', errors: [{ path: '', message: 'The username ntakeda is already taken.' }] },
      { status: 409, statusText: 'Conflict' },
    );
    await vi.waitFor(async () => expect(await text('username-error')).toBe('The username ntakeda is already taken.'));
    expect(notifier.show).not.toHaveBeenCalled();
  });

  it('edits name, e-mail and roles only', async () => {
    const person = aUser({ id: 5, username: 'pmeier', displayName: 'Paul Meier', email: '', roles: ['operator'] });
    await open({ person });
    expect(input('username').disabled).toBe(true);
    expect(input('username').value).toBe('pmeier');
    expect(input('temporaryPassword')).toBeNull();

    type('displayName', 'Paul A. Meier');
    await tick('Auditor');
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'PATCH', url: '/api/users/5' }));
    expect(req.request.body).toEqual({ displayName: 'Paul A. Meier', email: '', roles: ['operator', 'auditor'], machineIds: [] });
    req.flush({ ...person, displayName: 'Paul A. Meier', roles: ['operator', 'auditor'] });
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalled());
  });

  it('lets an admin editing themselves drop roles but not give themselves new ones, and says why', async () => {
    const me = aUser({ id: 9, username: 'aadmin', displayName: 'Ada Admin', email: '', roles: ['admin', 'auditor'] });
    await open({ person: me }, me);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const box = async (label: string) => loader.getHarness(MatCheckboxHarness.with({ label: new RegExp(`^${label}`) }));
    expect(await (await box('Approver')).isDisabled()).toBe(true);
    expect(await (await box('Author')).isDisabled()).toBe(true);
    expect(await (await box('Auditor')).isDisabled()).toBe(false);
    expect(await text('self-roles-hint')).toMatch(/another admin/i);
    await (await box('Auditor')).uncheck();
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'PATCH', url: '/api/users/9' }));
    expect(req.request.body.roles).toEqual(['admin']);
    req.flush({ ...me, roles: ['admin'] });
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalled());
  });

  it('leaves every role open when an admin edits someone else', async () => {
    const me = aUser({ id: 9, roles: ['admin'] });
    await open({ person: aUser({ id: 5, roles: ['operator'] }) }, me);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    expect(await (await loader.getHarness(MatCheckboxHarness.with({ label: /^Approver/ }))).isDisabled()).toBe(false);
    expect(root.querySelector('[data-testid="self-roles-hint"]')).toBeNull();
  });

  const machines = [aMachine({ id: 1, name: 'Bench saw B2' }), aMachine({ id: 3, name: 'Floor saw F1' }), aMachine({ id: 4, name: 'Old saw', archived: true })];

  async function machineSelect(): Promise<MatSelectHarness> {
    return TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness);
  }

  it('invites by e-mail: no temporary password, e-mail required, posts inviteBody with the machines', async () => {
    await open({ invite: true, machines });
    expect(root.textContent).toContain('Invite by e-mail');
    expect(input('temporaryPassword')).toBeNull();
    type('username', 'NTakeda');
    type('displayName', 'Naoko Takeda');
    await tick('Operator');
    submit();
    expect(await text('email-error')).toBe('E-mail is required.');
    backend.expectNone('/api/users/invitations');

    type('email', 'naoko@lab.example');
    const select = await machineSelect();
    await select.open();
    const offered = await Promise.all((await select.getOptions()).map((o) => o.getText()));
    expect(offered).toEqual(['Bench saw B2', 'Floor saw F1']);
    await select.clickOptions({ text: 'Floor saw F1' });
    await select.close();
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/users/invitations' }));
    expect(req.request.body).toEqual({
      username: 'NTakeda',
      displayName: 'Naoko Takeda',
      email: 'naoko@lab.example',
      roles: ['operator'],
      machineIds: [3],
    });
    const saved = aUser({ id: 13, username: 'ntakeda', invitationPending: true, roles: ['operator'], machineIds: [3] });
    req.flush(saved, { status: 201, statusText: 'Created' });
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalledWith(saved));
  });

  it("puts the invitation's 400 field errors on their fields", async () => {
    await open({ invite: true, machines });
    type('username', 'ntakeda');
    type('displayName', 'Naoko Takeda');
    type('email', 'naoko@lab.example');
    await tick('Operator');
    submit();
    (await vi.waitFor(() => backend.expectOne('/api/users/invitations'))).flush(
      {
        code: 'VALIDATION_FAILED',
        errors: [
          { path: 'email', message: 'Another person already uses this e-mail address.' },
          { path: 'machineIds.0', message: 'Machine 99 does not exist.' },
        ],
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await vi.waitFor(async () => expect(await text('email-error')).toBe('Another person already uses this e-mail address.'));
    expect(await text('machineIds-error')).toBe('Machine 99 does not exist.');
    expect(notifier.show).not.toHaveBeenCalled();
    expect(dialogRef.close).not.toHaveBeenCalled();
  });

  it("edits an operator's machines, keeping an archived one still assigned", async () => {
    const person = aUser({ id: 5, displayName: 'Paul Meier', roles: ['operator'], machineIds: [4] });
    await open({ person, machines });
    const select = await machineSelect();
    await select.open();
    const offered = await Promise.all((await select.getOptions()).map((o) => o.getText()));
    expect(offered).toEqual(['Bench saw B2', 'Floor saw F1', 'Old saw (archived)']);
    await select.clickOptions({ text: 'Bench saw B2' });
    await select.close();
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'PATCH', url: '/api/users/5' }));
    expect(req.request.body.machineIds).toEqual([1, 4]);
    req.flush({ ...person, machineIds: [1, 4] });
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalled());
  });

  it('shows the machines only while the operator role is ticked', async () => {
    await open({ machines });
    expect(root.querySelector('[data-testid="machines"]')).toBeNull();
    await tick('Operator');
    await fixture.whenStable();
    expect(root.querySelector('[data-testid="machines"]')).not.toBeNull();
  });
});
