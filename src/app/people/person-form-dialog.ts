import { ChangeDetectionStrategy, Component, type ElementRef, inject, signal, viewChild } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import type { UserDto } from '../../../shared/api-types';
import { ROLES, ROLE_INFO, type Role } from '../../../shared/roles';
import { displayName, email, newPassword, username } from '../../../shared/schemas/fields';
import { controlMessage } from '../core/forms/control-message';
import { applyServerErrors } from '../core/forms/server-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { isApiError } from '../core/http/api-error';
import { callerHandles } from '../core/http/caller-handles';
import { PeopleApi } from './people-api';
import { suggestTemporaryPassword } from './temporary-password';

export interface PersonFormDialogData {
  /** The person to edit; absent to add a new one. */
  person?: UserDto;
}

/** Add a person (with a temporary password) or edit one's name, e-mail and roles. Closes with the saved UserDto. */
@Component({
  selector: 'kb-person-form-dialog',
  imports: [
    MatButtonModule,
    MatCheckboxModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    ReactiveFormsModule,
  ],
  templateUrl: './person-form-dialog.html',
  styleUrl: './person-form-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PersonFormDialog {
  private readonly api = inject(PeopleApi);
  private readonly dialogRef = inject<MatDialogRef<PersonFormDialog, UserDto>>(MatDialogRef);
  private readonly person = inject<PersonFormDialogData>(MAT_DIALOG_DATA).person;
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly usernameInput = viewChild<ElementRef<HTMLInputElement>>('usernameInput');

  protected readonly isNew = !this.person;
  protected readonly roleOptions = ROLES.map((role) => ({ role, ...ROLE_INFO[role] }));
  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');

  protected readonly form = this.fb.group({
    username: [this.person?.username ?? '', [Validators.required, zodValidator(username)]],
    displayName: [this.person?.displayName ?? '', [Validators.required, zodValidator(displayName)]],
    email: [this.person?.email ?? '', [zodValidator(email)]],
    roles: this.fb.group(
      Object.fromEntries(ROLES.map((role) => [role, this.person?.roles.includes(role) ?? false])) as Record<Role, boolean>,
    ),
    temporaryPassword: ['', [Validators.required, zodValidator(newPassword)]],
  });

  constructor() {
    if (!this.isNew) {
      // Usernames never change (they appear in the trail); passwords have their own dialog.
      this.form.controls.username.disable();
      this.form.controls.temporaryPassword.disable();
    }
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
    // 400 field errors and 409 (username taken) are shown in this form, not as a snack bar.
    const context = callerHandles(400, 409);
    this.busy.set(true);
    try {
      const saved = this.person
        ? await firstValueFrom(
            this.api.update(this.person.id, { displayName: value.displayName, email: value.email, roles }, context),
          )
        : await firstValueFrom(
            this.api.create(
              {
                username: value.username,
                displayName: value.displayName,
                email: value.email,
                roles,
                temporaryPassword: value.temporaryPassword,
              },
              context,
            ),
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
