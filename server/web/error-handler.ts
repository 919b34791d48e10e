/**
 * The one final error chain. Known errors answer as they are; a database that cannot be
 * reached is 503; anything else is logged and answered as a plain 500 — never a stack
 * trace or SQL text in a response.
 */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '../../shared/api-error';
import { AppError } from '../app-error';

const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_SERVER_SHUTDOWN',
  'ER_CON_COUNT_ERROR',
  'ER_CONNECTION_KILLED',
]);

/** True for errors that mean "the database is not there right now", not "the query is wrong". */
export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err as { code?: unknown; name?: unknown; fatal?: unknown; cause?: unknown } | null, depth = 0; e && depth < 4; depth++) {
    if (typeof e !== 'object') return false;
    if (e.name === 'KnexTimeoutError' || e.fatal === true) return true;
    if (typeof e.code === 'string' && UNREACHABLE_CODES.has(e.code)) return true;
    e = e.cause as typeof e;
  }
  return false;
}

/** body-parser's own errors, by their `type`. */
function fromBodyParser(err: { type?: unknown }): AppError | null {
  switch (err.type) {
    case 'entity.parse.failed':
      return new AppError(400, 'INVALID_JSON', [{ path: '', message: 'The request body is not valid JSON.' }]);
    case 'entity.too.large':
      return new AppError(413, 'PAYLOAD_TOO_LARGE', [{ path: '', message: 'The request body is too large.' }]);
    case 'charset.unsupported':
    case 'encoding.unsupported':
      return new AppError(415, 'UNSUPPORTED_MEDIA_TYPE', [{ path: '', message: 'Send the request body as UTF-8 JSON.' }]);
    default:
      return null;
  }
}

/**
 * Other client faults Express and body-parser mark with status 400 (http-errors): a path
 * with a malformed %-escape (router), a body that does not match its Content-Encoding (zlib).
 */
function fromClientFault(err: { status?: unknown }): AppError | null {
  if (err.status !== 400) return null;
  if (err instanceof URIError) return AppError.validation([{ path: '', message: 'The address contains a malformed %-escape.' }]);
  return new AppError(400, 'INVALID_JSON', [{ path: '', message: 'The request body could not be read (does it match its Content-Encoding?).' }]);
}

function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  if (err && typeof err === 'object') {
    const parsed = fromBodyParser(err as { type?: unknown }) ?? fromClientFault(err as { status?: unknown });
    if (parsed) return parsed;
  }
  if (isDatabaseUnavailable(err)) {
    return new AppError(503, 'DATABASE_UNAVAILABLE', [{ path: '', message: 'The database is not reachable right now. Try again in a moment.' }]);
  }
  return new AppError(500, 'INTERNAL', [{ path: '', message: 'Something went wrong on the server.' }], { cause: err });
}

export const apiNotFound: RequestHandler = (req, res) => {
  const body: ApiErrorBody = { code: 'NOT_FOUND', errors: [{ path: '', message: `There is no API route ${req.method} ${req.baseUrl}${req.path}.` }] };
  res.status(404).json(body);
};

export function errorHandler(log: (...args: unknown[]) => void = console.error): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) return next(err);
    const appError = toAppError(err);
    if (appError.status >= 500) {
      log(`[error] ${req.method} ${req.originalUrl} → ${appError.status} ${appError.code}:`, appError.status === 500 ? err : (err as Error)?.message);
    }
    for (const [name, value] of Object.entries(appError.headers)) res.setHeader(name, value);
    const body: ApiErrorBody = { ...appError.extra, code: appError.code, errors: appError.errors };
    res.status(appError.status).json(body);
  };
}
