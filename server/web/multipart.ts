/**
 * Multipart bodies for the routes that take a file (attachments): multer with memory
 * storage, one file, a size cap, and its errors turned into the API's error envelope.
 * Runs after the access check, so nobody without the right role gets a body read.
 */
import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from '../app-error';
import { MAX_ATTACHMENT_BYTES } from '../services/recipes/attachments';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_ATTACHMENT_BYTES, files: 1, fields: 10, fieldSize: 8 * 1024, parts: 12 },
}).single('file');

function toAppError(err: unknown): AppError {
  if (err instanceof multer.MulterError) {
    switch (err.code) {
      case 'LIMIT_FILE_SIZE':
        return new AppError(413, 'PAYLOAD_TOO_LARGE', [
          { path: 'file', message: `The photo is larger than ${MAX_ATTACHMENT_BYTES / (1024 * 1024)} MB; reduce its size before attaching it.` },
        ]);
      case 'LIMIT_UNEXPECTED_FILE':
      case 'LIMIT_FILE_COUNT':
        return AppError.validation([{ path: 'file', message: 'Send exactly one photo, in the form field "file".' }]);
      default:
        return AppError.validation([{ path: err.field ?? '', message: 'The form has too many or too large fields.' }]);
    }
  }
  return AppError.validation([{ path: '', message: 'The upload could not be read as a multipart form.' }]);
}

export const multipartBody: RequestHandler = (req, res, next) => {
  // JSON or empty bodies pass through untouched; the handler then asks for the file.
  if (!req.is('multipart/form-data')) return next();
  upload(req, res, (err: unknown) => (err ? next(toAppError(err)) : next()));
};

/** A route path with its :params as a matcher of concrete paths. */
export function pathMatcher(routePath: string): RegExp {
  const escaped = routePath
    .split('/')
    .map((part) => (part.startsWith(':') ? '[^/]+' : part.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')))
    .join('/');
  return new RegExp(`^${escaped}/?$`);
}
