import express, { type RequestHandler } from 'express';
import { AppError } from '../app-error';

const WITH_BODY = new Set(['POST', 'PUT', 'PATCH']);

/** Bodies are JSON; anything else is refused before it is read. */
export const requireJsonContentType: RequestHandler = (req, _res, next) => {
  if (!WITH_BODY.has(req.method)) return next();
  // An empty body (Content-Length: 0) needs no type: e.g. POST …/deactivate.
  const hasBody = req.headers['transfer-encoding'] !== undefined || Number(req.headers['content-length'] ?? 0) > 0;
  if (!hasBody || req.is('application/json')) return next();
  next(new AppError(415, 'UNSUPPORTED_MEDIA_TYPE', [{ path: '', message: 'Send the request body as JSON (Content-Type: application/json).' }]));
};

/** Recipes with instructions are the largest bodies; 1 MB leaves ample room. */
export const jsonBody: RequestHandler = express.json({ limit: '1mb', strict: true });
