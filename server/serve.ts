/**
 * Starts the HTTP server once the session store is ready. Used by main.ts and the bootstrap,
 * which start the background jobs (jobs.ts) beside it.
 */
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
  const { app, ready } = createApp({ config, db });
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
        server.close((err) => (err ? reject(err) : resolve()));
        // Idle keep-alive connections would hold close() open; requests in flight finish.
        server.closeIdleConnections();
        setTimeout(() => server.closeAllConnections(), 5000).unref();
      }),
  };
}
