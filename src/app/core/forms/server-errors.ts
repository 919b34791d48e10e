import type { AbstractControl, FormGroup } from '@angular/forms';
import type { FieldError } from '@shared/api-error';

/**
 * Puts the server's 400/409 field errors on the matching controls as `{ server: message }`
 * (Angular drops them when the value next changes). A path like `roles.0` falls back to
 * `roles`. Returns the messages that belong to no control, for a form-level notice.
 */
export function applyServerErrors(form: FormGroup, errors: readonly FieldError[]): string[] {
  const unmatched: string[] = [];
  for (const error of errors) {
    const control = findControl(form, error.path);
    if (!control) {
      unmatched.push(error.message);
      continue;
    }
    control.setErrors({ ...(control.errors ?? {}), server: error.message });
    control.markAsTouched();
  }
  return unmatched;
}

function findControl(form: FormGroup, path: string): AbstractControl | null {
  if (!path) return null;
  const segments = path.split('.');
  for (let n = segments.length; n > 0; n--) {
    const control = form.get(segments.slice(0, n));
    if (control) return control;
  }
  return null;
}
