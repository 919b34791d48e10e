import { expect } from 'chai';
import { trustProxyValue } from '../../../../server/app';

describe('trustProxyValue (TRUST_PROXY)', () => {
  it('turns the environment text into Express’s trust proxy setting', () => {
    expect(trustProxyValue(false)).to.equal(false);
    expect(trustProxyValue('true')).to.equal(true);
    expect(trustProxyValue('1')).to.equal(1);
    expect(trustProxyValue('loopback')).to.equal('loopback');
    expect(trustProxyValue('10.0.0.0/8, loopback')).to.equal('10.0.0.0/8, loopback');
  });
});
