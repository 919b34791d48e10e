import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { MAX_ADDRESS_FAILURES, MAX_FAILURES } from '../../../server/services/auth/sign-in-limiter';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { anonymousAgent } from '../support/test-app';

/** Behind a trusted proxy, X-Forwarded-For gives each request its client address. */
describe('Sign-in limit per (username, client address)', () => {
  const ctx = apiTestContext({ trustProxy: 'loopback' });
  let person: TestPerson;
  const ATTACKER = '203.0.113.7';
  const OFFICE = '198.51.100.20';

  before(async () => {
    person = await createPerson(ctx.db, { username: 'lena.approver', roles: ['approver'] });
  });

  async function attempt(address: string, password: string, username = person.username) {
    const { agent, csrf } = await anonymousAgent(ctx.app);
    return agent.post('/api/session').set('X-Forwarded-For', address).set(CSRF_HEADER, csrf).send({ username, password });
  }

  it(`refuses the ${MAX_FAILURES + 1}th attempt after ${MAX_FAILURES} failures, even with the right password`, async () => {
    expect(MAX_FAILURES).to.equal(10);
    for (let i = 0; i < MAX_FAILURES; i++) {
      const res = await attempt(ATTACKER, `guess-number-${i}`);
      expect(res.status, `attempt ${i + 1}`).to.equal(401);
    }
    const blocked = await attempt(ATTACKER, person.password);
    expect(blocked.status).to.equal(429);
    expect(blocked.body.code).to.equal('TOO_MANY_ATTEMPTS');
    expect(blocked.body.errors[0].message).to.match(/Try again in \d+ minutes? \(after \d\d:\d\d UTC\)/);
    expect(Number(blocked.headers['retry-after'])).to.be.within(1, 15 * 60);
    // The refusal is not itself counted as another failure.
    const rows = await ctx.db('sign_in_failures').where({ username: person.username, client_address: ATTACKER });
    expect(rows).to.have.length(MAX_FAILURES);
  });

  it('leaves the same person signing in from another address alone', async () => {
    const res = await attempt(OFFICE, person.password);
    expect(res.status).to.equal(200);
  });

  it('does not reset the blocked address when another address signs in successfully', async () => {
    const still = await attempt(ATTACKER, person.password);
    expect(still.status).to.equal(429);
  });

  it('does not block other usernames from the blocked address', async () => {
    const other = await createPerson(ctx.db, { username: 'otto.author', roles: ['author'] });
    const res = await attempt(ATTACKER, other.password, other.username);
    expect(res.status).to.equal(200);
  });

  it('lifts the limit once the failures are older than 15 minutes', async () => {
    await ctx
      .db('sign_in_failures')
      .where({ client_address: ATTACKER })
      .update({ failed_at: new Date(Date.now() - 15 * 60 * 1000 - 1000) });
    const res = await attempt(ATTACKER, person.password);
    expect(res.status).to.equal(200);
  });

  it('counts unknown usernames too, so guessing names is limited as well', async () => {
    for (let i = 0; i < MAX_FAILURES; i++) expect((await attempt('192.0.2.1', 'x', 'ghost.user')).status).to.equal(401);
    expect((await attempt('192.0.2.1', 'x', 'ghost.user')).status).to.equal(429);
  });

  describe('per address, across usernames', () => {
    // Spraying: one common password tried once on many accounts stays under every per-name
    // limit; the address's own count stops it.
    const SPRAYER = '203.0.113.99';

    it(`refuses an address after ${MAX_ADDRESS_FAILURES} failures over any usernames, the right password of another person included`, async () => {
      expect(MAX_ADDRESS_FAILURES).to.equal(30);
      for (let i = 0; i < MAX_ADDRESS_FAILURES; i++) {
        const res = await attempt(SPRAYER, 'Summer2026!', `sprayed.user${i}`);
        expect(res.status, `attempt ${i + 1}`).to.equal(401);
      }
      const blocked = await attempt(SPRAYER, person.password);
      expect(blocked.status).to.equal(429);
      expect(blocked.body.code).to.equal('TOO_MANY_ATTEMPTS');
      expect(blocked.body.errors[0].message).to.match(/Too many failed sign-ins from your address/);
      expect(Number(blocked.headers['retry-after'])).to.be.within(1, 15 * 60);
      // Other addresses are not affected.
      expect((await attempt(OFFICE, person.password)).status).to.equal(200);
    });

    it("a good sign-in from the address does not wipe the address's count of other names", async () => {
      const address = '203.0.113.100';
      const other = await createPerson(ctx.db, { username: 'spray.target', roles: ['operator'] });
      for (let i = 0; i < MAX_ADDRESS_FAILURES - 1; i++) expect((await attempt(address, 'Winter2026!', `tried.user${i}`)).status).to.equal(401);
      expect((await attempt(address, other.password, other.username)).status).to.equal(200);
      expect((await attempt(address, 'Winter2026!', 'tried.last')).status).to.equal(401);
      expect((await attempt(address, 'Winter2026!', 'tried.after')).status).to.equal(429);
    });
  });
});
