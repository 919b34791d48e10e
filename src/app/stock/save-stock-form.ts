import type { WritableSignal } from '@angular/core';
import type { FormGroup } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import type { z } from 'zod';
import { applyServerErrors } from '../core/forms/server-errors';
import { isApiError } from '../core/http/api-error';
import { callerHandles } from '../core/http/caller-handles';
import type { StockResource } from '../core/api/stock-api';
import { checkWholeBody } from '../core/forms/whole-body-check';

export interface StockFormSave<S extends z.ZodType, TRecord> {
  form: FormGroup;
  schema: S;
  /** The body as the form builds it, before the shared schema parses it. */
  candidate: unknown;
  resource: StockResource<z.infer<S>, TRecord>;
  /** The record being edited; absent when adding one. */
  id?: number;
  busy: WritableSignal<boolean>;
  formError: WritableSignal<string>;
}

/**
 * The save of every stock form dialog: field rules, then the whole shared schema, then
 * create or update; 400 and 409 answers land on their fields (not in a snack bar).
 * Returns the saved record, or null when the form or the server refused it.
 */
export async function saveStockForm<S extends z.ZodType, TRecord>(save: StockFormSave<S, TRecord>): Promise<TRecord | null> {
  const { form, formError, busy } = save;
  formError.set('');
  if (form.invalid) {
    form.markAllAsTouched();
    return null;
  }
  const body = checkWholeBody(form, save.schema, save.candidate, (messages) => formError.set(messages.join(' ')));
  if (!body) return null;
  const context = callerHandles(400, 409);
  busy.set(true);
  try {
    return await firstValueFrom(save.id === undefined ? save.resource.create(body, context) : save.resource.update(save.id, body, context));
  } catch (e) {
    if (!isApiError(e)) throw e;
    if (e.status === 400 || e.status === 409) formError.set(applyServerErrors(form, e.errors).join(' '));
    return null;
  } finally {
    busy.set(false);
  }
}
