import { expect } from 'chai';
import { canonicalJson } from '../../../shared/canonical-json';

describe('canonicalJson', () => {
  it('sorts keys at every level and keeps array order', () => {
    const a = canonicalJson({ b: 1, a: { d: [3, { z: 1, y: 2 }], c: null } });
    expect(a).to.equal('{"a":{"c":null,"d":[3,{"y":2,"z":1}]},"b":1}');
  });

  it('gives the same text for the same content whatever the key order', () => {
    expect(canonicalJson({ x: 'é', y: [1, 2] })).to.equal(canonicalJson({ y: [1, 2], x: 'é' }));
  });

  it('drops undefined members as JSON does, and refuses NaN and Infinity', () => {
    expect(canonicalJson({ a: undefined, b: 2 })).to.equal('{"b":2}');
    expect(() => canonicalJson({ a: Number.NaN })).to.throw(/NaN/);
    expect(() => canonicalJson([Infinity])).to.throw();
  });
});
