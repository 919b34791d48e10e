/**
 * The API reference against the route table and the handlers: every route is in the
 * document with its access, the document's schemas are zod's own JSON Schema of the
 * route's schemas, the document is valid OpenAPI 3.1, and — walking every route as someone
 * allowed to call it, with the validation recorder on — each request is validated with
 * exactly the schemas its line declares, nothing more and nothing else.
 */
import fs from 'node:fs';
import path from 'node:path';
import { Validator } from '@seriousme/openapi-schema-validator';
import { expect } from 'chai';
import { z } from 'zod';
import { API_ERROR_CODES } from '../../../shared/api-error';
import { ROLES } from '../../../shared/roles';
import { buildOpenApiDocument, openApiPath, REQUEST_SCHEMA_OPTIONS } from '../../../server/web/openapi/openapi-document';
import { REQUEST_PARTS, type RequestPart, type RouteDefinition } from '../../../server/web/route-definition';
import { routes } from '../../../server/web/routes';
import { startValidationRecording, type RecordedRequest } from '../../../server/web/validation-recorder';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { call, createTargets, label, type Targets } from '../support/route-walk';
import { anonymousAgent, signedInAgent } from '../support/test-app';

type Json = Record<string, unknown>;
type Operation = { parameters?: Json[]; requestBody?: { content: Record<string, { schema: Json }> }; 'x-kerfbook-access'?: unknown; summary?: string };

/** zod's JSON Schema of a request schema, computed here on its own (not through the generator). */
function zodJson(schema: z.ZodType): Json {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, REQUEST_SCHEMA_OPTIONS) as Json;
  return rest;
}

function operationOf(doc: Json, route: RouteDefinition): Operation | undefined {
  const paths = doc['paths'] as Record<string, Record<string, Operation>>;
  return paths[openApiPath(route.path)]?.[route.method];
}

/** The documented parameters of one kind (path or query) as `{ properties, required }`. */
function documentedParameters(op: Operation, where: 'path' | 'query'): { properties: Json; required: string[] } | undefined {
  const list = (op.parameters ?? []).filter((p) => p['in'] === where);
  if (list.length === 0) return undefined;
  return {
    properties: Object.fromEntries(list.map((p) => [p['name'] as string, p['schema']])),
    required: list
      .filter((p) => p['required'])
      .map((p) => p['name'] as string)
      .sort(),
  };
}

function declaredParameters(schema: z.ZodType, where: 'path' | 'query'): { properties: Json; required: string[] } {
  const json = zodJson(schema);
  const properties = (json['properties'] ?? {}) as Json;
  // Path parameters are always required in OpenAPI; the router's schema requires them too.
  const required = where === 'path' ? Object.keys(properties) : ((json['required'] ?? []) as string[]);
  return { properties, required: [...required].sort() };
}

/** The documented body schema; for a multipart form, without the file part the router does not validate. */
function documentedBody(op: Operation, route: RouteDefinition): Json | undefined {
  const content = op.requestBody?.content;
  if (!content) return undefined;
  if (route.multipart) {
    const { properties, required, ...rest } = content['multipart/form-data']!.schema as { properties: Json; required: string[] };
    const { file: _file, ...fields } = properties;
    const fieldRequired = required.filter((name) => name !== 'file');
    return { ...rest, properties: fields, ...(fieldRequired.length > 0 ? { required: fieldRequired } : {}) };
  }
  expect(Object.keys(content), label(route)).to.deep.equal(['application/json']);
  return content['application/json']!.schema;
}

describe('API reference (OpenAPI document)', () => {
  const ctx = apiTestContext();
  const doc = buildOpenApiDocument(routes);

  it('is served at GET /api/openapi.json to signed-in people only, as generated from the route table', async () => {
    const anonymous = await anonymousAgent(ctx.app);
    const refused = await anonymous.agent.get('/api/openapi.json');
    expect(refused.status).to.equal(401);

    const person = await createPerson(ctx.db, { roles: ['operator'] });
    const { agent } = await signedInAgent(ctx.app, person);
    const res = await agent.get('/api/openapi.json').expect(200);
    expect(res.type).to.equal('application/json');
    expect(res.body).to.deep.equal(JSON.parse(JSON.stringify(doc)));
  });

  it('is a valid OpenAPI 3.1 document', async () => {
    const validator = new Validator();
    const result = await validator.validate(structuredClone(doc));
    expect(result.errors ?? [], 'validation errors').to.deep.equal([]);
    expect(result.valid).to.equal(true);
    expect(validator.version).to.equal('3.1');
  });

  it('documents every route of the table, with its summary and access, and nothing else', () => {
    const documented: string[] = [];
    for (const [p, item] of Object.entries(doc['paths'] as Record<string, Record<string, unknown>>)) {
      for (const method of Object.keys(item)) documented.push(`${method.toUpperCase()} ${p}`);
    }
    const table = routes.map((r) => `${r.method.toUpperCase()} ${openApiPath(r.path)}`);
    expect([...documented].sort()).to.deep.equal([...table].sort());
    for (const route of routes) {
      const op = operationOf(doc, route)!;
      expect(op.summary, label(route)).to.equal(route.summary);
      expect(op['x-kerfbook-access'], label(route)).to.deep.equal(route.access);
    }
    for (const known of ['GET /api/recipes', 'GET /api/openapi.json', 'POST /api/recipes/{id}/versions/{n}/attachments', 'GET /api/dev/outbox']) {
      expect(documented, known).to.include(known);
    }
  });

  it("documents each route's path, query and body exactly as zod's JSON Schema of the route's schemas", () => {
    for (const route of routes) {
      const op = operationOf(doc, route)!;
      const params = documentedParameters(op, 'path');
      if (route.params) expect(params, `${label(route)} path`).to.deep.equal(declaredParameters(route.params, 'path'));
      else expect(params, `${label(route)} has path parameters but no params schema`).to.equal(undefined);

      const query = documentedParameters(op, 'query');
      if (route.query) expect(query, `${label(route)} query`).to.deep.equal(declaredParameters(route.query, 'query'));
      else expect(query, `${label(route)} query`).to.equal(undefined);

      const body = documentedBody(op, route);
      if (route.body) expect(body, `${label(route)} body`).to.deep.equal(zodJson(route.body));
      else expect(body, `${label(route)} body`).to.equal(undefined);
    }
  });

  it('shares one error envelope whose codes are ApiErrorCode, and describes the session cookie and CSRF header', () => {
    const components = doc['components'] as { schemas: Record<string, Json>; securitySchemes: Record<string, Json> };
    const envelope = components.schemas['ApiError'] as { required: string[]; properties: { code: { enum: string[] } } };
    expect(envelope.required).to.deep.equal(['code', 'errors']);
    expect(envelope.properties.code.enum).to.deep.equal([...API_ERROR_CODES]);
    expect(components.securitySchemes['session']).to.include({ type: 'apiKey', in: 'cookie' });
    expect(components.securitySchemes['csrf']).to.include({ type: 'apiKey', in: 'header', name: 'x-csrf-token' });
    for (const route of routes) {
      const op = operationOf(doc, route) as { security: Json[] };
      const schemes = op.security.flatMap((s) => Object.keys(s)).sort();
      const expected = [...(route.access === 'public' ? [] : ['session']), ...(route.method === 'get' ? [] : ['csrf'])].sort();
      expect(schemes, label(route)).to.deep.equal(expected);
    }
  });

  it('leaves validation to the router: no handler imports zod or a schema at run time, or parses by itself', () => {
    const dir = path.resolve(import.meta.dirname, '../../../server/web/handlers');
    for (const file of fs.readdirSync(dir).filter((f) => f.endsWith('.ts'))) {
      const source = fs.readFileSync(path.join(dir, file), 'utf8');
      expect(source, `${file} imports zod or a schema for use at run time`).not.to.match(/^import (?!type\b)[^;]*from '(zod|[^']*\/schemas\/[^']*)';/m);
      expect(source, `${file} parses by itself`).not.to.match(/\.(safeParse|parse|parseAsync|safeParseAsync)\(/);
    }
  });

  describe('what the handlers validate, walking every route as someone allowed to call it', () => {
    let targets: Targets;
    let recorded: RecordedRequest[] = [];

    before(async function () {
      // About a hundred requests, some of them slow on purpose (sign-in, forgotten password).
      this.timeout(180000);
      targets = await createTargets(ctx.db);
      const person = await createPerson(ctx.db, { roles: [...ROLES] });
      const recording = startValidationRecording();
      try {
        let session = await signedInAgent(ctx.app, person);
        for (const route of routes) {
          await call(session.agent, route, targets, session.csrf);
          // Sign-out and sign-in end or renew the session: start again if so.
          const still = await session.agent.get('/api/session');
          if (still.status !== 200) session = await signedInAgent(ctx.app, person);
          else session.csrf = still.body.csrfToken;
        }
      } finally {
        recording.stop();
      }
      recorded = recording.requests;
    });

    it('validated every part each route declares with its declared schema, and no other part or schema', () => {
      const problems: string[] = [];
      for (const route of routes) {
        const requests = recorded.filter((r) => r.method === route.method && r.routePath === route.path);
        if (requests.length === 0) {
          problems.push(`${label(route)}: never reached its validation`);
          continue;
        }
        const declared = REQUEST_PARTS.filter((part) => route[part]);
        const applied = new Set<RequestPart>();
        for (const request of requests) {
          const parts = request.applied.map((a) => a.part);
          if (new Set(parts).size !== parts.length) problems.push(`${label(route)}: a part validated twice (${parts.join(', ')})`);
          for (const { part, schema } of request.applied) {
            applied.add(part);
            if (!route[part]) problems.push(`${label(route)}: validates its ${part}, which the route table does not declare`);
            else if (schema !== route[part]) problems.push(`${label(route)}: validates its ${part} with a schema other than the declared one`);
          }
        }
        for (const part of declared) if (!applied.has(part)) problems.push(`${label(route)}: declares a ${part} schema it never applied`);
      }
      expect(problems).to.deep.equal([]);
    });

    it('records nothing once recording is off', async () => {
      const before = recorded.length;
      const { agent } = await anonymousAgent(ctx.app);
      await agent.get('/api/health').expect(200);
      expect(recorded.length).to.equal(before);
    });
  });
});
