/** One problem with a request, pointing at the field it concerns ("" for the whole body). */
export interface FieldError {
  /** Dotted path into the body or query, e.g. "roles.0"; "" for the request as a whole. */
  path: string;
  message: string;
}

/**
 * The error envelope every `/api` route answers with on failure:
 * `{ "errors": [{ "path": …, "message": … }], "code": … }`.
 */
export interface ApiErrorBody {
  /** Stable machine-readable code, e.g. `VALIDATION_FAILED`, `FORBIDDEN`, `DATABASE_UNAVAILABLE`. */
  code: string;
  errors: FieldError[];
}

export function isApiErrorBody(value: unknown): value is ApiErrorBody {
  return (
    typeof value === 'object' &&
    value !== null &&
    Array.isArray((value as ApiErrorBody).errors) &&
    typeof (value as ApiErrorBody).code === 'string'
  );
}

/** One line of plain text for a person, from an error envelope. */
export function describeApiError(body: ApiErrorBody): string {
  return body.errors.map((e) => (e.path ? `${e.path}: ${e.message}` : e.message)).join('; ');
}
