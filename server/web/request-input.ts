/**
 * The router's validation step: each request part a route declares is parsed by its
 * schema before the handler runs, and the handler receives the parsed values. A failure
 * is 400 VALIDATION_FAILED with field errors.
 */
import type { Request } from 'express';
import type { z } from 'zod';
import { toFieldErrors } from '../../shared/validation';
import { AppError } from '../app-error';
import { REQUEST_PARTS, type RequestPart, type RouteDefinition } from './route-definition';
import { noteValidation } from './validation-recorder';

/** Validates one part of the request with a shared schema. */
export function parsePart<S extends z.ZodType>(part: RequestPart, schema: S, value: unknown): z.output<S> {
  noteValidation(part, schema);
  const result = schema.safeParse(value);
  if (!result.success) throw AppError.validation(toFieldErrors(result.error));
  return result.data;
}

/** The raw value of a part; a missing body counts as an empty object so field errors name the fields. */
function rawPart(req: Request, part: RequestPart): unknown {
  if (part === 'body') return req.body === undefined ? {} : req.body;
  return req[part];
}

/** Every declared part, parsed in the order params, query, body. */
export function routeInput(route: RouteDefinition, req: Request): Partial<Record<RequestPart, unknown>> {
  const input: Partial<Record<RequestPart, unknown>> = {};
  for (const part of REQUEST_PARTS) {
    const schema = route[part];
    if (schema) input[part] = parsePart(part, schema, rawPart(req, part));
  }
  return input;
}
