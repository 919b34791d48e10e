/**
 * API answers carry people's names, recipes in review and the trail: no browser or shared
 * cache may keep them (`Cache-Control: no-store`, RFC 9111 §5.2.2.5), so a shared computer's
 * back button or disk cache shows nothing after sign-out. Photos keep their own private,
 * immutable caching (the bytes behind an id never change).
 */
import { expect } from 'chai';
import request from 'supertest';
import { z } from 'zod';
import { ROLES } from '../../../shared/roles';
import { routes } from '../../../server/web/routes';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { signedInAgent, type Agent } from '../support/test-app';

describe('API answers are not cached', () => {
  const ctx = apiTestContext();
  let who: { agent: Agent; csrf: string };

  before(async () => {
    who = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: [...ROLES] }));
  });

  it('every JSON read without path parameters answers with Cache-Control: no-store', async () => {
    const reads = routes.filter((r) => r.method === 'get' && !r.path.includes(':') && !/\.(csv|pdf)$/.test(r.path));
    expect(reads.length).to.be.above(10);
    const cached: string[] = [];
    for (const route of reads) {
      const res = await who.agent.get(route.path);
      if (res.type === 'application/json' && res.headers['cache-control'] !== 'no-store')
        cached.push(`${route.path} → ${res.status} ${res.headers['cache-control'] ?? '(none)'}`);
    }
    expect(cached).to.deep.equal([]);
    expect(z.string().parse((await who.agent.get('/api/session')).headers['cache-control'])).to.equal('no-store');
  });

  it('error answers too: 401, 404 and 400', async () => {
    for (const [agent, path] of [
      [request(ctx.app), '/api/recipes'],
      [who.agent, '/api/no-such-route'],
      [who.agent, '/api/materials?sort=nonsense'],
    ] as const) {
      const res = await agent.get(path);
      expect(res.status, path).to.be.within(400, 499);
      expect(res.headers['cache-control'], path).to.equal('no-store');
    }
  });
});
