import express, { type Router } from 'express';
import fs from 'node:fs';
import path from 'node:path';
import { hashedGzip } from './hashed-gzip';

/** A year: the maximum browsers honour, for files whose name changes with their content. */
const HASHED_MAX_AGE_S = 365 * 24 * 60 * 60;

/**
 * The build names every script, stylesheet and font after its content (outputHashing "all"
 * in angular.json), e.g. `chunk-SV5VRIF7.js` or `media/roboto-latin-400-normal-54N5OGOO.woff2`:
 * such a file never changes under its name.
 */
export function isContentHashed(file: string): boolean {
  return /-[A-Z0-9]{8}\.(?:js|css|woff2?|ttf|svg|png|jpg|webp)$/.test(path.basename(file));
}

/** Serves the built Angular app; every other GET answers index.html so deep links work. */
export function spa(distDir: string): Router {
  const root = path.resolve(distDir);
  const index = path.join(root, 'index.html');
  const router = express.Router();
  const immutable = `public, max-age=${HASHED_MAX_AGE_S}, immutable`;
  router.use(hashedGzip(root, isContentHashed, immutable));
  router.use(
    express.static(root, {
      index: false,
      maxAge: '1h',
      setHeaders: (res, file) => {
        // Hashed files are cached for good (a new build has new names); others (favicon) for an hour.
        if (isContentHashed(file)) res.setHeader('Cache-Control', immutable);
      },
    }),
  );
  // Express 5 path syntax: a bare '*' is refused, a named wildcard is not.
  router.get('/{*splat}', (_req, res) => {
    if (!fs.existsSync(index)) {
      res.status(503).type('text/plain').send(`The web app has not been built yet (no ${index}). Run \`npm run build\`, then reload.\n`);
      return;
    }
    // index.html names the hashed bundles: always revalidate it.
    // dotfiles 'allow': the build may sit under a dot folder (KERFBOOK_DIST=.data/…), which
    // send() would otherwise refuse, turning every page into a 500.
    res.sendFile(index, { headers: { 'Cache-Control': 'no-cache' }, dotfiles: 'allow' });
  });
  return router;
}
