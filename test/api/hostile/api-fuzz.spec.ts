/**
 * API fuzzer: every line of the real route table (server/web/routes.ts), called
 * anonymously and by a person with each single role, with random and malformed bodies,
 * wrong content types, odd query strings, odd headers and odd path values (fast-check).
 * Whatever arrives: never a 5xx; every error is the documented `{ code, errors }` with no
 * stack or SQL in it; nothing leaks onto Object.prototype; and a caller whose requests to
 * a route were all refused, or who only read, has written nothing (a checksum of every
 * table and the trail head, before and after each caller's batch).
 *
 * Bounded: RUNS requests per route and caller (the first a plain hostile JSON body with a
 * valid token, so every handler is reached): about 3,000 requests in all.
 */
import { expect } from 'chai';
import fc from 'fast-check';
import type { Response } from 'supertest';
import { CSRF_HEADER } from '../../../shared/api-types';
import { ROLES, type Role } from '../../../shared/roles';
import { routes } from '../../../server/web/routes';
import type { RouteDefinition } from '../../../server/web/route-definition';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { anonymousAgent, signedInAgent, type Agent } from '../support/test-app';
import { machineInput, materialInput, recipeInput, wheelInput, type StockSet } from '../support/stock';
import { changedTables, dbFingerprint } from '../support/db-fingerprint';
import { createTargets, label, pathFor, pathWithParams, recordHandlerCalls, type Targets } from '../support/route-walk';
import { contentType, hostileJson, hostileLeaf, oddHeaders, oddPathValue, POLLUTION_KEYS, queryString, rawJsonPayload } from './hostile-input';

const RUNS = 5;

type Caller = 'anonymous' | Role;
const CALLERS: readonly Caller[] = ['anonymous', ...ROLES];

/**
 * Refusals that are themselves recorded, by design: a wrong password counts towards the
 * sign-in limit and is written to the trail (server/services/auth/sign-in.ts).
 */
const RECORDED_REFUSALS: Record<string, number[]> = { 'POST /api/session': [401] };

/** Stack frames, source paths and database error text (OWASP Error Handling Cheat Sheet: no internals in answers). */
const LEAKS: RegExp[] = [
  /\n\s+at\s/,
  /\bat\s+\S+\s+\(\S+:\d+:\d+\)/,
  /node_modules|\/work\/|\.ts:\d+/,
  /\bER_[A-Z_]{3,}\b/,
  /sqlMessage|sqlState|errno/i,
  /\bfrom\s+`\w+`/i,
  /"stack"\s*:/,
];

interface HostileRequest {
  body: { kind: 'none' } | { kind: 'json'; value: unknown } | { kind: 'raw'; type: string; payload: string | Buffer };
  query: string | null;
  headers: Record<string, string>;
  /** Replace this path parameter by an odd value. */
  param: { name: string; value: string } | null;
  csrf: 'valid' | 'missing' | 'garbage';
}

/** Valid bodies for some routes: one leaf replaced by a hostile value reaches the deeper checks. */
function validBodies(t: Targets, author: TestPerson): Record<string, object> {
  const stock = {
    material: { id: t.material, group: 'plain-low-alloy-steel' },
    wheel: { id: t.wheel },
    machine: { id: t.machine },
  } as unknown as StockSet;
  return {
    'POST /api/session': { username: 'nobody.here', password: 'not the password' },
    'PATCH /api/session/preferences': { units: 'metric' },
    'POST /api/users': { username: 'fuzz.person', displayName: 'Fuzz Person', roles: ['operator'], temporaryPassword: 'long enough password' },
    'PATCH /api/users/:id': { displayName: 'Renamed', roles: ['operator'] },
    'POST /api/materials': materialInput(),
    'PUT /api/materials/:id': materialInput(),
    'POST /api/wheels': wheelInput(),
    'PUT /api/wheels/:id': wheelInput(),
    'POST /api/machines': machineInput(),
    'PUT /api/machines/:id': machineInput(),
    'POST /api/recipes': recipeInput(stock),
    'PUT /api/recipes/:id/versions/:n': { revision: 1, ...recipeInput(stock) },
    'POST /api/recipes/:id/versions/:n/comments': { body: 'Looks fine.' },
    'POST /api/recipes/:id/versions/:n/cuts': { specimenId: 'S-1', partRef: '', quantity: 1, outcome: 'good', notes: '' },
    'POST /api/password/forgot': { username: author.username },
  };
}

/** Every leaf of a JSON object with its path. */
function leafPaths(value: unknown, path: (string | number)[] = []): (string | number)[][] {
  if (value && typeof value === 'object') {
    const entries = Array.isArray(value) ? value.map((v, i) => [i, v] as const) : Object.entries(value);
    if (entries.length === 0) return [path];
    return entries.flatMap(([k, v]) => leafPaths(v, [...path, k]));
  }
  return [path];
}

function replaced(value: unknown, path: (string | number)[], leaf: unknown): unknown {
  if (path.length === 0) return leaf;
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<string | number, unknown>;
  copy[path[0]!] = replaced(copy[path[0]!], path.slice(1), leaf);
  return copy;
}

/** The valid body with one leaf hostile, or with a polluting key added beside the fields. */
function mutationsOf(valid: object): fc.Arbitrary<unknown> {
  const paths = leafPaths(valid);
  return fc.oneof(
    fc.tuple(fc.nat(paths.length - 1), hostileLeaf).map(([i, leaf]) => replaced(valid, paths[i]!, leaf)),
    fc
      .tuple(fc.constantFrom(...POLLUTION_KEYS), hostileLeaf)
      .map(([key, leaf]) => JSON.parse(JSON.stringify(valid).replace(/^\{/, `{${JSON.stringify(key)}:${JSON.stringify(leaf) ?? 'null'},`))),
  );
}

function hostileRequest(route: RouteDefinition, valid: object | undefined): fc.Arbitrary<HostileRequest> {
  const bodies: fc.WeightedArbitrary<HostileRequest['body']>[] = [
    { weight: 4, arbitrary: hostileJson.map((value) => ({ kind: 'json' as const, value })) },
    { weight: 2, arbitrary: fc.record({ kind: fc.constant('raw' as const), type: contentType, payload: rawJsonPayload }) },
  ];
  if (valid) bodies.push({ weight: 3, arbitrary: mutationsOf(valid).map((value) => ({ kind: 'json' as const, value })) });
  if (route.method === 'get' || route.method === 'delete') bodies.push({ weight: 3, arbitrary: fc.constant({ kind: 'none' as const }) });
  const params = [...route.path.matchAll(/:(\w+)/g)].map((m) => m[1]!);
  return fc.record({
    body: fc.oneof(...bodies),
    query: fc.option(queryString, { freq: 2 }),
    headers: fc.oneof({ weight: 3, arbitrary: fc.constant({}) }, { weight: 1, arbitrary: oddHeaders }),
    param: params.length === 0 ? fc.constant(null) : fc.option(fc.record({ name: fc.constantFrom(...params), value: oddPathValue }), { freq: 3 }),
    csrf: fc.constantFrom<HostileRequest['csrf']>('valid', 'valid', 'valid', 'valid', 'valid', 'missing', 'garbage'),
  });
}

/** The first request of every batch: a plain hostile JSON body on the walk path with a valid token. */
const PLAIN: HostileRequest = {
  body: { kind: 'json', value: JSON.parse('{"__proto__":1,"name":["x"],"revision":"1"}') },
  query: null,
  headers: {},
  param: null,
  csrf: 'valid',
};

function send(agent: Agent, csrf: string, route: RouteDefinition, t: Targets, r: HostileRequest) {
  let path = pathFor(route, t);
  if (r.param) {
    const walk = pathFor(route, t).split('/');
    const odd = pathWithParams(route, (name) => (name === r.param!.name ? r.param!.value : ''));
    // Keep the walk's values for the other parameters.
    path = odd
      .split('/')
      .map((part, i) => (part === '' && i > 0 ? walk[i] : part))
      .join('/');
  }
  if (r.query !== null) path += `?${r.query}`;
  const req = agent[route.method](path);
  if (r.csrf === 'valid') req.set(CSRF_HEADER, csrf);
  if (r.csrf === 'garbage') req.set(CSRF_HEADER, 'not-a-token');
  req.set(r.headers);
  if (r.body.kind === 'json') return req.set('Content-Type', 'application/json').send(JSON.stringify(r.body.value) ?? 'null');
  if (r.body.kind === 'raw') {
    if (r.body.type) req.set('Content-Type', r.body.type);
    // As it is: superagent would otherwise turn a Buffer sent as JSON into JSON text.
    return req.serialize((payload: unknown) => payload as string).send(r.body.payload);
  }
  return req;
}

function describeRequest(route: RouteDefinition, caller: Caller, r: HostileRequest): string {
  const body = r.body.kind === 'none' ? '' : r.body.kind === 'json' ? JSON.stringify(r.body.value) : `${r.body.type}: ${String(r.body.payload)}`;
  return `${label(route)} as ${caller}: ${JSON.stringify({ ...r, body: body.slice(0, 200) })}`;
}

/** No 5xx; errors in the documented shape without internals. */
function expectSafeAnswer(res: Response, what: string): void {
  expect(res.status, `${what} → ${res.status} ${res.text?.slice(0, 300)}`).to.be.below(500);
  if (res.status < 400) return;
  expect(res.headers['content-type'], what).to.match(/^application\/json/);
  const body = res.body as { code?: unknown; errors?: unknown };
  expect(body.code, what)
    .to.be.a('string')
    .and.match(/^[A-Z_]+$/);
  expect(body.errors, what).to.be.an('array').that.is.not.empty;
  for (const e of body.errors as { path?: unknown; message?: unknown }[]) {
    expect(e.path, what).to.be.a('string');
    expect(e.message, what).to.be.a('string').and.not.equal('');
  }
  for (const leak of LEAKS) expect(res.text, `${what}: ${leak}`).not.to.match(leak);
}

/** Object.prototype's own names when the fuzzing starts (taken in `before`: other files' libraries may add to it earlier). */
let prototypeNames: string[] = [];

function expectNoPollution(what: string): void {
  expect(Object.getOwnPropertyNames(Object.prototype).sort(), what).to.deep.equal(prototypeNames);
  const probe = {} as Record<string, unknown>;
  expect([probe['polluted'], probe['isAdmin']], what).to.deep.equal([undefined, undefined]);
  expect(Array.isArray(({} as { roles?: unknown }).roles), what).to.equal(false);
}

describe('API fuzzer: every route, every role, hostile input', function () {
  this.timeout(120_000);
  const ctx = apiTestContext();
  let targets: Targets;
  let valid: Record<string, object>;
  const people = new Map<Role, TestPerson>();
  const agents = new Map<Caller, { agent: Agent; csrf: string }>();
  let recorder: ReturnType<typeof recordHandlerCalls>;

  async function signIn(caller: Caller): Promise<void> {
    agents.set(caller, caller === 'anonymous' ? await anonymousAgent(ctx.app) : await signedInAgent(ctx.app, people.get(caller)!));
  }

  /** A fuzzed sign-out or password change ends the session: start the next batch signed in again. */
  async function keepSignedIn(caller: Caller): Promise<void> {
    const { agent } = agents.get(caller)!;
    const res = await agent.get(caller === 'anonymous' ? '/api/session/csrf' : '/api/session');
    if (res.status === 200) agents.get(caller)!.csrf = res.body.csrfToken;
    else await signIn(caller);
  }

  before(async () => {
    // The targets first: their person is user 1, the only person an odd path value can name (hostile-input.ts).
    targets = await createTargets(ctx.db);
    for (const role of ROLES) people.set(role, await createPerson(ctx.db, { roles: [role] }));
    for (const caller of CALLERS) await signIn(caller);
    valid = validBodies(targets, people.get('author')!);
    recorder = recordHandlerCalls(routes);
    prototypeNames = Object.getOwnPropertyNames(Object.prototype).sort();
  });
  after(() => recorder.restore());

  /** Routes where at least one caller's batch was compared before and after (only refusals, or a read). */
  const compared = new Set<string>();

  for (const route of routes) {
    it(`${label(route)}: no 5xx, the documented error shape, nothing written when refused`, async () => {
      for (const caller of CALLERS) {
        const before = await dbFingerprint(ctx.db);
        let onlyRefusals = true;
        await fc.assert(
          fc.asyncProperty(hostileRequest(route, valid[label(route)]), async (r) => {
            const { agent, csrf } = agents.get(caller)!;
            const what = describeRequest(route, caller, r);
            const res = await send(agent, csrf, route, targets, r);
            expectSafeAnswer(res, what);
            expectNoPollution(what);
            if (res.status < 400 || RECORDED_REFUSALS[label(route)]?.includes(res.status)) onlyRefusals = false;
          }),
          { numRuns: RUNS, examples: [[PLAIN]], endOnFailure: true },
        );
        // A read never writes, whatever it answers; any other route writes nothing when it only refused.
        if (onlyRefusals || route.method === 'get') {
          const after = await dbFingerprint(ctx.db);
          expect(
            changedTables(before, after),
            `${label(route)} as ${caller}: ${onlyRefusals ? 'only refusals' : 'a read'}, yet these tables changed`,
          ).to.deep.equal([]);
          compared.add(label(route));
        }
        // After the comparison: signing in again is itself recorded.
        await keepSignedIn(caller);
      }
    });
  }

  it('compared the database around at least one caller of every non-public route', () => {
    const missed = routes
      .filter((r) => r.access !== 'public')
      .map(label)
      .filter((line) => !compared.has(line));
    expect(missed).to.deep.equal([]);
  });

  it('got through to the handler of every route (the fuzz reached past access and parsing)', () => {
    const missed = routes.map(label).filter((line) => !recorder.reached.has(line));
    expect(missed).to.deep.equal([]);
  });
});
