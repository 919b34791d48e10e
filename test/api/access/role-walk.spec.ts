/**
 * Walks the real route table: every route is tried anonymously, with each single role,
 * and by someone who must change a temporary password. A new line in routes.ts is
 * covered without touching this file.
 */
import { expect } from 'chai';
import { ROLES, hasAccess } from '../../../shared/roles';
import { CSRF_HEADER } from '../../../shared/api-types';
import { routes } from '../../../server/web/routes';
import { isValidAccess } from '../../../server/web/access';
import { buildRouter } from '../../../server/web/router';
import type { RouteContext, RouteDefinition } from '../../../server/web/route-definition';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { anonymousAgent, signedInAgent, type Agent } from '../support/test-app';

function call(agent: Agent, route: RouteDefinition, id: number, csrf: string) {
  const path = route.path.replace(/:id\b/g, String(id));
  return agent[route.method](path).set(CSRF_HEADER, csrf);
}

function label(route: RouteDefinition): string {
  return `${route.method.toUpperCase()} ${route.path}`;
}

describe('Route table access', () => {
  const ctx = apiTestContext();
  let target: TestPerson;

  before(async () => {
    // The throw-away person every :id points at.
    target = await createPerson(ctx.db, { roles: ['operator'] });
  });

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
      const res = await call(agent, route, target.id, csrf);
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
        const res = await call(session.agent, route, target.id, session.csrf);
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
      const res = await call(session.agent, route, target.id, session.csrf);
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
    const allowed = routes.filter((r) => r.whilePasswordChangeRequired).map(label).sort();
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
});
