import type { Request, Response } from 'express';
import type { Knex } from 'knex';
import type { Access } from '../../shared/roles';
import type { MailSettings } from '../services/mail/settings';
import type { Authenticator } from './authentication';
import type { Csrf } from './csrf';

/** What handlers may use besides the request: handed in by the app, never imported globally. */
export interface RouteContext {
  db: Knex;
  csrf: Csrf;
  auth: Authenticator;
  /** Where links in mails point (APP_BASE_URL). */
  mail: MailSettings;
  /** True outside production: the development outbox answers. */
  devOutbox: boolean;
}

export type RouteHandler = (req: Request, res: Response, ctx: RouteContext) => Promise<void> | void;

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteDefinition {
  method: HttpMethod;
  /** Full path, starting with /api. */
  path: string;
  /** Who may call it (shared/roles.ts). */
  access: Access;
  handler: RouteHandler;
  /**
   * Still answers for someone who must first replace a temporary password (the session
   * and password routes); every other non-public route then answers 403
   * PASSWORD_CHANGE_REQUIRED.
   */
  whilePasswordChangeRequired?: true;
  /** Takes a multipart form with one file (read after the access check) instead of JSON. */
  multipart?: true;
}
