import type { FormGroup } from '@angular/forms';
import type { z } from 'zod';
import { toFieldErrors } from '@shared/validation';
import { applyServerErrors } from './server-errors';

/**
 * Runs the whole shared schema over the body a form is about to send, so that rules across
 * fields (largest ≥ smallest, case depth when case-hardened) show on their field before the
 * server is asked. Returns the parsed body, or null after marking the fields; `unmatched`
 * receives the messages that belong to no control.
 */
export function checkWholeBody<S extends z.ZodType>(form: FormGroup, schema: S, body: unknown, unmatched: (messages: string[]) => void): z.infer<S> | null {
  const result = schema.safeParse(body);
  if (result.success) return result.data;
  unmatched(applyServerErrors(form, toFieldErrors(result.error)));
  return null;
}
