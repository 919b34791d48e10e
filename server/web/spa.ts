import express, { type Router } from 'express';
import fs from 'node:fs';
import path from 'node:path';

/** Serves the built Angular app; every other GET answers index.html so deep links work. */
export function spa(distDir: string): Router {
  const root = path.resolve(distDir);
  const index = path.join(root, 'index.html');
  const router = express.Router();
  router.use(express.static(root, { index: false, maxAge: '1h' }));
  // Express 5 path syntax: '*' is refused (toolchain pitfall 9).
  router.get('/{*splat}', (_req, res) => {
    if (!fs.existsSync(index)) {
      res.status(503).type('text/plain').send(`The web app has not been built yet (no ${index}). Run \`npm run build\`, then reload.\n`);
      return;
    }
    // index.html names the hashed bundles: always revalidate it.
    res.sendFile(index, { headers: { 'Cache-Control': 'no-cache' } });
  });
  return router;
}
