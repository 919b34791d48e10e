/**
 * Content-hashed scripts and stylesheets of the build, gzipped once per process and kept in
 * memory: they never change under their name, and gzipping ~1.5 MB of JavaScript on every
 * first visit would cost the server tens of milliseconds of CPU each time. Other files (and
 * clients that do not accept gzip) fall through to express.static and the compression middleware.
 */
import type { RequestHandler } from 'express';
import fs from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';

const gzipAsync = promisify(gzip);

const TYPES: Record<string, string> = {
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
};

/** Larger files are left to the compression middleware (none of the build's come close). */
const MAX_BYTES = 4 * 1000 * 1000;

export function hashedGzip(root: string, isHashed: (file: string) => boolean, cacheControl: string): RequestHandler {
  const cache = new Map<string, Promise<Buffer | null>>();

  const compressed = (file: string): Promise<Buffer | null> => {
    let entry = cache.get(file);
    if (!entry) {
      entry = fs.promises
        .readFile(file)
        .then((raw) => (raw.length <= MAX_BYTES ? gzipAsync(raw) : null))
        .catch(() => null);
      cache.set(file, entry);
      // A file missing now may appear after a new build: forget failures.
      void entry.then((buffer) => buffer ?? cache.delete(file));
    }
    return entry;
  };

  return (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const type = TYPES[path.extname(req.path)];
    if (!type || !isHashed(req.path) || !req.acceptsEncodings('gzip')) return next();
    const file = path.join(root, path.normalize(req.path));
    if (!file.startsWith(root + path.sep)) return next();
    compressed(file).then((body) => {
      if (!body) return next();
      res.setHeader('Content-Type', type);
      res.setHeader('Content-Encoding', 'gzip');
      res.setHeader('Content-Length', body.length);
      res.setHeader('Vary', 'Accept-Encoding');
      res.setHeader('Cache-Control', cacheControl);
      res.end(req.method === 'HEAD' ? undefined : body);
    }, next);
  };
}
