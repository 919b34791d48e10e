/**
 * People outside authoring: an operator, an auditor and someone not signed in.
 * None of them reaches the people list or changes anything beyond their own session and
 * an operator's own duties (cut records, acknowledgements) on versions they may see; an
 * operator and an anonymous caller do not reach drafts either. An auditor reads every
 * version, drafts included (auditors read everything and change nothing) — asserted here so that a change
 * of that rule is a decision, not an accident.
 */
import { expect } from 'chai';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { CSRF_HEADER } from '../../../shared/api-types';
import { routes } from '../../../server/web/routes';
import type { RouteDefinition } from '../../../server/web/route-definition';
import { apiTestContext } from '../support/hooks';
import { anonymousAgent, type Agent } from '../support/test-app';
import { createStockSet, type StockSet } from '../support/stock';
import { dbFingerprint, changedTables } from '../support/db-fingerprint';
import { createTargets, isWrite, label, pathFor, type Targets } from '../support/route-walk';
import { createDraft, sessionFor, type Session } from '../workflow/workflow-support';

/**
 * Writes to one's own session and account, open to anyone signed in (or public): signing
 * in and out, one's own password, preferences and mail settings, the mailed password links.
 */
const SELF_SERVICE = new Set([
  'POST /api/session',
  'DELETE /api/session',
  'POST /api/session/password',
  'PATCH /api/session/preferences',
  'PATCH /api/session/notifications',
  'POST /api/password/forgot',
  'POST /api/password/link',
  'POST /api/password/set',
]);

/** The bodies an operator's own duties would take: valid, so only the target (a draft) is wrong. */
const DUTY_BODIES: Record<string, object> = {
  'POST /api/recipes/:id/versions/:n/cuts': { specimenId: 'OUT-1', partRef: '', quantity: 1, outcome: 'good', notes: '' },
  'POST /api/recipes/:id/versions/:n/acknowledge': {},
};

describe('Operators, auditors and anonymous callers: no drafts, no people, no writes', () => {
  const ctx = apiTestContext();
  let author: Session;
  let operator: Session;
  let auditor: Session;
  let anonymous: { agent: Agent; csrf: string };
  let stock: StockSet;
  let draft: RecipeVersionDto;
  let targets: Targets;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author']);
    operator = await sessionFor(ctx.app, ctx.db, ['operator']);
    auditor = await sessionFor(ctx.app, ctx.db, ['auditor']);
    anonymous = await anonymousAgent(ctx.app);
    stock = await createStockSet(ctx.db);
    draft = await createDraft(author, stock, { title: 'Unreleased draft' });
    targets = await createTargets(ctx.db);
  });

  /** Every read of a recipe's versions, pointed at the draft, and the photo of a draft. */
  const draftPaths = () => {
    const base = `/api/recipes/${draft.recipeId}/versions/1`;
    return [
      `/api/recipes/${draft.recipeId}/versions`,
      base,
      `${base}/comments`,
      `${base}/cuts`,
      `${base}/cuts.csv`,
      `${base}/sheet.pdf`,
      `/api/recipes/${draft.recipeId}/compare?from=1&to=1`,
      // The walk's draft carries a photo: its bytes are as unreachable as the draft.
      `/api/attachments/${targets.attachment}`,
      `/api/attachments/${targets.attachment}/thumbnail`,
    ];
  };

  describe('drafts', () => {
    it('an operator finds no draft in the library, by any filter, and gets 404 for every view of one', async () => {
      for (const query of [{}, { status: 'draft' }, { q: 'Unreleased' }]) {
        const res = await operator.agent.get('/api/recipes').query(query);
        expect(res.status).to.equal(200);
        expect(
          res.body.items.map((r: { id: number }) => r.id),
          JSON.stringify(query),
        ).not.to.include(draft.recipeId);
      }
      for (const path of draftPaths()) {
        const res = await operator.agent.get(path);
        expect(res.status, path).to.equal(404);
        expect(res.body.code, path).to.equal('NOT_FOUND');
        expect(JSON.stringify(res.body), path).not.to.include('Unreleased');
      }
      const found = await operator.agent.get('/api/finder').query({ q: 'Unreleased' });
      expect(JSON.stringify(found.body)).not.to.include('Unreleased');
    });

    it('an anonymous caller gets 401 for the library and every view of a draft', async () => {
      for (const path of ['/api/recipes', '/api/recipes?status=draft', ...draftPaths()]) {
        const res = await anonymous.agent.get(path);
        expect(res.status, path).to.equal(401);
        expect(res.body.code, path).to.equal('NOT_SIGNED_IN');
      }
    });

    it('an auditor reads the draft (auditors read everything) but cannot print it', async () => {
      const list = await auditor.agent.get('/api/recipes').query({ status: 'draft' });
      expect(list.body.items.map((r: { id: number }) => r.id)).to.include(draft.recipeId);
      expect((await auditor.agent.get(`/api/recipes/${draft.recipeId}/versions/1`)).status).to.equal(200);
      // Bench sheets exist only for approved versions, whoever asks.
      const sheet = await auditor.agent.get(`/api/recipes/${draft.recipeId}/versions/1/sheet.pdf`);
      expect(sheet.status).to.equal(409);
      expect(sheet.headers['content-type']).to.match(/^application\/json/);
    });
  });

  describe('people', () => {
    for (const who of ['operator', 'auditor'] as const) {
      it(`${who}: 403 for the people list, one person, and the dev outbox`, async () => {
        const session = who === 'operator' ? operator : auditor;
        for (const path of ['/api/users', `/api/users/${author.person.id}`, '/api/users?q=a', '/api/dev/outbox']) {
          const res = await session.agent.get(path);
          expect(res.status, path).to.equal(403);
          expect(res.body.code).to.equal('FORBIDDEN');
          expect(res.text, path).not.to.include(author.person.username);
        }
      });
    }

    it('anonymous: 401 for the people list and one person', async () => {
      for (const path of ['/api/users', `/api/users/${author.person.id}`]) {
        const res = await anonymous.agent.get(path);
        expect(res.status, path).to.equal(401);
        expect(res.text).not.to.include(author.person.username);
      }
    });
  });

  describe('writes', () => {
    const writeRoutes = () => routes.filter((r) => isWrite(r) && !SELF_SERVICE.has(label(r)));

    function attempt(who: { agent: Agent; csrf: string }, route: RouteDefinition) {
      // Operator duties point at the draft; everything else at the walk's records.
      const duty = DUTY_BODIES[label(route)];
      const path = duty ? pathFor(route, { ...targets, recipe: draft.recipeId }) : pathFor(route, targets);
      return who.agent[route.method](path)
        .set(CSRF_HEADER, who.csrf)
        .send(duty ?? {});
    }

    for (const who of ['operator', 'auditor', 'anonymous'] as const) {
      it(`${who}: every write route answers 401, 403 or 404 (a valid token sent) and nothing is written`, async () => {
        const session = who === 'operator' ? operator : who === 'auditor' ? auditor : anonymous;
        expect(writeRoutes().length).to.be.greaterThan(30);
        const before = await dbFingerprint(ctx.db);
        for (const route of writeRoutes()) {
          const res = await attempt(session, route);
          expect(res.status, `${label(route)} as ${who}: ${JSON.stringify(res.body)}`).to.be.oneOf([401, 403, 404]);
          if (who === 'anonymous') expect(res.body.code, label(route)).to.equal('NOT_SIGNED_IN');
        }
        expect(changedTables(before, await dbFingerprint(ctx.db)), `${who} wrote`).to.deep.equal([]);
      });
    }

    it('the same requests by the author do write (the refusals above are about who asks)', async () => {
      const before = await dbFingerprint(ctx.db);
      const res = await author.agent.post(`/api/materials/${targets.material}/archive`).set(CSRF_HEADER, author.csrf);
      expect(res.status).to.equal(200);
      expect(changedTables(before, await dbFingerprint(ctx.db))).to.include.members(['materials', 'trail_events', 'trail head']);
    });
  });
});
