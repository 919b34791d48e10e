import { type HttpErrorResponse } from '@angular/common/http';
import { type ApiErrorCode, type FieldError, describeApiError, isApiErrorBody } from '@shared/api-error';

/** A server code, or what the app says when there was no envelope (no answer, or a proxy's page). */
export type ClientErrorCode = ApiErrorCode | 'NETWORK' | `HTTP_${number}`;

/**
 * A failed API call as the app sees it: the HTTP status plus the server's error envelope.
 * The error interceptor turns every HttpErrorResponse into one of these, so callers never
 * need to dig into `HttpErrorResponse.error`.
 */
export class ApiError extends Error {
  constructor(
    /** HTTP status; 0 when the server could not be reached. */
    readonly status: number,
    /** The envelope's stable code, e.g. `VALIDATION_FAILED`; `NETWORK` or `HTTP_<status>` when there was no envelope. */
    readonly code: ClientErrorCode,
    readonly errors: FieldError[],
    /** The whole response body, for envelopes that carry more (a stale save's `current` version). */
    readonly body: unknown = null,
  ) {
    super(describeApiError({ errors }));
    this.name = 'ApiError';
  }

  static fromResponse(response: HttpErrorResponse): ApiError {
    if (isApiErrorBody(response.error)) {
      return new ApiError(response.status, response.error.code, response.error.errors, response.error);
    }
    if (response.status === 0) {
      return new ApiError(0, 'NETWORK', [{ path: '', message: 'The Kerfbook server could not be reached. Check the connection and try again.' }]);
    }
    return new ApiError(response.status, `HTTP_${response.status}`, [
      { path: '', message: `The server answered with an unexpected error (${response.status}).` },
    ]);
  }

  /** The messages not tied to a field, or all messages when none is. */
  get generalMessage(): string {
    const general = this.errors.filter((e) => !e.path);
    return (general.length ? general : this.errors).map((e) => e.message).join(' ');
  }
}

/** Narrowing helper for `catch (e: unknown)`. */
export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}
