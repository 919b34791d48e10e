import { ChangeDetectionStrategy, Component, computed, inject, input, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { type FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { Router } from '@angular/router';
import type { UnitPreference } from '@shared/api-types';
import { ROLE_INFO } from '@shared/roles';
import { newPassword } from '@shared/schemas/fields';
import { changePasswordBody } from '@shared/schemas/session';
import { controlMessage } from '../core/forms/control-message';
import { sameAsNewPassword } from '../core/forms/same-as-new-password';
import { applyServerErrors } from '../core/forms/server-errors';
import { checkWholeBody } from '../core/forms/whole-body-check';
import { zodValidator } from '../core/forms/zod-validator';
import { isApiError } from '../core/http/api-error';
import { safeReturnUrl } from '../core/session/return-url';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { NotificationSettings } from './notification-settings';

/** My account: change one's own password (required after an admin set a temporary one), units and mail notifications. */
@Component({
  selector: 'kb-account',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, NotificationSettings, ReactiveFormsModule],
  templateUrl: './account.html',
  styleUrl: './account.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Account {
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly notifier = inject(Notifier);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly passwordDirective = viewChild.required<FormGroupDirective>('passwordDirective');

  /** Where to continue once a required password change is done; bound from the query string. */
  readonly returnUrl = input<string>();

  protected readonly user = this.session.user;
  protected readonly mustChangePassword = this.session.mustChangePassword;
  protected readonly roleLabels = computed(() =>
    this.session
      .roles()
      .map((role) => ROLE_INFO[role].label)
      .join(', '),
  );
  protected readonly controlMessage = controlMessage;

  protected readonly passwordForm = this.fb.group({
    currentPassword: ['', [Validators.required]],
    newPassword: ['', [Validators.required, zodValidator(newPassword)]],
    repeatPassword: ['', [Validators.required, sameAsNewPassword]],
  });
  protected readonly passwordBusy = signal(false);
  protected readonly passwordError = signal('');

  protected readonly units = this.fb.control<UnitPreference>(this.session.user()?.units ?? 'metric');
  protected readonly unitsBusy = signal(false);

  constructor() {
    // Re-check the repeat field whenever the password it must match changes.
    this.passwordForm.controls.newPassword.valueChanges
      .pipe(takeUntilDestroyed())
      .subscribe(() => this.passwordForm.controls.repeatPassword.updateValueAndValidity({ emitEvent: false }));
  }

  protected async changePassword(): Promise<void> {
    this.passwordError.set('');
    const form = this.passwordForm;
    if (form.invalid) {
      form.markAllAsTouched();
      return;
    }
    const { currentPassword, newPassword: chosen } = form.getRawValue();
    // The shared schema's whole-body rules (e.g. new must differ from current), before asking the server.
    const body = checkWholeBody(form, changePasswordBody, { currentPassword, newPassword: chosen }, (rest) => this.passwordError.set(rest.join(' ')));
    if (!body) return;
    const wasRequired = this.mustChangePassword();
    this.passwordBusy.set(true);
    try {
      await this.session.changePassword(body);
      this.passwordDirective().resetForm();
      void this.notifier.show('Your password has been changed.', 'OK', 5000);
      if (wasRequired) await this.router.navigateByUrl(safeReturnUrl(this.returnUrl()));
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.code === 'BAD_CREDENTIALS' || e.status === 401) {
        form.controls.currentPassword.setErrors({ server: e.generalMessage || 'The current password is not right.' });
        form.controls.currentPassword.markAsTouched();
      } else {
        this.passwordError.set(applyServerErrors(form, e.errors).join(' '));
      }
    } finally {
      this.passwordBusy.set(false);
    }
  }

  protected async saveUnits(units: UnitPreference): Promise<void> {
    const before = this.session.user()?.units ?? 'metric';
    this.unitsBusy.set(true);
    try {
      await this.session.setUnits(units);
      const message = units === 'metric' ? 'Values will be shown in metric units.' : 'Imperial values will be shown beside metric ones.';
      void this.notifier.show(message, 'OK', 4000);
    } catch {
      // The error interceptor has told the user why; show the setting that is really stored.
      this.units.setValue(before, { emitEvent: false });
    } finally {
      this.unitsBusy.set(false);
    }
  }
}
