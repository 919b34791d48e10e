/** One problem with a request, pointing at the field it concerns ("" for the whole body). */
export interface FieldError {
  /** Dotted path into the body or query, e.g. "roles.0"; "" for the request as a whole. */
  path: string;
  message: string;
}

/** Every `code` the server answers with; the client branches on these, never on messages. */
export const API_ERROR_CODES = [
  'VALIDATION_FAILED',
  'INVALID_JSON',
  'LINK_INVALID',
  'BAD_CREDENTIALS',
  'NOT_SIGNED_IN',
  'CSRF_INVALID',
  'FORBIDDEN',
  'OWN_VERSION',
  'PASSWORD_CHANGE_REQUIRED',
  'NOT_FOUND',
  'CONFLICT',
  'BLOCKERS',
  'ACKNOWLEDGE_FIRST',
  'LINK_EXPIRED',
  'LINK_USED',
  'PAYLOAD_TOO_LARGE',
  'UNSUPPORTED_MEDIA_TYPE',
  'TOO_MANY_ATTEMPTS',
  'INTEGRITY_FAILED',
  'INTERNAL',
  'DATABASE_UNAVAILABLE',
] as const;
export type ApiErrorCode = (typeof API_ERROR_CODES)[number];

/**
 * The error envelope every `/api` route answers with on failure:
 * `{ "errors": [{ "path": …, "message": … }], "code": … }`.
 */
export interface ApiErrorBody {
  /** Stable machine-readable code, e.g. `VALIDATION_FAILED`, `FORBIDDEN`, `DATABASE_UNAVAILABLE`. */
  code: ApiErrorCode;
  errors: FieldError[];
}

export function isApiErrorBody(value: unknown): value is ApiErrorBody {
  return (
    typeof value === 'object' &&
    value !== null &&
    Array.isArray((value as ApiErrorBody).errors) &&
    (API_ERROR_CODES as readonly unknown[]).includes((value as ApiErrorBody).code)
  );
}

/** One line of plain text for a person, from an error envelope. */
export function describeApiError(body: Pick<ApiErrorBody, 'errors'>): string {
  return body.errors.map((e) => (e.path ? `${e.path}: ${e.message}` : e.message)).join('; ');
}
