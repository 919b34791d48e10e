import { expect } from 'chai';
import request from 'supertest';
import { CSRF_HEADER } from '../../../shared/api-types';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { anonymousAgent, buildTestApp, setCookie, signedInAgent } from '../support/test-app';
import { countRows } from '../support/test-database';

const BAD = 'The username or password is not correct.';

describe('POST /api/session (sign in)', () => {
  const ctx = apiTestContext();
  let operator: TestPerson;
  let retired: TestPerson;
  let unicode: TestPerson;

  before(async () => {
    operator = await createPerson(ctx.db, { username: 'sam.operator', roles: ['operator'] });
    retired = await createPerson(ctx.db, { username: 'old.hand', roles: ['operator'], active: false });
    // Composed (NFC) form stored; the NFD form must sign in too.
    unicode = await createPerson(ctx.db, { username: 'jose.author', roles: ['author'], password: 'Grüße-Stahl-Ø42-Ångström' });
  });

  async function attempt(body: unknown) {
    const { agent, csrf } = await anonymousAgent(ctx.app);
    return agent
      .post('/api/session')
      .set(CSRF_HEADER, csrf)
      .send(body as object);
  }

  describe('with the right password', () => {
    it('answers the session: the person, no hash, a fresh CSRF token; and records it', async () => {
      const before = await countRows(ctx.db, 'trail_events');
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const res = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ username: operator.username, password: operator.password }).expect(200);
      expect(res.body.user).to.include({ id: operator.id, username: 'sam.operator', active: true, mustChangePassword: false });
      expect(res.body.user.roles).to.deep.equal(['operator']);
      expect(JSON.stringify(res.body)).not.to.match(/scrypt|hash|epoch/i);
      expect(res.body.csrfToken).to.be.a('string').and.not.equal(csrf);
      expect(res.body.user.lastSignInAt).to.be.a('string');
      expect(res.body.user).to.include({ invitationPending: false });
      expect(res.body.user.machineIds).to.deep.equal([]);
      // A development server keeps an outbox the client may show.
      expect(res.body.devOutbox).to.equal(true);
      const me = await agent.get('/api/session').expect(200);
      expect(me.body.user.id).to.equal(operator.id);
      expect(me.body.devOutbox).to.equal(true);
      expect(await countRows(ctx.db, 'trail_events')).to.equal(before + 1);
      const event = await ctx.db('trail_events').orderBy('id', 'desc').first();
      expect(event).to.include({ event_type: 'session.signed_in', actor_user_id: operator.id, entity_id: String(operator.id) });
    });

    it('accepts the username in any case and with surrounding spaces', async () => {
      const res = await attempt({ username: '  SAM.Operator ', password: operator.password });
      expect(res.status).to.equal(200);
    });

    it('accepts a non-ASCII password, typed composed or decomposed', async () => {
      expect((await attempt({ username: unicode.username, password: unicode.password })).status).to.equal(200);
      expect((await attempt({ username: unicode.username, password: unicode.password.normalize('NFD') })).status).to.equal(200);
      expect((await attempt({ username: unicode.username, password: 'Grusse-Stahl-O42-Angstrom' })).status).to.equal(401);
    });

    it('gives the new session a new id (the anonymous cookie is replaced)', async () => {
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const anon = await agent.get('/api/session/csrf');
      const anonCookie = setCookie(anon, 'kerfbook.sid');
      expect(anonCookie).to.be.a('string');
      const anonSid = decodeURIComponent(anonCookie!.split(';')[0]!.split('=')[1]!).slice(2).split('.')[0];
      expect(await ctx.db('sessions').where({ sid: anonSid }).first()).to.not.equal(undefined);
      const res = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ username: operator.username, password: operator.password }).expect(200);
      const signedCookie = setCookie(res, 'kerfbook.sid');
      expect(signedCookie).to.be.a('string');
      expect(signedCookie!.split(';')[0]).to.not.equal(anonCookie!.split(';')[0]);
      expect(await ctx.db('sessions').where({ sid: anonSid }).first()).to.equal(undefined);
    });

    it('sets the session cookie HttpOnly and SameSite, not Secure over plain http', async () => {
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const res = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ username: operator.username, password: operator.password }).expect(200);
      const cookie = setCookie(res, 'kerfbook.sid')!;
      expect(cookie).to.match(/HttpOnly/i);
      expect(cookie).to.match(/SameSite=(Lax|Strict)/i);
      expect(cookie).not.to.match(/;\s*Secure/i);
      expect(setCookie(res, 'kerfbook.csrf')).to.match(/HttpOnly/i);
    });
  });

  describe('with wrong credentials', () => {
    it('answers 401 BAD_CREDENTIALS for a wrong password and the same for an unknown name', async () => {
      const wrong = await attempt({ username: operator.username, password: 'not the password' });
      const unknown = await attempt({ username: 'nobody.here', password: 'not the password' });
      for (const res of [wrong, unknown]) {
        expect(res.status).to.equal(401);
        expect(res.body).to.deep.equal({ code: 'BAD_CREDENTIALS', errors: [{ path: '', message: BAD }] });
      }
    });

    it('records failed attempts in the trail, never the password typed', async () => {
      // The trail is append-only (the database refuses DELETE): look at the rows after a mark.
      const mark = Number((await ctx.db('trail_events').max({ m: 'id' }).first())?.m ?? 0);
      await attempt({ username: operator.username, password: 'secret-guess-123' });
      const rows = await ctx.db('trail_events').where('id', '>', mark).select();
      expect(rows).to.have.length(1);
      expect(rows[0]).to.include({ event_type: 'session.sign_in_failed', actor_user_id: null, actor_name: 'sam.operator' });
      expect(JSON.stringify(rows)).not.to.include('secret-guess-123');
    });

    it('refuses a deactivated person with a clear message, only when the password is right', async () => {
      const right = await attempt({ username: retired.username, password: retired.password });
      expect(right.status).to.equal(401);
      expect(right.body.errors[0].message).to.match(/deactivated/i);
      const wrong = await attempt({ username: retired.username, password: 'nope-nope-nope' });
      expect(wrong.status).to.equal(401);
      expect(wrong.body.errors[0].message).to.equal(BAD);
    });

    it('does not let a look-alike non-ASCII name match an ASCII one', async () => {
      await createPerson(ctx.db, { username: 'muller', password: 'a-password-1' });
      expect((await attempt({ username: 'muller', password: 'a-password-1' })).status).to.equal(200);
      expect((await attempt({ username: 'müller', password: 'a-password-1' })).status).to.equal(401);
      expect((await attempt({ username: 'MÜLLER', password: 'a-password-1' })).status).to.equal(401);
    });

    it('treats SQL-looking input as plain text', async () => {
      for (const body of [
        { username: "' OR '1'='1", password: "' OR '1'='1" },
        { username: operator.username, password: "' OR '1'='1' -- " },
        { username: "sam.operator'--", password: 'anything' },
      ]) {
        const res = await attempt(body);
        expect(res.status, JSON.stringify(body)).to.equal(401);
        expect(res.body.code).to.equal('BAD_CREDENTIALS');
      }
    });
  });

  describe('with a malformed request', () => {
    it('answers 400 with field errors for empty and over-long fields, and writes nothing', async () => {
      const before = await countRows(ctx.db, 'trail_events');
      const failuresBefore = await countRows(ctx.db, 'sign_in_failures');
      const cases: [unknown, string[]][] = [
        [{ username: '', password: '' }, ['username', 'password']],
        [{ username: '   ', password: 'x' }, ['username']],
        [{}, ['username', 'password']],
        [{ username: 'a'.repeat(41), password: 'x' }, ['username']],
        [{ username: operator.username, password: 'p'.repeat(201) }, ['password']],
        [{ username: operator.username, password: operator.password, extra: 1 }, ['']],
        [{ username: 42, password: ['x'] }, ['username', 'password']],
        [[], ['']],
      ];
      for (const [body, paths] of cases) {
        const res = await attempt(body);
        expect(res.status, JSON.stringify(body)).to.equal(400);
        expect(res.body.code).to.equal('VALIDATION_FAILED');
        expect(res.body.errors.map((e: { path: string }) => e.path).sort(), JSON.stringify(body)).to.deep.equal([...paths].sort());
        for (const e of res.body.errors) expect(e.message).to.be.a('string').and.not.equal('');
      }
      expect(await countRows(ctx.db, 'trail_events')).to.equal(before);
      expect(await countRows(ctx.db, 'sign_in_failures')).to.equal(failuresBefore);
    });

    it('answers 400 INVALID_JSON to a body that is not JSON', async () => {
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const res = await agent.post('/api/session').set(CSRF_HEADER, csrf).set('Content-Type', 'application/json').send('{"username": "sam.operator", ');
      expect(res.status).to.equal(400);
      expect(res.body.code).to.equal('INVALID_JSON');
      expect(res.body.errors[0].message).to.be.a('string');
    });

    it('answers 415 to a body of another type', async () => {
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const form = await agent.post('/api/session').set(CSRF_HEADER, csrf).type('form').send('username=sam.operator&password=x');
      expect(form.status).to.equal(415);
      expect(form.body.code).to.equal('UNSUPPORTED_MEDIA_TYPE');
      const text = await agent.post('/api/session').set(CSRF_HEADER, csrf).set('Content-Type', 'text/plain').send('hello');
      expect(text.status).to.equal(415);
    });
  });

  describe('CSRF', () => {
    it('refuses a sign-in without a token, with a wrong one or with another session’s, writing nothing', async () => {
      const failures = await countRows(ctx.db, 'sign_in_failures');
      const events = await countRows(ctx.db, 'trail_events');
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const other = await anonymousAgent(ctx.app);
      const body = { username: operator.username, password: 'wrong-password' };
      for (const token of [undefined, 'x', csrf.replace(/^./, (c) => (c === 'a' ? 'b' : 'a')), other.csrf]) {
        const req = agent.post('/api/session');
        if (token !== undefined) req.set(CSRF_HEADER, token);
        const res = await req.send(body);
        expect(res.status, String(token)).to.equal(403);
        expect(res.body.code).to.equal('CSRF_INVALID');
      }
      expect(await countRows(ctx.db, 'sign_in_failures')).to.equal(failures);
      expect(await countRows(ctx.db, 'trail_events')).to.equal(events);
    });

    it('refuses a state change by a signed-in person without the token; nothing is written', async () => {
      const admin = await createPerson(ctx.db, { roles: ['admin'] });
      const { agent } = await signedInAgent(ctx.app, admin);
      const users = await countRows(ctx.db, 'users');
      const res = await agent.post('/api/users').send({ username: 'no.token', displayName: 'No Token', roles: [], temporaryPassword: 'long-enough-pw' });
      expect(res.status).to.equal(403);
      expect(res.body.code).to.equal('CSRF_INVALID');
      expect(await countRows(ctx.db, 'users')).to.equal(users);
    });

    it('refuses the anonymous token after sign-in (it belonged to the old session)', async () => {
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const res = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ username: operator.username, password: operator.password }).expect(200);
      const stale = await agent.patch('/api/session/preferences').set(CSRF_HEADER, csrf).send({ units: 'metric+imperial' });
      expect(stale.status).to.equal(403);
      const fresh = await agent.patch('/api/session/preferences').set(CSRF_HEADER, res.body.csrfToken).send({ units: 'metric' });
      expect(fresh.status).to.equal(200);
    });
  });

  describe('sessions', () => {
    function sidCookie(res: request.Response): string {
      return setCookie(res, 'kerfbook.sid')!.split(';')[0]!;
    }

    it('sign-out destroys the session: the old cookie no longer works', async () => {
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const signIn = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ username: operator.username, password: operator.password }).expect(200);
      const cookie = sidCookie(signIn);
      await request(ctx.app).get('/api/session').set('Cookie', cookie).expect(200);
      const out = await agent.delete('/api/session').set(CSRF_HEADER, signIn.body.csrfToken);
      expect(out.status).to.equal(204);
      expect(setCookie(out, 'kerfbook.sid')).to.match(/Expires=Thu, 01 Jan 1970/);
      const after = await request(ctx.app).get('/api/session').set('Cookie', cookie);
      expect(after.status).to.equal(401);
      expect(after.body.code).to.equal('NOT_SIGNED_IN');
      const last = await ctx.db('trail_events').orderBy('id', 'desc').first();
      expect(last.event_type).to.equal('session.signed_out');
    });

    it('treats a forged session cookie as signed out', async () => {
      for (const cookie of ['kerfbook.sid=s%3Aforged.c2lnbmF0dXJl', 'kerfbook.sid=plainvalue', 'kerfbook.sid=']) {
        const res = await request(ctx.app).get('/api/session').set('Cookie', cookie);
        expect(res.status, cookie).to.equal(401);
        expect(res.body.code).to.equal('NOT_SIGNED_IN');
      }
    });

    it('treats an expired session as signed out', async () => {
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const signIn = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ username: operator.username, password: operator.password }).expect(200);
      const cookie = sidCookie(signIn);
      const sid = decodeURIComponent(cookie.split('=')[1]!).slice(2).split('.')[0];
      const updated = await ctx
        .db('sessions')
        .where({ sid })
        .update({ expired: new Date(Date.now() - 60_000) });
      expect(updated).to.equal(1);
      const res = await request(ctx.app).get('/api/session').set('Cookie', cookie);
      expect(res.status).to.equal(401);
    });
  });

  describe('behind a TLS proxy (TRUST_PROXY)', () => {
    it('marks the cookies Secure when the proxy says the request came over https', async () => {
      const proxied = await buildTestApp(ctx.db, { config: { trustProxy: 'loopback' } });
      const tls = await request(proxied.app).get('/api/session/csrf').set('X-Forwarded-Proto', 'https').expect(200);
      expect(setCookie(tls, 'kerfbook.sid')).to.match(/;\s*Secure/i);
      expect(setCookie(tls, 'kerfbook.csrf')).to.match(/;\s*Secure/i);
      const plain = await request(proxied.app).get('/api/session/csrf').expect(200);
      expect(setCookie(plain, 'kerfbook.sid')).not.to.match(/;\s*Secure/i);
      expect(setCookie(plain, 'kerfbook.csrf')).not.to.match(/;\s*Secure/i);
      // Without trust proxy, the header is ignored.
      const untrusted = await request(ctx.app).get('/api/session/csrf').set('X-Forwarded-Proto', 'https').expect(200);
      expect(setCookie(untrusted, 'kerfbook.sid')).not.to.match(/;\s*Secure/i);
    });
  });
});
