import helmet from 'helmet';
import type { RequestHandler } from 'express';

/**
 * helmet with a CSP the built Angular app satisfies: no external hosts, no inline
 * scripts. Inline styles are allowed because Angular adds component <style> elements
 * at run time. No upgrade-insecure-requests: plain http on loopback must keep working.
 */
export function securityHeaders(options: { behindTls: boolean }): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        fontSrc: ["'self'", 'data:'],
        imgSrc: ["'self'", 'data:', 'blob:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
      },
    },
    // HSTS only means something when the site is served over TLS (via a proxy).
    strictTransportSecurity: options.behindTls,
    // Matches frame-ancestors 'none' for browsers that only read the older header.
    xFrameOptions: { action: 'deny' },
  });
}
