import { z } from 'zod';
import { idParam } from '../../../shared/schemas/fields';
import { toFieldErrors } from '../../../shared/validation';
import { AppError } from '../../app-error';

/** Validates with a shared schema; a failure becomes 400 VALIDATION_FAILED with field errors. */
export function parse<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw AppError.validation(toFieldErrors(result.error));
  return result.data;
}

/** A JSON body, or an empty object when none was sent (so field errors name the fields). */
export function bodyOf(body: unknown): unknown {
  return body === undefined ? {} : body;
}

const idParams = z.object({ id: idParam });

export function idOf(params: unknown): number {
  return parse(idParams, params).id;
}
