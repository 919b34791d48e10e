import type { z } from 'zod';
import type { FieldError } from './api-error';

/** Turns a zod error into the `{path, message}` list of the API's error envelope. */
export function toFieldErrors(error: z.ZodError): FieldError[] {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.'),
    message: issue.message,
  }));
}
