import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { type Observable, firstValueFrom } from 'rxjs';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { requiredText } from '@shared/schemas/numbers';
import { controlMessage } from '../../core/forms/control-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { isApiError } from '../../core/http/api-error';

export interface ReasonDialogData {
  title: string;
  /** Paragraphs of plain text above the field. */
  intro: readonly string[];
  /** Label of the text field, also the name the shared schema uses in its messages. */
  label: string;
  maxLength: number;
  confirmLabel: string;
  /**
   * Sends the text; called with the caller's own context so 400 and 409 come back here.
   * The path of a field error on the text, e.g. "comment" or "changeReason".
   */
  send: (text: string) => Observable<RecipeVersionDto>;
  fieldPath: string;
}

/** Asks for one required text (a return comment, a change reason), sends it and closes with the answer. */
@Component({
  selector: 'kb-reason-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <form [formGroup]="form" (ngSubmit)="send()" novalidate>
      <mat-dialog-content class="kb-reason">
        @for (paragraph of data.intro; track $index) {
          <p>{{ paragraph }}</p>
        }
        @if (formError()) {
          <p class="kb-form-error" role="alert" data-testid="form-error">{{ formError() }}</p>
        }
        <mat-form-field class="kb-field">
          <mat-label>{{ data.label }}</mat-label>
          <textarea matInput formControlName="text" rows="4" [attr.maxlength]="data.maxLength" cdkFocusInitial></textarea>
          <mat-error data-testid="text-error">{{ controlMessage(form.controls.text.errors) }}</mat-error>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button matButton type="button" mat-dialog-close>Cancel</button>
        <button matButton="filled" type="submit" [disabled]="busy()">{{ data.confirmLabel }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .kb-reason {
      max-width: 520px;
    }
    .kb-field {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReasonDialog {
  private readonly dialogRef = inject<MatDialogRef<ReasonDialog, RecipeVersionDto>>(MatDialogRef);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly data = inject<ReasonDialogData>(MAT_DIALOG_DATA);

  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  protected readonly form = this.fb.group({
    text: ['', [Validators.required, zodValidator(requiredText(this.data.label, this.data.maxLength))]],
  });

  protected async send(): Promise<void> {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    try {
      this.dialogRef.close(await firstValueFrom(this.data.send(this.form.getRawValue().text)));
    } catch (e) {
      if (!isApiError(e)) throw e;
      const onField = e.errors.find((err) => err.path === this.data.fieldPath);
      if (onField) {
        this.form.controls.text.setErrors({ server: onField.message });
        this.form.controls.text.markAsTouched();
      }
      const rest = e.errors.filter((err) => err !== onField);
      if (rest.length || !onField) {
        this.formError.set(
          e.status === 409
            ? `${e.generalMessage} Close this dialog and reload the page to see the current state.`
            : rest.map((r) => r.message).join(' ') || e.generalMessage,
        );
      }
    } finally {
      this.busy.set(false);
    }
  }
}
