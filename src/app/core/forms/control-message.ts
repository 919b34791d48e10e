import type { ValidationErrors } from '@angular/forms';

/**
 * The one message to show under a field. A number the field could not read comes first (the
 * value behind it is empty, so "required" would mislead); then server messages (they answer
 * the last save), then the shared schema's words, then Angular's built-in validators.
 */
export function controlMessage(errors: ValidationErrors | null | undefined): string {
  if (!errors) return '';
  if (typeof errors['decimal'] === 'string') return errors['decimal'];
  if (typeof errors['server'] === 'string') return errors['server'];
  if (typeof errors['zod'] === 'string') return errors['zod'];
  if (errors['required']) return 'This field is required.';
  if (typeof errors['message'] === 'string') return errors['message'];
  return 'This value is not valid.';
}
