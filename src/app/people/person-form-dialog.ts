import { ChangeDetectionStrategy, Component, type ElementRef, inject, signal, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import type { UserDto } from '@shared/api-types';
import { ROLES, ROLE_INFO, type Role } from '@shared/roles';
import { displayName, email, newPassword, username } from '@shared/schemas/fields';
import { requiredEmail } from '@shared/schemas/mail';
import type { MachineRecord } from '@shared/stock-types';
import { controlMessage } from '../core/forms/control-message';
import { applyServerErrors } from '../core/forms/server-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { isApiError } from '../core/http/api-error';
import { callerHandles } from '../core/http/caller-handles';
import { PeopleApi } from '../core/api/people-api';
import { suggestTemporaryPassword } from './temporary-password';
import { Session } from '../core/session/session';

export interface PersonFormDialogData {
  /** The person to edit; absent to add a new one. */
  person?: UserDto;
  /** Add the person by e-mail invitation (they set their own password) instead of a temporary password. */
  invite?: boolean;
  /** The lab's machines, archived ones included (an operator may still be assigned to one). */
  machines?: readonly MachineRecord[];
}

/** A machine an operator can be assigned to, as offered in the form. */
interface MachineOption {
  id: number;
  label: string;
}

/**
 * Add a person (with a temporary password, or by e-mail invitation) or edit one's name,
 * e-mail, roles and, for operators, machines. Closes with the saved UserDto.
 */
@Component({
  selector: 'kb-person-form-dialog',
  imports: [MatButtonModule, MatCheckboxModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './person-form-dialog.html',
  styleUrl: './person-form-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PersonFormDialog {
  private readonly api = inject(PeopleApi);
  private readonly dialogRef = inject<MatDialogRef<PersonFormDialog, UserDto>>(MatDialogRef);
  private readonly data = inject<PersonFormDialogData>(MAT_DIALOG_DATA);
  private readonly person = this.data.person;
  private readonly fb = inject(NonNullableFormBuilder);
  /** Editing one's own record: roles one does not hold stay closed (another admin grants them; the server refuses too). */
  protected readonly isSelf = this.person !== undefined && this.person.id === inject(Session).user()?.id;
  private readonly usernameInput = viewChild<ElementRef<HTMLInputElement>>('usernameInput');

  protected readonly isNew = !this.person;
  protected readonly isInvite = this.isNew && this.data.invite === true;
  protected readonly machineOptions = machineOptions(this.data.machines ?? [], this.person?.machineIds ?? []);
  protected readonly roleOptions = ROLES.map((role) => ({ role, ...ROLE_INFO[role] }));
  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');

  protected readonly form = this.fb.group({
    username: [this.person?.username ?? '', [Validators.required, zodValidator(username)]],
    displayName: [this.person?.displayName ?? '', [Validators.required, zodValidator(displayName)]],
    email: [this.person?.email ?? '', this.isInvite ? [Validators.required, zodValidator(requiredEmail)] : [zodValidator(email)]],
    roles: this.fb.group(Object.fromEntries(ROLES.map((role) => [role, this.person?.roles.includes(role) ?? false])) as Record<Role, boolean>),
    temporaryPassword: ['', [Validators.required, zodValidator(newPassword)]],
    machineIds: [this.person?.machineIds ?? ([] as number[])],
  });
  /** Machines matter for operators only: the field shows while the operator role is ticked. */
  protected readonly isOperator = toSignal(this.form.controls.roles.controls.operator.valueChanges, {
    initialValue: this.form.controls.roles.controls.operator.value,
  });

  constructor() {
    if (!this.isNew) {
      // Usernames never change (they appear in the trail); passwords have their own dialog.
      this.form.controls.username.disable();
      this.form.controls.temporaryPassword.disable();
    }
    // An invited person chooses their own password from the mail link.
    if (this.isInvite) this.form.controls.temporaryPassword.disable();
    if (this.isSelf) for (const role of ROLES) if (!this.person?.roles.includes(role)) this.form.controls.roles.controls[role].disable();
  }

  protected suggestPassword(): void {
    this.form.controls.temporaryPassword.setValue(suggestTemporaryPassword());
    this.form.controls.temporaryPassword.markAsTouched();
  }

  protected async save(): Promise<void> {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const roles = ROLES.filter((role) => value.roles[role]);
    // Only operators run machines; unticking the role clears the assignment.
    const machineIds = value.roles.operator ? value.machineIds : [];
    // 400 field errors and 409 (username taken) are shown in this form, not as a snack bar.
    const context = callerHandles(400, 409);
    const { displayName, email } = value;
    this.busy.set(true);
    try {
      const saved = this.person
        ? await firstValueFrom(this.api.update(this.person.id, { displayName, email, roles, machineIds }, context))
        : this.isInvite
          ? await firstValueFrom(this.api.invite({ username: value.username, displayName, email, roles, machineIds }, context))
          : await firstValueFrom(
              this.api.create({ username: value.username, displayName, email, roles, temporaryPassword: value.temporaryPassword, machineIds }, context),
            );
      this.dialogRef.close(saved);
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.status === 409 && this.isNew && e.errors.every((err) => !err.path)) {
        this.form.controls.username.setErrors({ server: e.generalMessage || 'This username is already taken.' });
        this.form.controls.username.markAsTouched();
      } else if (e.status === 400 || e.status === 409) {
        this.formError.set(applyServerErrors(this.form, e.errors).join(' '));
      }
      // The field at fault may have scrolled out of the dialog: bring the username to view if it is one.
      if (this.form.controls.username.errors?.['server']) this.usernameInput()?.nativeElement.focus();
    } finally {
      this.busy.set(false);
    }
  }
}

/** Machines in service, plus any retired one the person is still assigned to (so saving does not drop it silently). */
function machineOptions(machines: readonly MachineRecord[], assigned: readonly number[]): MachineOption[] {
  const options = machines
    .filter((m) => !m.archived || assigned.includes(m.id))
    .map((m) => ({ id: m.id, label: m.archived ? `${m.name} (archived)` : m.name }));
  for (const id of assigned) {
    if (!options.some((o) => o.id === id)) options.push({ id, label: `Machine ${id}` });
  }
  return options;
}
