import { inject, signal } from '@angular/core';
import { type FormGroup, NonNullableFormBuilder } from '@angular/forms';
import { MatDialogRef } from '@angular/material/dialog';
import { firstValueFrom } from 'rxjs';
import type { z } from 'zod';
import { StockApi, type StockResource } from '../core/api/stock-api';
import { controlMessage } from '../core/forms/control-message';
import { applyServerErrors } from '../core/forms/server-errors';
import { checkWholeBody } from '../core/forms/whole-body-check';
import { isApiError } from '../core/http/api-error';
import { callerHandles } from '../core/http/caller-handles';

/**
 * What the add and edit dialogs of every stock kind share: the form's busy and error state,
 * and the save. The dialog closes with the saved record.
 */
export abstract class StockFormDialog<TRecord> {
  protected readonly api = inject(StockApi);
  protected readonly fb = inject(NonNullableFormBuilder);
  private readonly dialogRef = inject<MatDialogRef<unknown, TRecord>>(MatDialogRef);
  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  protected abstract readonly form: FormGroup;

  /**
   * Field rules, then the whole shared schema, then create (no `id`) or update; 400 and 409
   * answers land on their fields (not in a snack bar). Closes with the saved record.
   */
  protected async saveWith<S extends z.ZodType>(
    schema: S,
    candidate: unknown,
    resource: StockResource<z.infer<S>, TRecord>,
    id: number | undefined,
  ): Promise<void> {
    const form = this.form;
    this.formError.set('');
    if (form.invalid) {
      form.markAllAsTouched();
      return;
    }
    const body = checkWholeBody(form, schema, candidate, (messages) => this.formError.set(messages.join(' ')));
    if (!body) return;
    const context = callerHandles(400, 409);
    this.busy.set(true);
    try {
      const saved = await firstValueFrom(id === undefined ? resource.create(body, context) : resource.update(id, body, context));
      this.dialogRef.close(saved);
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.status === 400 || e.status === 409) this.formError.set(applyServerErrors(form, e.errors).join(' '));
    } finally {
      this.busy.set(false);
    }
  }
}
