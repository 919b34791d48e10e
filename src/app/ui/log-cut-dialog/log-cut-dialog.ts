import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { type AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, type ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { CutRecordDto } from '@shared/recipe-types';
import { cutRecordBody } from '@shared/schemas/operator';
import { CUT_OUTCOMES, CUT_OUTCOME_LABELS, type CutOutcome } from '@shared/vocabulary';
import { controlMessage } from '../../core/forms/control-message';
import { applyServerErrors } from '../../core/forms/server-errors';
import { zodValidator } from '../../core/forms/zod-validator';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { CUT_OUTCOME_ICONS } from '../cut-outcome-label';
import { CutsApi } from '../../core/api/cuts-api';
import { DecimalInput } from '../decimal-input';

/** The version the cut was made with. */
export interface LogCutDialogData {
  recipeId: number;
  number: string;
  title: string;
  version: number;
  /** The operator has not acknowledged this version yet: the server takes no cut until they have. */
  mustAcknowledge?: boolean;
}

/** Notes become required once the outcome is anything but good: the author needs to know what was seen. */
function notesWhenNotGood(group: AbstractControl): ValidationErrors | null {
  const outcome = group.get('outcome')?.value as CutOutcome | null;
  const notes = group.get('notes');
  if (!notes) return null;
  const missing = outcome !== null && outcome !== 'good' && !String(notes.value).trim();
  const others = { ...(notes.errors ?? {}) };
  delete others['notesNeeded'];
  const next = missing ? { ...others, notesNeeded: true } : others;
  notes.setErrors(Object.keys(next).length ? next : null, { emitEvent: false });
  return null;
}

/**
 * Log a cut: one cut against the exact version used, so a specimen can be traced back to it. Anything but a good
 * outcome flags the recipe for its author; the dialog says so before and after sending.
 */
@Component({
  selector: 'kb-log-cut-dialog',
  imports: [DecimalInput, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, ReactiveFormsModule, RouterLink],
  templateUrl: './log-cut-dialog.html',
  styleUrl: './log-cut-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LogCutDialog {
  private readonly api = inject(CutsApi);
  private readonly ref = inject<MatDialogRef<LogCutDialog, CutRecordDto>>(MatDialogRef);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly data = inject<LogCutDialogData>(MAT_DIALOG_DATA);

  protected readonly form = this.fb.group(
    {
      specimenId: ['', [zodValidator(cutRecordBody.shape.specimenId)]],
      partRef: ['', [zodValidator(cutRecordBody.shape.partRef)]],
      quantity: [1, [Validators.required, zodValidator(cutRecordBody.shape.quantity)]],
      outcome: this.fb.control<CutOutcome | null>(null),
      notes: ['', [zodValidator(cutRecordBody.shape.notes)]],
    },
    { validators: [notesWhenNotGood] },
  );

  protected readonly outcomes = CUT_OUTCOMES.map((value) => ({ value, label: CUT_OUTCOME_LABELS[value], icon: CUT_OUTCOME_ICONS[value] }));
  private readonly outcome = toSignal(this.form.controls.outcome.valueChanges, { initialValue: null });
  protected readonly flags = computed(() => {
    const outcome = this.outcome();
    return outcome !== null && outcome !== 'good';
  });
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  protected readonly outcomeError = signal('');
  protected readonly controlMessage = controlMessage;
  /**
   * Why no cut can be logged yet: the version waits for this operator's acknowledgement
   * (known when the dialog opens, or from the server's ACKNOWLEDGE_FIRST answer).
   */
  protected readonly acknowledgeFirst = signal(
    this.data.mustAcknowledge
      ? `You have not acknowledged version ${this.data.version} of ${this.data.number} yet: read and acknowledge it before you log a cut with it.`
      : '',
  );

  protected notesMessage(): string {
    const errors = this.form.controls.notes.errors;
    if (errors?.['notesNeeded'] && !errors['server'] && !errors['zod']) return 'Say what you saw: notes are needed when the cut was not good.';
    return controlMessage(errors);
  }

  protected async send(): Promise<void> {
    this.formError.set('');
    const outcome = this.form.controls.outcome.value;
    this.outcomeError.set(outcome ? '' : 'Choose the outcome of the cut.');
    if (this.form.invalid || !outcome) {
      this.form.markAllAsTouched();
      return;
    }
    const raw = this.form.getRawValue();
    this.busy.set(true);
    try {
      const saved = await firstValueFrom(
        this.api.log(
          this.data.recipeId,
          this.data.version,
          { specimenId: raw.specimenId.trim(), partRef: raw.partRef.trim(), quantity: Number(raw.quantity), outcome, notes: raw.notes.trim() },
          callerHandles(400, 409),
        ),
      );
      this.ref.close(saved);
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.code === 'ACKNOWLEDGE_FIRST') {
        this.acknowledgeFirst.set(e.generalMessage);
        return;
      }
      if (e.status === 409) {
        this.formError.set(`${e.generalMessage} Open the recipe again to see which version is current now.`);
        return;
      }
      const outcomeErrors = e.errors.filter((x) => x.path === 'outcome');
      if (outcomeErrors.length) this.outcomeError.set(outcomeErrors[0].message);
      const unmatched = applyServerErrors(
        this.form,
        e.errors.filter((x) => x.path !== 'outcome'),
      );
      if (unmatched.length) this.formError.set(unmatched.join(' '));
    } finally {
      this.busy.set(false);
    }
  }
}
