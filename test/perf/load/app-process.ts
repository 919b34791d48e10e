/**
 * The app under test for `npm run bench`, in a process of its own so the load generator and
 * the app do not share one event loop: the real app (createApp) without the background
 * jobs of server/jobs.ts, which would skew the figures, plus the bench-only routes of
 * extra-routes.ts. Reads BENCH_DATABASE_URL and listens on a free loopback port; prints
 * `READY <url>` once it answers. SIGTERM/SIGINT stop it.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomBytes } from 'node:crypto';
import { createApp } from '../../../server/app';
import { readConfig } from '../../../server/config';
import { createDb } from '../../../server/data/db';
import { benchRouter, queryRecorder } from './extra-routes';

const databaseUrl = process.env['BENCH_DATABASE_URL'];
if (!databaseUrl) {
  console.error('app-process: BENCH_DATABASE_URL is not set.');
  process.exit(2);
}

// Production settings (no development outbox); no SMTP, so mail only waits in the outbox.
const config = readConfig({
  DATABASE_URL: databaseUrl,
  SESSION_SECRET: randomBytes(32).toString('base64url'),
  NODE_ENV: 'production',
  HOST: '127.0.0.1',
  PORT: '0',
});
const db = createDb(config.databaseUrl);
const recorder = queryRecorder(db);
let stopping = false;
const { app, ready } = createApp({
  config,
  db,
  extraApiRouter: benchRouter(db, recorder),
  // Requests cut off by the stop itself are not faults worth a stack trace.
  log: (...args: unknown[]) => {
    if (!stopping) console.error(...args);
  },
});
await ready;

const server = http.createServer(app);
// autocannon keeps its connections open for the whole run.
server.keepAliveTimeout = 60_000;
server.listen(0, '127.0.0.1', () => {
  const { port } = server.address() as AddressInfo;
  console.log(`READY http://127.0.0.1:${port}`);
});

async function stop(): Promise<void> {
  if (stopping) return;
  stopping = true;
  server.closeAllConnections();
  server.close();
  // Handlers of the last requests may still wait for a connection: let them finish first,
  // or the pool aborts them and knex prints a warning with a stack for each.
  await new Promise((resolve) => setTimeout(resolve, 300));
  await db.destroy().catch(() => undefined);
  process.exit(0);
}
process.on('SIGTERM', () => void stop());
process.on('SIGINT', () => void stop());
