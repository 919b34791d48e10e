import { expect } from 'chai';
import { pathMatcher } from '../../../../server/web/multipart';

describe('pathMatcher (multipart routes)', () => {
  it('matches concrete paths of a route with parameters, and nothing else', () => {
    const m = pathMatcher('/api/recipes/:id/versions/:n/attachments');
    expect(m.test('/api/recipes/12/versions/3/attachments')).to.equal(true);
    expect(m.test('/api/recipes/12/versions/3/attachments/')).to.equal(true);
    expect(m.test('/api/recipes/12/versions/3/attachments/9')).to.equal(false);
    expect(m.test('/api/recipes/12/versions/attachments')).to.equal(false);
    expect(m.test('/api/materials')).to.equal(false);
    expect(m.test('/api/recipes/1/2/versions/3/attachments')).to.equal(false);
  });
});
