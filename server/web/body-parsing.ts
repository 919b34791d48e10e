import express, { type RequestHandler } from 'express';
import { AppError } from '../app-error';

const WITH_BODY = new Set(['POST', 'PUT', 'PATCH']);

/**
 * Bodies are JSON; anything else is refused before it is read — except multipart forms
 * on the paths that take a file (matched on the full path, e.g. the attachments route).
 */
export function jsonContentTypeOnly(multipartPaths: readonly RegExp[] = []): RequestHandler {
  return (req, _res, next) => {
    if (!WITH_BODY.has(req.method)) return next();
    // An empty body (Content-Length: 0) needs no type: e.g. POST …/deactivate.
    const hasBody = req.headers['transfer-encoding'] !== undefined || Number(req.headers['content-length'] ?? 0) > 0;
    if (!hasBody || req.is('application/json')) return next();
    const fullPath = req.baseUrl + req.path;
    if (req.is('multipart/form-data') && multipartPaths.some((p) => p.test(fullPath))) return next();
    next(new AppError(415, 'UNSUPPORTED_MEDIA_TYPE', [{ path: '', message: 'Send the request body as JSON (Content-Type: application/json).' }]));
  };
}

export const requireJsonContentType: RequestHandler = jsonContentTypeOnly();

/** Recipes with instructions are the largest bodies; 1 MB leaves ample room. */
export const jsonBody: RequestHandler = express.json({ limit: '1mb', strict: true });
