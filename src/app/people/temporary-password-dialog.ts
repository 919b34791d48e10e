import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import type { UserDto } from '@shared/api-types';
import { newPassword } from '@shared/schemas/fields';
import { controlMessage } from '../core/forms/control-message';
import { applyServerErrors } from '../core/forms/server-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { isApiError } from '../core/http/api-error';
import { callerHandles } from '../core/http/caller-handles';
import { PeopleApi } from '../core/api/people-api';
import { suggestTemporaryPassword } from './temporary-password';

export interface TemporaryPasswordDialogData {
  person: UserDto;
}

/** An admin sets a temporary password; the person must replace it at their next sign-in. */
@Component({
  selector: 'kb-temporary-password-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  template: `
    <h2 mat-dialog-title>Temporary password for {{ person.displayName }}</h2>
    <form [formGroup]="form" (ngSubmit)="setPassword()" novalidate>
      <mat-dialog-content class="kb-dialog-content">
        <p>
          {{ person.displayName }} ({{ person.username }}) signs in with this password once and must then choose their own. Their current password stops
          working.
        </p>
        @if (formError()) {
          <p class="kb-form-error" role="alert">{{ formError() }}</p>
        }
        <div class="kb-password-row">
          <mat-form-field class="kb-field">
            <mat-label>Temporary password</mat-label>
            <input matInput formControlName="password" autocomplete="off" spellcheck="false" />
            <mat-error>{{ controlMessage(form.controls.password.errors) }}</mat-error>
          </mat-form-field>
          <button matButton type="button" (click)="suggestPassword()">
            <mat-icon>casino</mat-icon>
            Suggest one
          </button>
        </div>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button matButton type="button" mat-dialog-close>Cancel</button>
        <button matButton="filled" type="submit" [disabled]="busy()">Set temporary password</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .kb-dialog-content p {
      margin-top: 0;
    }
    .kb-password-row {
      display: flex;
      gap: 8px;
      align-items: flex-start;
    }
    .kb-password-row button {
      margin-top: 8px;
      flex: none;
    }
    .kb-field {
      flex: 1 1 auto;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TemporaryPasswordDialog {
  private readonly api = inject(PeopleApi);
  private readonly dialogRef = inject<MatDialogRef<TemporaryPasswordDialog, UserDto>>(MatDialogRef);

  protected readonly person = inject<TemporaryPasswordDialogData>(MAT_DIALOG_DATA).person;
  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', [Validators.required, zodValidator(newPassword)]],
  });

  protected suggestPassword(): void {
    this.form.controls.password.setValue(suggestTemporaryPassword());
  }

  protected async setPassword(): Promise<void> {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    try {
      const saved = await firstValueFrom(this.api.setTemporaryPassword(this.person.id, this.form.getRawValue().password, callerHandles(400)));
      this.dialogRef.close(saved);
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.status === 400) this.formError.set(applyServerErrors(this.form, e.errors).join(' '));
    } finally {
      this.busy.set(false);
    }
  }
}
