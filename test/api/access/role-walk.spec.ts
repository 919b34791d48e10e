/**
 * Walks the real route table: every route is tried anonymously, with each single role,
 * and by someone who must change a temporary password. A new line in routes.ts is
 * covered without touching this file.
 */
import { expect } from 'chai';
import { ROLES, hasAccess } from '../../../shared/roles';
import { routes } from '../../../server/web/routes';
import { isValidAccess } from '../../../server/web/access';
import { buildRouter } from '../../../server/web/router';
import type { RouteContext, RouteDefinition } from '../../../server/web/route-definition';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { anonymousAgent, signedInAgent } from '../support/test-app';
import { call, createTargets, label, recordHandlerCalls, type Targets } from '../support/route-walk';

describe('Route table access', () => {
  const ctx = apiTestContext();
  let targets: Targets;
  // Which table lines reached their handler during this walk (checked by the last test).
  let recorder: ReturnType<typeof recordHandlerCalls>;

  before(async () => {
    targets = await createTargets(ctx.db);
    recorder = recordHandlerCalls(routes);
  });
  after(() => recorder.restore());

  it('declares a valid access on every route', () => {
    expect(routes.length).to.be.greaterThan(0);
    for (const route of routes) {
      expect(isValidAccess(route.access), `${label(route)} has no valid access`).to.equal(true);
    }
  });

  it('refuses to build a router from a route without access', () => {
    const broken = [{ method: 'get', path: '/api/x', handler: () => undefined }] as unknown as RouteDefinition[];
    expect(() => buildRouter(broken, {} as RouteContext)).to.throw(/no valid access/);
    const empty = [{ method: 'get', path: '/api/x', access: [], handler: () => undefined }] as unknown as RouteDefinition[];
    expect(() => buildRouter(empty, {} as RouteContext)).to.throw(/no valid access/);
    expect(() => buildRouter(routes, {} as RouteContext)).not.to.throw();
  });

  it('answers 401 NOT_SIGNED_IN to anonymous callers (with a valid token) on every non-public route', async () => {
    const { agent, csrf } = await anonymousAgent(ctx.app);
    for (const route of routes) {
      const res = await call(agent, route, targets, csrf);
      if (route.access === 'public') {
        expect(res.status, label(route)).to.not.be.oneOf([401, 403]);
      } else {
        expect(res.status, label(route)).to.equal(401);
        expect(res.body.code, label(route)).to.equal('NOT_SIGNED_IN');
      }
    }
  });

  for (const role of ROLES) {
    it(`lets a person with only the ${role} role call exactly the routes that allow it`, async () => {
      const person = await createPerson(ctx.db, { roles: [role] });
      let session = await signedInAgent(ctx.app, person);
      for (const route of routes) {
        const res = await call(session.agent, route, targets, session.csrf);
        if (hasAccess([role], route.access)) {
          expect(res.status, `${label(route)} as ${role}: ${JSON.stringify(res.body)}`).to.not.be.oneOf([401, 403]);
        } else {
          expect(res.status, `${label(route)} as ${role}`).to.equal(403);
          expect(res.body.code, label(route)).to.equal('FORBIDDEN');
        }
        // Some routes end or renew the session (sign-out, sign-in): start again if so.
        const still = await session.agent.get('/api/session');
        if (still.status !== 200) session = await signedInAgent(ctx.app, person);
        else session.csrf = still.body.csrfToken;
      }
    });
  }

  it('answers 403 PASSWORD_CHANGE_REQUIRED on every other non-public route while a temporary password is pending', async () => {
    const person = await createPerson(ctx.db, { roles: [...ROLES], mustChangePassword: true });
    let session = await signedInAgent(ctx.app, person);
    for (const route of routes) {
      const res = await call(session.agent, route, targets, session.csrf);
      if (route.access === 'public' || route.whilePasswordChangeRequired) {
        expect(res.status, `${label(route)}: ${JSON.stringify(res.body)}`).to.not.be.oneOf([401, 403]);
      } else {
        expect(res.status, label(route)).to.equal(403);
        expect(res.body.code, label(route)).to.equal('PASSWORD_CHANGE_REQUIRED');
      }
      const still = await session.agent.get('/api/session');
      if (still.status !== 200) session = await signedInAgent(ctx.app, person);
      else session.csrf = still.body.csrfToken;
    }
  });

  it('keeps the routes a pending password change allows to the session and password routes', () => {
    const allowed = routes
      .filter((r) => r.whilePasswordChangeRequired)
      .map(label)
      .sort();
    expect(allowed).to.deep.equal(
      ['DELETE /api/session', 'GET /api/session', 'GET /api/session/csrf', 'POST /api/session', 'POST /api/session/password'].sort(),
    );
  });

  it('has a route for every line of the foundation table', () => {
    const lines = routes.map(label);
    for (const expected of [
      'GET /api/health',
      'GET /api/session/csrf',
      'GET /api/session',
      'POST /api/session',
      'DELETE /api/session',
      'POST /api/session/password',
      'PATCH /api/session/preferences',
      'GET /api/users',
      'GET /api/users/:id',
      'POST /api/users',
      'PATCH /api/users/:id',
      'POST /api/users/:id/deactivate',
      'POST /api/users/:id/reactivate',
      'POST /api/users/:id/temporary-password',
    ]) {
      expect(lines).to.include(expected);
    }
  });

  it('has a route for every line of the authoring table, with its access', () => {
    const byLine = new Map(routes.map((r) => [label(r), r.access]));
    const stock = ['author', 'admin'];
    const expected: [string, unknown][] = [];
    for (const kind of ['materials', 'wheels', 'machines']) {
      expected.push(
        [`GET /api/${kind}`, 'signedIn'],
        [`GET /api/${kind}/:id`, 'signedIn'],
        [`POST /api/${kind}`, stock],
        [`PUT /api/${kind}/:id`, stock],
        [`POST /api/${kind}/:id/archive`, stock],
        [`POST /api/${kind}/:id/unarchive`, stock],
        [`DELETE /api/${kind}/:id`, stock],
      );
    }
    expected.push(
      ['GET /api/selection-rows', 'signedIn'],
      ['POST /api/selection-rows', stock],
      ['PUT /api/selection-rows/:id', stock],
      ['DELETE /api/selection-rows/:id', stock],
      ['GET /api/settings/limits', 'signedIn'],
      ['GET /api/recipes', 'signedIn'],
      ['POST /api/recipes', ['author']],
      ['GET /api/recipes/:id/versions', 'signedIn'],
      ['GET /api/recipes/:id/versions/:n', 'signedIn'],
      ['PUT /api/recipes/:id/versions/:n', ['author']],
      ['POST /api/recipes/:id/versions/:n/attachments', ['author']],
      ['DELETE /api/recipes/:id/versions/:n/attachments/:attachmentId', ['author']],
      ['GET /api/attachments/:id', 'signedIn'],
      ['GET /api/attachments/:id/thumbnail', 'signedIn'],
    );
    for (const [line, access] of expected) {
      expect(byLine.has(line), line).to.equal(true);
      expect(byLine.get(line), line).to.deep.equal(access);
    }
  });

  // Runs after the walks above (mocha keeps the order): a line that is shadowed by another,
  // or that the walk cannot reach, fails here instead of passing unseen.
  it('reached the handler of every route in the table at least once during the walk', () => {
    const missed = routes.map(label).filter((line) => !recorder.reached.has(line));
    expect(missed, 'routes the walk never got through to').to.deep.equal([]);
  });
});
