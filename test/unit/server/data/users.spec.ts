import { expect } from 'chai';
import { containsPattern } from '../../../../server/data/users';

describe('containsPattern (LIKE search text)', () => {
  it('wraps the text in % and escapes LIKE wildcards and the escape character', () => {
    expect(containsPattern('steel')).to.equal('%steel%');
    expect(containsPattern('100%')).to.equal('%100\\%%');
    expect(containsPattern('a_b')).to.equal('%a\\_b%');
    expect(containsPattern('c:\\path')).to.equal('%c:\\\\path%');
  });
});
