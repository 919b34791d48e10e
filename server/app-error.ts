import type { ApiErrorCode, FieldError } from '../shared/api-error';

/**
 * An error meant for the client: HTTP status, stable `code` and `{path, message}` list.
 * Services throw these; the final error chain answers them as they are.
 */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode,
    readonly errors: FieldError[],
    options?: { cause?: unknown; headers?: Record<string, string>; extra?: Record<string, unknown> },
  ) {
    super(errors.map((e) => e.message).join(' ') || code, options?.cause ? { cause: options.cause } : undefined);
    this.name = 'AppError';
    this.headers = options?.headers ?? {};
    this.extra = options?.extra ?? {};
  }

  /** Extra response headers, e.g. Retry-After on 429. */
  readonly headers: Record<string, string>;

  /** Extra members of the answer beside code and errors, e.g. `current` on a stale save. */
  readonly extra: Record<string, unknown>;

  static validation(errors: FieldError[]): AppError {
    return new AppError(400, 'VALIDATION_FAILED', errors);
  }

  static notFound(message: string): AppError {
    return new AppError(404, 'NOT_FOUND', [{ path: '', message }]);
  }

  static conflict(message: string, path = ''): AppError {
    return new AppError(409, 'CONFLICT', [{ path, message }]);
  }

  static forbidden(message: string): AppError {
    return new AppError(403, 'FORBIDDEN', [{ path: '', message }]);
  }
}
