import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { z } from 'zod';
import { toFieldErrors } from '@shared/validation';

/**
 * A form validator from one of the shared zod schemas, so the form checks exactly what the
 * server will check, with the same words. The error is `{ zod: message }`.
 */
export function zodValidator(schema: z.ZodType): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const result = schema.safeParse(control.value);
    return result.success ? null : { zod: toFieldErrors(result.error)[0]?.message ?? 'This value is not valid.' };
  };
}
