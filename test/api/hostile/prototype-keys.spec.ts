/**
 * A query value that names a property every JavaScript object has ("constructor",
 * "__proto__", "toString", "valueOf", "hasOwnProperty") must be read as the text it is. A
 * lookup table indexed with it finds the inherited property (a function) instead of nothing,
 * and the request used to end in 500 (`GET /api/materials?sort=constructor`). Every query
 * field of every read route without path parameters, with each of those values: a clear 400
 * or a normal answer, never 5xx.
 */
import { expect } from 'chai';
import { z } from 'zod';
import { ROLES } from '../../../shared/roles';
import { routes as ROUTES } from '../../../server/web/routes';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { signedInAgent, type Agent } from '../support/test-app';
import { POLLUTION_KEYS } from './hostile-input';

const INHERITED = [...new Set([...POLLUTION_KEYS, 'isPrototypeOf', 'toLocaleString'])];

describe('Inherited property names in query values', () => {
  const ctx = apiTestContext();
  let who: { agent: Agent; csrf: string };

  before(async () => {
    who = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: [...ROLES] }));
  });

  const reads = ROUTES.filter((r) => r.method === 'get' && r.query instanceof z.ZodObject && !r.path.includes(':'));

  it('covers the stock lists, the library, the people list, the Finder and the trail', () => {
    const paths = reads.map((r) => r.path);
    for (const path of ['/api/materials', '/api/wheels', '/api/machines', '/api/recipes', '/api/users', '/api/finder', '/api/trail'])
      expect(paths, path).to.include(path);
  });

  for (const route of reads) {
    it(`${route.path}: every query field answers 400 or 2xx to each inherited name, never 5xx`, async function () {
      this.timeout(60000);
      const fields = Object.keys((route.query as z.ZodObject<z.ZodRawShape>).shape);
      const failures: string[] = [];
      for (const field of fields) {
        for (const value of INHERITED) {
          const url = `${route.path}?${encodeURIComponent(field)}=${encodeURIComponent(value)}`;
          const res = await who.agent.get(url);
          if (res.status >= 500) failures.push(`${url} → ${res.status}`);
          else if (res.status === 400 && !(res.body?.code === 'VALIDATION_FAILED' && Array.isArray(res.body.errors)))
            failures.push(`${url} → 400 without the error shape`);
        }
      }
      expect(failures).to.deep.equal([]);
    });
  }
});
