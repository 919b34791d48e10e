import type { AbstractControl, ValidationErrors } from '@angular/forms';

/** Validator of a "repeat" field: it must equal the `newPassword` control beside it. */
export function sameAsNewPassword(control: AbstractControl): ValidationErrors | null {
  const typed = control.parent?.get('newPassword')?.value;
  return control.value && control.value !== typed ? { message: 'The two passwords are not the same.' } : null;
}
