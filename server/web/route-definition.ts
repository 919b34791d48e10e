import type { Request, Response } from 'express';
import type { Knex } from 'knex';
import type { z } from 'zod';
import type { Access } from '../../shared/roles';
import type { MailSettings } from '../services/mail/settings';
import type { SealSettings } from '../services/trail/seals';
import type { Authenticator } from './authentication';
import type { Csrf } from './csrf';

/** What handlers may use besides the request: handed in by the app, never imported globally. */
export interface RouteContext {
  db: Knex;
  csrf: Csrf;
  auth: Authenticator;
  /** Where links in mails point (APP_BASE_URL). */
  mail: MailSettings;
  /** Where seals of the trail go (SEAL_DIR) and how their mails link. */
  seals: SealSettings;
  /** Warnings from start-up that the admins' Today shows (e.g. APP_BASE_URL unset). */
  adminNotices: readonly string[];
  /** True outside production: the development outbox answers. */
  devOutbox: boolean;
  /** The route table this router serves (the API reference describes it). */
  routes: readonly RouteDefinition[];
}

/** The parts of a request a route may declare a schema for. */
export const REQUEST_PARTS = ['params', 'query', 'body'] as const;
export type RequestPart = (typeof REQUEST_PARTS)[number];

/** A route's declared schemas, one per request part it reads. */
export type RouteSchemas = { readonly [P in RequestPart]?: z.ZodType };

/** What the router hands a handler: each declared part, parsed by its schema. */
export type RouteInput<S extends RouteSchemas> = { [P in keyof S]: S[P] extends z.ZodType ? z.output<S[P]> : never };

/**
 * A handler. `S` names the schemas its route line declares (e.g.
 * `{ params: typeof versionParams; body: typeof saveDraftBody }`); routes.ts checks at
 * compile time that every line declares what its handler reads.
 */
export type RouteHandler<S extends RouteSchemas = Record<never, never>> = (
  req: Request,
  res: Response,
  ctx: RouteContext,
  input: RouteInput<S>,
) => Promise<void> | void;

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** How a route's body answers when it succeeds (errors always use the error envelope). */
export type AnswerKind = 'json' | 'csv' | 'pdf' | 'image';
type SuccessStatus = 200 | 201 | 202;
/**
 * A success answer in a few words: status, kind of body and, after a colon, what it is —
 * e.g. `'201 json: the new recipe (RecipeVersionDto)'`; `'204'` has no body, `'304'` is
 * "not modified" for a conditional GET.
 */
export type Answer = `${SuccessStatus} ${AnswerKind}` | `${SuccessStatus} ${AnswerKind}: ${string}` | '204' | '304';

export interface RouteDefinition extends RouteSchemas {
  method: HttpMethod;
  /** Full path, starting with /api. */
  path: string;
  /** What it does, in one line of plain words (the API reference shows it). */
  summary: string;
  /** Who may call it (shared/roles.ts). */
  access: Access;
  /** Its success answers; the first is the usual one. */
  answers: Answer | readonly Answer[];
  /**
   * Receives the declared parts of the request, already validated by the router. Typed
   * loosely here (`never` accepts every handler); routes.ts checks each line's input.
   */
  handler: (req: Request, res: Response, ctx: RouteContext, input: never) => Promise<void> | void;
  /**
   * Still answers for someone who must first replace a temporary password (the session
   * and password routes); every other non-public route then answers 403
   * PASSWORD_CHANGE_REQUIRED.
   */
  whilePasswordChangeRequired?: true;
  /**
   * Takes a multipart form with one file in the field `file` (read after the access
   * check) instead of JSON; `body` then declares the form's text fields.
   */
  multipart?: true;
}

/**
 * The path of each line of a route table whose handler reads input the line does not
 * declare (or declares with another type); `never` when every line fits.
 */
export type UndeclaredInput<R> = R extends { path: infer P; handler: infer H }
  ? H extends RouteHandler<{ [K in keyof R & RequestPart]: R[K] extends z.ZodType ? R[K] : never }>
    ? never
    : P
  : never;
