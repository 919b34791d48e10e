/**
 * Builds the Express app; only serve.ts listens, and the background jobs start from
 * jobs.ts. Building it starts nothing: tests import createApp and drive it with supertest.
 */
import express, { type Express, type Router } from 'express';
import compression from 'compression';
import cookieParser from 'cookie-parser';
import type { Knex } from 'knex';
import { publicAddressWarning, sealDirOf, type Config } from './config';
import { createAuthenticator } from './web/authentication';
import { jsonBody, jsonContentTypeOnly } from './web/body-parsing';
import { createCsrf } from './web/csrf';
import { pathMatcher } from './web/multipart';
import { apiNotFound, errorHandler } from './web/error-handler';
import { buildRouter } from './web/router';
import { routes } from './web/routes';
import { securityHeaders } from './web/security-headers';
import { sessionMiddleware } from './web/session-cookie';
import { SessionStore } from './web/session-store';
import { spa } from './web/spa';
import { mailSettingsOf } from './services/mail/settings';

export interface AppDeps {
  config: Config;
  db: Knex;
  /**
   * Extra API routes mounted after the route table and before the JSON 404, behind the
   * same session, CSRF and error handling. For tests (e.g. to provoke a fault); the real
   * app passes nothing.
   */
  extraApiRouter?: Router;
  /** Where server faults are logged. Default console.error. */
  log?: (...args: unknown[]) => void;
}

export interface KerfbookApp {
  app: Express;
  /** Resolves when the session store has checked its table; listen only after it. */
  ready: Promise<void>;
}

/** Turns the TRUST_PROXY text into Express's `trust proxy` value. */
export function trustProxyValue(setting: string | false): boolean | number | string {
  if (setting === false) return false;
  if (setting === 'true') return true;
  if (/^\d+$/.test(setting)) return Number(setting);
  return setting;
}

const noStore: express.RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};

export function createApp(deps: AppDeps): KerfbookApp {
  const { config, db } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', trustProxyValue(config.trustProxy));

  const store = new SessionStore(db);
  const csrf = createCsrf(config.sessionSecret);
  const auth = createAuthenticator(db);

  app.use(securityHeaders({ behindTls: config.trustProxy !== false }));
  // gzip for the app's scripts, styles and JSON answers (a fifth of the bytes); PDFs, images and fonts are sent as they are.
  app.use(compression());

  // Order matters: body → session → passport (who) → CSRF → per-route access → handler.
  // Multipart forms (uploads) pass the body check and are read by their route, after access.
  // CSRF before access, so a forged request never learns more than 403; access then
  // answers 401/403 for requests that carry a valid token.
  const multipartPaths = routes.filter((r) => r.multipart).map((r) => pathMatcher(r.path));
  // API answers name people and hold unreleased recipes: no cache keeps them (a route that
  // serves unchanging bytes, such as a photo, sets its own caching).
  app.use('/api', noStore);
  app.use('/api', jsonContentTypeOnly(multipartPaths), jsonBody, cookieParser(), sessionMiddleware(store, config.sessionSecret));
  app.use('/api', auth.initialize(), auth.session());
  app.use('/api', csrf.protect);
  const mail = mailSettingsOf(config);
  const warning = publicAddressWarning(config);
  app.use(
    buildRouter(routes, {
      db,
      csrf,
      auth,
      mail,
      seals: { dir: sealDirOf(config), mail },
      adminNotices: warning ? [warning] : [],
      devOutbox: !config.production,
    }),
  );
  if (deps.extraApiRouter) app.use('/api', deps.extraApiRouter);
  app.use('/api', apiNotFound);

  app.use(spa(config.distDir));
  app.use(errorHandler(deps.log));

  return { app, ready: store.ready.then(() => undefined) };
}
