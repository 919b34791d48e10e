/** The review routes of DEVELOPERS.md that this server builds, each with its access. */
import { expect } from 'chai';
import { routes } from '../../../server/web/routes';

describe('Route table: review and approval', () => {
  it('has a line for every review route, with its access', () => {
    const byLine = new Map(routes.map((r) => [`${r.method.toUpperCase()} ${r.path}`, r.access]));
    const expected: [string, unknown][] = [
      ['POST /api/recipes/:id/versions/:n/submit', ['author']],
      ['POST /api/recipes/:id/versions/:n/return', ['approver']],
      ['POST /api/recipes/:id/versions/:n/approve', ['approver']],
      ['POST /api/recipes/:id/versions/:n/withdraw', ['approver']],
      ['POST /api/recipes/:id/versions', ['author']],
      ['GET /api/recipes/:id/versions/:n/comments', 'signedIn'],
      ['POST /api/recipes/:id/versions/:n/comments', ['author', 'approver']],
      ['GET /api/reviews/due', 'signedIn'],
      ['GET /api/today', 'signedIn'],
    ];
    for (const [line, access] of expected) {
      expect(byLine.has(line), line).to.equal(true);
      expect(byLine.get(line), line).to.deep.equal(access);
    }
    const lines = routes.map((r) => `${r.method.toUpperCase()} ${r.path}`);
    expect(new Set(lines).size, 'no route is listed twice').to.equal(lines.length);
  });
});
