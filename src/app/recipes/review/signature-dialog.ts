import { ChangeDetectionStrategy, Component, type ElementRef, computed, inject, signal, viewChild } from '@angular/core';
import { type AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, type ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { enteredPassword } from '@shared/schemas/fields';
import { requiredText, text } from '@shared/schemas/numbers';
import type { SignatureMeaning } from '@shared/schemas/workflow';
import { controlMessage } from '../../core/forms/control-message';
import { applyServerErrors } from '../../core/forms/server-errors';
import { zodValidator } from '../../core/forms/zod-validator';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { Session } from '../../core/session/session';
import { utcToday } from '../../core/dates/calendar';
import { SIGNATURE_MEANING_INFO } from '../../ui/signature-meaning';
import { WorkflowApi } from '../../core/api/workflow-api';

export interface SignatureDialogData {
  meaning: SignatureMeaning;
  /** The version being signed, as the signer saw it (its revision goes with the signature). */
  version: RecipeVersionDto;
  /** Approve only: ids of the warnings the approver ticked on the review screen. */
  acknowledgedWarnings?: readonly string[];
}

/** Closes with the signed version, with 'reload' when the version changed meanwhile, or with nothing when cancelled. */
export type SignatureDialogResult = RecipeVersionDto | 'reload' | undefined;

const OWN_VERSION_MESSAGE = 'You authored or edited this version, so someone else must approve it.';
const STALE_MESSAGE = 'This version changed since you opened it; reload to see the current content.';

/** YYYY-MM-DD not before today (UTC): a version cannot become effective in the past. */
function notInThePast(control: AbstractControl<string>): ValidationErrors | null {
  const value = control.value;
  if (!value) return null;
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) return { zod: 'Use a date like 2027-01-31.' };
  return value < utcToday() ? { zod: 'The effective date cannot be in the past.' } : null;
}

/**
 * Electronic signature for approving or withdrawing a version: shows what is signed and what the
 * signature means, asks for the username and password at the first signing in a session and
 * the password alone after that (21 CFR 11.200(a)(1)), and sends the signature itself so a wrong
 * password is answered in place.
 */
@Component({
  selector: 'kb-signature-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './signature-dialog.html',
  styleUrl: './signature-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignatureDialog {
  private readonly api = inject(WorkflowApi);
  private readonly session = inject(Session);
  private readonly dialogRef = inject<MatDialogRef<SignatureDialog, SignatureDialogResult>>(MatDialogRef);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly passwordInput = viewChild<ElementRef<HTMLInputElement>>('passwordInput');
  protected readonly data = inject<SignatureDialogData>(MAT_DIALOG_DATA);

  protected readonly isApproval = this.data.meaning === 'approved';
  protected readonly meaning = SIGNATURE_MEANING_INFO[this.data.meaning];
  protected readonly signerName = computed(() => this.session.user()?.displayName ?? '');
  protected readonly today = utcToday();
  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  /** The version changed on the server: signing it is no longer possible from here. */
  protected readonly stale = signal(false);

  /** The first signing in a session takes both components; later ones the password only. */
  protected readonly askUsername = signal(this.session.signatureNeedsUsername());

  protected readonly form = this.fb.group({
    username: ['', this.askUsername() ? [Validators.required, Validators.maxLength(40)] : []],
    password: ['', [Validators.required, zodValidator(enteredPassword)]],
    comment: ['', this.isApproval ? [zodValidator(text('Comment', 2000))] : [Validators.required, zodValidator(requiredText('Reason', 2000))]],
    effectiveDate: [this.today, this.isApproval ? [Validators.required, notInThePast] : []],
  });

  protected async sign(): Promise<void> {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { username, password, comment, effectiveDate } = this.form.getRawValue();
    const signer = this.askUsername() ? { username, password } : { password };
    const { recipeId, version, revision } = this.data.version;
    // Field errors, a refused signer and a changed version are all shown here, not as a snack bar.
    const context = callerHandles(400, 403, 409, 429);
    this.busy.set(true);
    try {
      const signed = this.isApproval
        ? await firstValueFrom(
            this.api.approve(
              recipeId,
              version,
              { revision, ...signer, meaning: 'approved', comment, acknowledgedWarnings: [...(this.data.acknowledgedWarnings ?? [])], effectiveDate },
              context,
            ),
          )
        : await firstValueFrom(this.api.withdraw(recipeId, version, { revision, ...signer, meaning: 'withdrawn', reason: comment }, context));
      this.session.noteFullSigning();
      this.dialogRef.close(signed);
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.status === 403 && e.code === 'OWN_VERSION') {
        this.formError.set(OWN_VERSION_MESSAGE);
      } else if (e.status === 409) {
        this.stale.set(true);
        this.formError.set(STALE_MESSAGE);
      } else if (e.status === 400) {
        // The server's session needs the username after all (it began anew): ask for it.
        if (!this.askUsername() && e.errors.some((err) => err.path === 'username')) this.showUsername();
        // The field names of the body match the form's, except the withdrawal reason.
        // A password retyped while the answer was on its way is not the one the server judged.
        const retyped = this.form.controls.password.value !== password;
        const errors = e.errors
          .map((err) => (err.path === 'reason' ? { ...err, path: 'comment' } : err))
          .filter((err) => !(retyped && err.path === 'password'));
        this.formError.set(applyServerErrors(this.form, errors).join(' '));
        if (this.form.controls.password.errors?.['server']) this.passwordInput()?.nativeElement.select();
      } else {
        this.formError.set(e.generalMessage);
      }
    } finally {
      this.busy.set(false);
    }
  }

  private showUsername(): void {
    this.askUsername.set(true);
    this.session.noteUsernameNeeded();
    this.form.controls.username.setValidators([Validators.required, Validators.maxLength(40)]);
  }

  protected reload(): void {
    this.dialogRef.close('reload');
  }
}
