/**
 * Attacks on the session itself, seen from the attacker's side (OWASP Session Management
 * Cheat Sheet "Renew the Session ID After Any Privilege Level Change"; OWASP CSRF
 * Prevention Cheat Sheet; OWASP Authentication Cheat Sheet "Login Throttling").
 * test/api/session/ already checks that sign-in replaces the cookie, the CSRF token on
 * sign-in and on POST /api/users, and the sequential sign-in limit; this file adds the
 * planted session id, every write route without a good token, and a burst of guesses.
 */
import { expect } from 'chai';
import request from 'supertest';
import { CSRF_HEADER } from '../../../shared/api-types';
import { ROLES } from '../../../shared/roles';
import { routes } from '../../../server/web/routes';
import { MAX_FAILURES } from '../../../server/services/auth/sign-in-limiter';
import { SESSION_COOKIE } from '../../../server/web/session-cookie';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { anonymousAgent, setCookie, signedInAgent } from '../support/test-app';
import { materialInput } from '../support/stock';
import { changedTables, dbFingerprint } from '../support/db-fingerprint';
import { createTargets, isWrite, label, pathFor, type Targets } from '../support/route-walk';

/** The `name=value` part of a Set-Cookie header. */
const pair = (setCookieHeader: string | undefined) => setCookieHeader?.split(';')[0];

describe('Session attacks: fixation, forged writes, guessing', () => {
  const ctx = apiTestContext({ trustProxy: 'loopback' });
  let person: TestPerson;
  let targets: Targets;

  before(async () => {
    person = await createPerson(ctx.db, { roles: [...ROLES] });
    targets = await createTargets(ctx.db);
  });

  describe('session fixation', () => {
    it('a session id planted before sign-in is not the signed-in session, and is dead afterwards', async () => {
      // The attacker gets an anonymous session and its token, and plants both in the victim's browser.
      const planted = await request(ctx.app).get('/api/session/csrf').expect(200);
      const plantedCookies = (planted.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
      const plantedSid = pair(setCookie(planted, SESSION_COOKIE))!;
      // The victim signs in with the planted cookies.
      const signIn = await request(ctx.app)
        .post('/api/session')
        .set('Cookie', plantedCookies)
        .set(CSRF_HEADER, planted.body.csrfToken)
        .send({ username: person.username, password: person.password });
      expect(signIn.status).to.equal(200);
      const victimSid = pair(setCookie(signIn, SESSION_COOKIE));
      expect(victimSid).to.be.a('string').and.not.equal(plantedSid);
      // The attacker's copy of the old id is not signed in, now or after the victim keeps working.
      expect((await request(ctx.app).get('/api/session').set('Cookie', victimSid!)).status).to.equal(200);
      const attacker = await request(ctx.app).get('/api/session').set('Cookie', plantedSid);
      expect(attacker.status).to.equal(401);
      expect(attacker.body.code).to.equal('NOT_SIGNED_IN');
      const attackerWrite = await request(ctx.app)
        .patch('/api/session/preferences')
        .set('Cookie', plantedCookies)
        .set(CSRF_HEADER, planted.body.csrfToken)
        .send({ units: 'metric' });
      expect(attackerWrite.status).to.be.oneOf([401, 403]);
    });

    it('an id the attacker made up is never adopted: sign-in gets a server-made id', async () => {
      const invented = `${SESSION_COOKIE}=${encodeURIComponent('s:attacker-chosen-id.bm90LWEtc2lnbmF0dXJl')}`;
      const agent = request.agent(ctx.app);
      const csrf = await agent.get('/api/session/csrf').set('Cookie', invented).expect(200);
      const signIn = await agent.post('/api/session').set(CSRF_HEADER, csrf.body.csrfToken).send({ username: person.username, password: person.password });
      expect(signIn.status).to.equal(200);
      expect(pair(setCookie(signIn, SESSION_COOKIE))).not.to.include('attacker-chosen-id');
      expect(await ctx.db('sessions').where({ sid: 'attacker-chosen-id' }).first()).to.equal(undefined);
      expect((await request(ctx.app).get('/api/session').set('Cookie', invented)).status).to.equal(401);
    });
  });

  describe('CSRF on every write route', () => {
    it('answers 403 CSRF_INVALID to every write without a good token — missing, forged, another session’s, stale, or not in the header — and writes nothing', async () => {
      const { agent, csrf: before } = await anonymousAgent(ctx.app);
      // The anonymous token this browser had before signing in (stale after the id changed).
      const signIn = await agent.post('/api/session').set(CSRF_HEADER, before).send({ username: person.username, password: person.password }).expect(200);
      const good = signIn.body.csrfToken as string;
      const other = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: [...ROLES] }));
      const writes = routes.filter(isWrite);
      expect(writes.length).to.be.greaterThan(40);
      const print = await dbFingerprint(ctx.db);
      const tokens: [string, (r: request.Test) => request.Test][] = [
        ['missing', (r) => r],
        ['empty', (r) => r.set(CSRF_HEADER, '')],
        [
          'forged',
          (r) =>
            r.set(
              CSRF_HEADER,
              good.replace(/.$/, (c) => (c === 'a' ? 'b' : 'a')),
            ),
        ],
        ['another session’s', (r) => r.set(CSRF_HEADER, other.csrf)],
        ['stale (before sign-in)', (r) => r.set(CSRF_HEADER, before)],
        ['in the query', (r) => r.query({ _csrf: good, csrfToken: good })],
        ['in the body', (r) => r.send({ _csrf: good, csrfToken: good })],
        ['in another header', (r) => r.set('X-XSRF-Token', good).set('CSRF-Token', good)],
      ];
      for (const route of writes) {
        for (const [how, withToken] of tokens) {
          const res = await withToken(agent[route.method](pathFor(route, targets)));
          expect(res.status, `${label(route)}, token ${how}: ${JSON.stringify(res.body)}`).to.equal(403);
          expect(res.body.code, `${label(route)}, token ${how}`).to.equal('CSRF_INVALID');
        }
      }
      expect(changedTables(print, await dbFingerprint(ctx.db)), 'forged writes changed').to.deep.equal([]);
      // Still signed in, and the good token does work: the refusals were about the token.
      const ok = await agent
        .post('/api/materials')
        .set(CSRF_HEADER, good)
        .send(materialInput({ name: 'Made with the right token' }));
      expect(ok.status, JSON.stringify(ok.body)).to.equal(201);
    });
  });

  describe('guessing passwords', () => {
    const attempt = (address: string, password: string) =>
      anonymousAgent(ctx.app).then(({ agent, csrf }) =>
        agent.post('/api/session').set('X-Forwarded-For', address).set(CSRF_HEADER, csrf).send({ username: person.username, password }),
      );

    it(`a burst of parallel guesses gets at most ${MAX_FAILURES} passwords checked; the rest, and then the right password, get 429`, async function () {
      this.timeout(60_000);
      const address = '203.0.113.99';
      const burst = await Promise.all(Array.from({ length: MAX_FAILURES * 3 }, (_, i) => attempt(address, `parallel-guess-${i}`)));
      const statuses = burst.map((r) => r.status);
      expect(
        statuses.filter((s) => s !== 401 && s !== 429),
        'only 401 and 429',
      ).to.deep.equal([]);
      expect(statuses.filter((s) => s === 401).length, 'guesses checked').to.be.at.most(MAX_FAILURES);
      for (const res of burst.filter((r) => r.status === 429)) expect(res.body.code).to.equal('TOO_MANY_ATTEMPTS');
      const right = await attempt(address, person.password);
      expect(right.status).to.equal(429);
      expect(right.body.code).to.equal('TOO_MANY_ATTEMPTS');
      expect(Number(right.headers['retry-after'])).to.be.within(1, 15 * 60);
      // Once the window has passed (the failures aged past 15 minutes), the right password works again.
      await ctx
        .db('sign_in_failures')
        .where({ client_address: address })
        .update({ failed_at: new Date(Date.now() - 16 * 60 * 1000) });
      expect((await attempt(address, person.password)).status).to.equal(200);
    });
  });
});
