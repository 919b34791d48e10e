import { expect } from 'chai';
import { hashPassword, needsRehash, verifyPassword } from '../../../../../server/services/auth/passwords';

describe('passwords', () => {
  let hash: string;
  before(async () => {
    hash = await hashPassword('Grüße aus dem Labor');
  });

  it('stores a self-describing scrypt string with parameters, salt and key', () => {
    expect(hash).to.match(/^scrypt\$N=32768,r=8,p=1\$[A-Za-z0-9_-]{22}\$[A-Za-z0-9_-]{43}$/);
    expect(hash).not.to.include('Grüße');
    expect(needsRehash(hash)).to.equal(false);
  });

  it('verifies the right password and refuses a wrong one', async () => {
    expect(await verifyPassword('Grüße aus dem Labor', hash)).to.equal(true);
    expect(await verifyPassword('Grüße aus dem labor', hash)).to.equal(false);
    expect(await verifyPassword('', hash)).to.equal(false);
  });

  it('salts: the same password hashes differently each time', async () => {
    expect(await hashPassword('Grüße aus dem Labor')).not.to.equal(hash);
  });

  it('normalises to NFC: composed and decomposed input are the same password', async () => {
    const decomposed = 'Grüße aus dem Labor'.normalize('NFD');
    expect(decomposed).not.to.equal('Grüße aus dem Labor');
    expect(await verifyPassword(decomposed, hash)).to.equal(true);
    const fromDecomposed = await hashPassword('Ångström'.normalize('NFD'));
    expect(await verifyPassword('Ångström'.normalize('NFC'), fromDecomposed)).to.equal(true);
  });

  it('never matches a malformed or foreign hash, and flags old parameters for rehash', async () => {
    for (const bad of ['', 'plain', 'scrypt$N=1024$abc', '$2b$10$abcdefghijklmnopqrstuv', 'scrypt$N=abc,r=8,p=1$AAAA$AAAA']) {
      expect(await verifyPassword('x', bad), bad).to.equal(false);
      expect(needsRehash(bad), bad).to.equal(true);
    }
    const older = hash.replace('N=32768', 'N=16384');
    expect(needsRehash(older)).to.equal(true);
    // Same salt and key under other parameters is a different hash.
    expect(await verifyPassword('Grüße aus dem Labor', older)).to.equal(false);
  });
});
