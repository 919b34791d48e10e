/**
 * A small reverse proxy on loopback for the several-processes test: it hands requests to
 * the backends in turn (round robin, no stickiness) and names the one that answered in a
 * response header, so a test can prove that both were used.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import httpProxy from 'http-proxy';

/** The response header naming the backend that answered. */
export const BACKEND_HEADER = 'x-kerfbook-backend';

export interface Backend {
  name: string;
  /** e.g. http://127.0.0.1:41234 */
  url: string;
}

export interface RoundRobinProxy {
  url: string;
  close(): Promise<void>;
}

export async function startRoundRobinProxy(backends: readonly Backend[]): Promise<RoundRobinProxy> {
  if (backends.length === 0) throw new Error('The proxy needs at least one backend.');
  // xfwd: X-Forwarded-For/-Proto/-Host, as a real proxy sends them (the apps run with TRUST_PROXY=1).
  const proxy = httpProxy.createProxyServer({ xfwd: true });
  proxy.on('proxyRes', (proxyRes, req) => {
    // Emitted before the answer's headers are copied to the client.
    proxyRes.headers[BACKEND_HEADER] = (req as http.IncomingMessage & { backend?: string }).backend ?? '';
  });
  proxy.on('error', (err, _req, res) => {
    const out = res as http.ServerResponse;
    if (!out.headersSent && typeof out.writeHead === 'function') out.writeHead(502, { 'content-type': 'text/plain' });
    out.end(`proxy: ${err.message}`);
  });

  let next = 0;
  const server = http.createServer((req, res) => {
    const backend = backends[next % backends.length]!;
    next += 1;
    (req as http.IncomingMessage & { backend?: string }).backend = backend.name;
    proxy.web(req, res, { target: backend.url });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise<void>((resolve) => {
        proxy.close();
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
