/**
 * The API reference as an OpenAPI 3.1 document, generated from the route table: each
 * line's summary, access, path/query/body schemas (zod's own JSON Schema output, so the
 * document shows exactly what the router validates) and success answers, plus the shared
 * error envelope and the cookie session with its CSRF header.
 */
import { z } from 'zod';
import packageJson from '../../../package.json' with { type: 'json' };
import { API_ERROR_CODES } from '../../../shared/api-error';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { Access } from '../../../shared/roles';
import { CSRF_COOKIE } from '../csrf';
import type { Answer, RouteDefinition } from '../route-definition';
import { SESSION_COOKIE } from '../session-cookie';

type JsonSchema = Record<string, unknown>;

/** How request schemas become JSON Schema: as the client sends them (before defaults and transforms). */
export const REQUEST_SCHEMA_OPTIONS = { io: 'input', unrepresentable: 'any' } as const;

/** A request schema as JSON Schema 2020-12 (the dialect of OpenAPI 3.1), without the `$schema` line. */
export function requestJsonSchema(schema: z.ZodType): JsonSchema {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, REQUEST_SCHEMA_OPTIONS) as JsonSchema;
  return rest;
}

/** `/api/recipes/:id/versions/:n` → `/api/recipes/{id}/versions/{n}` */
export function openApiPath(routePath: string): string {
  return routePath.replace(/:(\w+)/g, '{$1}');
}

/** The names of a route path's parameters, in order. */
export function pathParamNames(routePath: string): string[] {
  return [...routePath.matchAll(/:(\w+)/g)].map((m) => m[1]!);
}

const ERROR_ENVELOPE = { $ref: '#/components/schemas/ApiError' };

const components = {
  schemas: {
    FieldError: {
      type: 'object',
      required: ['path', 'message'],
      properties: {
        path: { type: 'string', description: 'Dotted path of the field in the body or query, e.g. `roles.0`; empty for the request as a whole.' },
        message: { type: 'string', description: 'What is wrong, in plain words for a person.' },
      },
    },
    ApiError: {
      type: 'object',
      description: 'The error envelope every /api route answers with on failure. Some errors add members (e.g. `current` on a stale save).',
      required: ['code', 'errors'],
      properties: {
        code: { type: 'string', enum: [...API_ERROR_CODES], description: 'Stable machine-readable code; clients branch on it, never on messages.' },
        errors: { type: 'array', items: { $ref: '#/components/schemas/FieldError' } },
      },
    },
  },
  responses: {
    BadRequest: {
      description:
        'VALIDATION_FAILED: a part of the request does not match its schema (one entry per field); INVALID_JSON: the body is not JSON. Nothing was written.',
      content: { 'application/json': { schema: ERROR_ENVELOPE } },
    },
    NotSignedIn: {
      description: 'NOT_SIGNED_IN: no valid session.',
      content: { 'application/json': { schema: ERROR_ENVELOPE } },
    },
    Forbidden: {
      description:
        'FORBIDDEN: the roles do not allow it; PASSWORD_CHANGE_REQUIRED: a temporary password must be replaced first; CSRF_INVALID: a write without the current token.',
      content: { 'application/json': { schema: ERROR_ENVELOPE } },
    },
    Error: {
      description:
        'Any other refusal or fault, e.g. 404 NOT_FOUND, 409 CONFLICT or BLOCKERS, 413 PAYLOAD_TOO_LARGE, 415 UNSUPPORTED_MEDIA_TYPE, 429 TOO_MANY_ATTEMPTS, 500 INTERNAL, 503 DATABASE_UNAVAILABLE.',
      content: { 'application/json': { schema: ERROR_ENVELOPE } },
    },
  },
  securitySchemes: {
    session: {
      type: 'apiKey',
      in: 'cookie',
      name: SESSION_COOKIE,
      description: 'The session cookie set by POST /api/session (HttpOnly, SameSite=Strict).',
    },
    csrf: {
      type: 'apiKey',
      in: 'header',
      name: CSRF_HEADER,
      description: `Required on every POST, PUT, PATCH and DELETE, signed in or not: the token from GET /api/session/csrf or GET /api/session, which goes with the session and its ${CSRF_COOKIE} cookie.`,
    },
  },
};

function accessLine(access: Access): string {
  if (access === 'public') return 'Access: anyone, signed in or not.';
  if (access === 'signedIn') return 'Access: any signed-in person.';
  return `Access: people with the role ${access.join(' or ')}.`;
}

const STATUS_WORDS: Record<string, string> = {
  '200': 'OK',
  '201': 'Created',
  '202': 'Accepted',
  '204': 'No content.',
  '304': 'Not modified: the copy the client holds is current.',
};

const CONTENT: Record<string, Record<string, JsonSchema>> = {
  json: { 'application/json': {} },
  csv: { 'text/csv': { schema: { type: 'string' } } },
  pdf: { 'application/pdf': {} },
  image: { 'image/*': {} },
};

function successResponses(answers: Answer | readonly Answer[]): Record<string, JsonSchema> {
  const out: Record<string, JsonSchema> = {};
  for (const answer of typeof answers === 'string' ? [answers] : answers) {
    const match = /^(\d{3})(?: (\w+))?(?:: (.+))?$/.exec(answer);
    if (!match) throw new Error(`Cannot read the answer "${answer}".`);
    const [, status, kind, what] = match as unknown as [string, string, string | undefined, string | undefined];
    out[status] = {
      description: what ? what[0]!.toUpperCase() + what.slice(1) : (STATUS_WORDS[status] ?? status),
      ...(kind ? { content: CONTENT[kind] } : {}),
    };
  }
  return out;
}

function parameters(route: RouteDefinition): JsonSchema[] {
  const out: JsonSchema[] = [];
  const names = pathParamNames(route.path);
  if (names.length > 0 || route.params) {
    const schema = route.params ? requestJsonSchema(route.params) : {};
    const properties = (schema['properties'] ?? {}) as Record<string, JsonSchema>;
    const declared = Object.keys(properties).sort().join(',');
    if (declared !== [...names].sort().join(',')) {
      throw new Error(`${route.method.toUpperCase()} ${route.path}: the params schema declares [${declared}], the path has [${names.join(',')}].`);
    }
    for (const name of names) out.push({ name, in: 'path', required: true, schema: properties[name] });
  }
  if (route.query) {
    const schema = requestJsonSchema(route.query);
    const required = (schema['required'] ?? []) as string[];
    for (const [name, property] of Object.entries((schema['properties'] ?? {}) as Record<string, JsonSchema>)) {
      out.push({ name, in: 'query', required: required.includes(name), schema: property });
    }
  }
  return out;
}

/** The file part of a multipart form. */
const FILE_FIELD = { type: 'string', contentMediaType: 'application/octet-stream', description: 'The file (one), in the form field `file`.' };

function requestBody(route: RouteDefinition): JsonSchema | undefined {
  if (route.multipart) {
    const fields = route.body ? requestJsonSchema(route.body) : { type: 'object' };
    const schema = {
      ...fields,
      properties: { ...((fields['properties'] as JsonSchema | undefined) ?? {}), file: FILE_FIELD },
      required: [...((fields['required'] as string[] | undefined) ?? []), 'file'],
    };
    return { required: true, content: { 'multipart/form-data': { schema } } };
  }
  if (!route.body) return undefined;
  return { required: true, content: { 'application/json': { schema: requestJsonSchema(route.body) } } };
}

function operation(route: RouteDefinition): JsonSchema {
  const write = route.method !== 'get';
  const validates = Boolean(route.params || route.query || route.body || route.multipart);
  const notes = [accessLine(route.access)];
  if (route.whilePasswordChangeRequired) notes.push('Answers also while a temporary password waits to be replaced.');
  const params = parameters(route);
  const body = requestBody(route);
  const security = route.access === 'public' ? (write ? [{ csrf: [] }] : []) : [write ? { session: [], csrf: [] } : { session: [] }];
  return {
    tags: [tagOf(route.path)],
    summary: route.summary,
    description: notes.join('\n\n'),
    'x-kerfbook-access': route.access,
    ...(params.length > 0 ? { parameters: params } : {}),
    ...(body ? { requestBody: body } : {}),
    responses: {
      ...successResponses(route.answers),
      ...(validates || write ? { '400': { $ref: '#/components/responses/BadRequest' } } : {}),
      ...(route.access !== 'public' ? { '401': { $ref: '#/components/responses/NotSignedIn' } } : {}),
      ...(route.access !== 'public' || write ? { '403': { $ref: '#/components/responses/Forbidden' } } : {}),
      default: { $ref: '#/components/responses/Error' },
    },
    security,
  };
}

/** The first segment after /api, without a file extension: `/api/trail.csv` → `trail`. */
function tagOf(routePath: string): string {
  return (routePath.split('/')[2] ?? 'api').replace(/\.\w+$/, '');
}

const API_DESCRIPTION = [
  'The JSON API behind the Kerfbook app, generated from its route table: every route, who may call it, and the schemas its request is validated against (the same zod schemas the client uses).',
  `Sign in with POST /api/session; the session is a cookie. Every write (POST, PUT, PATCH, DELETE) also needs the CSRF token in the \`${CSRF_HEADER}\` header.`,
  'Failures answer the error envelope `{ code, errors: [{ path, message }] }`.',
].join('\n\n');

/** The whole document for a route table. */
export function buildOpenApiDocument(routes: readonly RouteDefinition[]): JsonSchema {
  const paths: Record<string, Record<string, JsonSchema>> = {};
  const tags: string[] = [];
  for (const route of routes) {
    const item = (paths[openApiPath(route.path)] ??= {});
    if (item[route.method]) throw new Error(`${route.method.toUpperCase()} ${route.path} appears twice in the route table.`);
    item[route.method] = operation(route);
    const tag = tagOf(route.path);
    if (!tags.includes(tag)) tags.push(tag);
  }
  return {
    openapi: '3.1.1',
    info: { title: 'Kerfbook API', version: packageJson.version, description: API_DESCRIPTION },
    tags: tags.map((name) => ({ name })),
    paths,
    components,
  };
}

const built = new WeakMap<readonly RouteDefinition[], JsonSchema>();

/** The document for a route table, generated once per process and table. */
export function openApiDocument(routes: readonly RouteDefinition[]): JsonSchema {
  let document = built.get(routes);
  if (!document) {
    document = buildOpenApiDocument(routes);
    built.set(routes, document);
  }
  return document;
}
