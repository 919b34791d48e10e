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
import { createStockSet, recipeInput } from '../support/stock';
import { createRecipe } from '../../../server/services/recipes';
import { createSelectionRow } from '../../../server/services/selection-rows';
import { addAttachment } from '../../../server/services/attachments';
import sharp from 'sharp';
import { insertCut } from '../../../server/data/cuts';

/** Existing records the walk's paths point at, so handlers really run (not only 404). */
interface Targets {
  user: number;
  material: number;
  wheel: number;
  machine: number;
  selectionRow: number;
  recipe: number;
  attachment: number;
  cut: number;
}

/** Fills :id by the resource the path names, :n with version 1 and :attachmentId. */
function pathFor(route: RouteDefinition, t: Targets): string {
  const resource = route.path.split('/')[2];
  const ids: Record<string, number> = {
    users: t.user,
    materials: t.material,
    wheels: t.wheel,
    machines: t.machine,
    'selection-rows': t.selectionRow,
    recipes: t.recipe,
    attachments: t.attachment,
  };
  const id = ids[resource ?? ''];
  if (route.path.includes(':id') && id === undefined) throw new Error(`The role walk has no target for ${route.path}: add one.`);
  return route.path
    .replace(/:id\b/g, String(id))
    .replace(/:n\b/g, '1')
    .replace(/:code\b/g, 'ZZZZ-ZZZZ')
    .replace(/:attachmentId\b/g, String(t.attachment))
    .replace(/:cutId\b/g, String(t.cut));
}

function call(agent: Agent, route: RouteDefinition, t: Targets, csrf: string) {
  const left = route.path.replace(/\/:(id|n|attachmentId|cutId|code)\b/g, '');
  if (left.includes(':')) throw new Error(`The role walk cannot fill the parameters of ${route.path}.`);
  return agent[route.method](pathFor(route, t)).set(CSRF_HEADER, csrf);
}

function label(route: RouteDefinition): string {
  return `${route.method.toUpperCase()} ${route.path}`;
}

describe('Route table access', () => {
  const ctx = apiTestContext();
  let target: TestPerson;
  let targets: Targets;

  before(async () => {
    // The throw-away records the paths point at.
    target = await createPerson(ctx.db, { roles: ['operator'] });
    const writer = await createPerson(ctx.db, { roles: ['author'] });
    const actor = { userId: writer.id, name: writer.displayName, clientAddress: '' };
    const stock = await createStockSet(ctx.db);
    const row = await createSelectionRow(ctx.db, actor, { group: 'copper', hardness: null, wheelId: stock.wheel.id, note: '' });
    const recipe = await createRecipe(ctx.db, actor, recipeInput(stock));
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#808080' } }).png().toBuffer();
    const attachment = await addAttachment(ctx.db, actor, recipe.recipeId, 1, { role: 'setup', caption: '' }, { bytes: png, fileName: 'walk.png', declaredType: 'image/png' });
    targets = {
      user: target.id,
      material: stock.material.id,
      wheel: stock.wheel.id,
      machine: stock.machine.id,
      selectionRow: row.id,
      recipe: recipe.recipeId,
      attachment: attachment.id,
      // A flagged cut straight in the table (the walk's recipe is a draft; recording is tested in test/api/operator).
      cut: await insertCut(ctx.db, {
        version_id: (await ctx.db('recipe_versions').where({ recipe_id: recipe.recipeId, version: 1 }).first('id')).id,
        recipe_id: recipe.recipeId,
        specimen_id: 'WALK-1',
        part_ref: '',
        quantity: 1,
        outcome: 'burnt',
        notes: '',
        operator_id: target.id,
        operator_name: target.displayName,
        cut_at: new Date(),
      }),
    };
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
});
