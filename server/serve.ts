/** Starts the HTTP server once the session store is ready. Used by main.ts and the bootstrap. */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Knex } from 'knex';
import { createApp } from './app';
import type { Config } from './config';

export interface RunningServer {
  /** e.g. http://127.0.0.1:4300 */
  url: string;
  /** Stops accepting requests and ends open connections. The caller closes the database. */
  close(): Promise<void>;
}

export async function serve(config: Config, db: Knex): Promise<RunningServer> {
  const { app, ready, close: closeApp } = createApp({
    config,
    db,
    ...(config.mailIntervalMs ? { mailIntervalMs: config.mailIntervalMs } : {}),
    ...(config.supersessionIntervalMs ? { supersessionIntervalMs: config.supersessionIntervalMs } : {}),
    ...(config.reviewReminderIntervalMs ? { reviewReminderIntervalMs: config.reviewReminderIntervalMs } : {}),
  });
  await ready;
  const server = http.createServer(app);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.port, config.host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  const { address, port } = server.address() as AddressInfo;
  const host = address.includes(':') ? `[${address}]` : address;
  return {
    url: `http://${host}:${port}`,
    close: () =>
      new Promise<void>((resolve, reject) => {
        closeApp();
        server.close((err) => (err ? reject(err) : resolve()));
        // Idle keep-alive connections would hold close() open; requests in flight finish.
        server.closeIdleConnections();
        setTimeout(() => server.closeAllConnections(), 5000).unref();
      }),
  };
}
