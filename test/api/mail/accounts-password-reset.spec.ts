/** "Forgot password": the same answer and time for any address, a 1 h link for active accounts, a limit per hour; the link ends other sessions. */
import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { FORGOT_FLOOR_MS, FORGOT_MESSAGE } from '../../../server/services/auth/password-links';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { anonymousAgent, signedInAgent } from '../support/test-app';
import { BASE_URL, mailsTo, tokenIn } from './accounts-support';

describe('Account mails: forgot password', () => {
  const ctx = apiTestContext({ appBaseUrl: BASE_URL });
  let pia: TestPerson;

  before(async () => {
    pia = await createPerson(ctx.db, { username: 'pia.author', displayName: 'Pia Lund', roles: ['author'] });
    await createPerson(ctx.db, { username: 'gone.author', displayName: 'Gone', roles: ['author'], active: false });
  });

  async function publicPost(path: string, body: object) {
    const anon = await anonymousAgent(ctx.app);
    const started = Date.now();
    const res = await anon.agent.post(path).set(CSRF_HEADER, anon.csrf).send(body);
    return { res, ms: Date.now() - started };
  }

  it('answers the same 202 for a known and an unknown address, both no sooner than the floor; only the known one gets a mail', async () => {
    const known = await publicPost('/api/password/forgot', { email: 'PIA.author@lab.example ' });
    const unknown = await publicPost('/api/password/forgot', { email: 'nobody@lab.example' });
    for (const { res, ms } of [known, unknown]) {
      expect(res.status).to.equal(202);
      expect(res.body).to.deep.equal({ message: FORGOT_MESSAGE });
      expect(ms).to.be.at.least(FORGOT_FLOOR_MS - 5);
    }
    expect(await mailsTo(ctx.db, 'nobody@lab.example')).to.have.length(0);
    const [mail, ...more] = await mailsTo(ctx.db, 'pia.author@lab.example');
    expect(more).to.have.length(0);
    expect(mail).to.include({ kind: 'password-reset' });
    expect(mail!.text_body).to.include('one hour').and.to.include('pia.author');
    expect(mail!.html_body).to.include('/set-password?token=');
    const token = tokenIn(mail!.text_body);

    const anon = await anonymousAgent(ctx.app);
    const info = await anon.agent.post('/api/password/link').set(CSRF_HEADER, anon.csrf).send({ token }).expect(200);
    expect(info.body).to.include({ purpose: 'password-reset', username: 'pia.author' });
    const minutes = (Date.parse(info.body.expiresAt) - Date.now()) / 60_000;
    expect(minutes).to.be.within(59, 60);
    expect(await ctx.db('trail_events').where({ event_type: 'user.password_reset_requested', entity_id: String(pia.id) })).to.have.length(1);
  });

  it('sends nothing to a deactivated account', async () => {
    const { res } = await publicPost('/api/password/forgot', { email: 'gone.author@lab.example' });
    expect(res.status).to.equal(202);
    expect(res.body).to.deep.equal({ message: FORGOT_MESSAGE });
    expect(await mailsTo(ctx.db, 'gone.author@lab.example')).to.have.length(0);
  });

  it('refuses a malformed address with 400 on email', async () => {
    const { res } = await publicPost('/api/password/forgot', { email: 'not an address' });
    expect(res.status).to.equal(400);
    expect(res.body.errors[0].path).to.equal('email');
  });

  it('sends at most 3 reset mails per address in an hour, answering alike after that; only the newest link works', async () => {
    const person = await createPerson(ctx.db, { username: 'rate.limited', roles: ['operator'] });
    for (let i = 0; i < 5; i += 1) {
      const { res } = await publicPost('/api/password/forgot', { email: 'rate.limited@lab.example' });
      expect(res.status).to.equal(202);
      expect(res.body).to.deep.equal({ message: FORGOT_MESSAGE });
    }
    const mails = await mailsTo(ctx.db, 'rate.limited@lab.example');
    expect(mails).to.have.length(3);
    const anon = await anonymousAgent(ctx.app);
    const first = await anon.agent
      .post('/api/password/link')
      .set(CSRF_HEADER, anon.csrf)
      .send({ token: tokenIn(mails[0]!.text_body) });
    expect(first.status).to.equal(410);
    expect(first.body.code).to.equal('LINK_USED');
    await anon.agent
      .post('/api/password/link')
      .set(CSRF_HEADER, anon.csrf)
      .send({ token: tokenIn(mails[2]!.text_body) })
      .expect(200);

    // An hour later the limit lets another one through.
    await ctx
      .db('user_tokens')
      .where({ user_id: person.id })
      .update({ created_at: new Date(Date.now() - 61 * 60_000) });
    await publicPost('/api/password/forgot', { email: 'rate.limited@lab.example' });
    expect(await mailsTo(ctx.db, 'rate.limited@lab.example')).to.have.length(4);
  });

  it('sets a new password with the link, ends every other session and clears a pending temporary password', async () => {
    const person = await createPerson(ctx.db, { username: 'ren.resets', roles: ['author'], mustChangePassword: true });
    const other = await signedInAgent(ctx.app, person);
    await other.agent.get('/api/session').expect(200);

    await publicPost('/api/password/forgot', { email: 'ren.resets@lab.example' });
    const token = tokenIn((await mailsTo(ctx.db, 'ren.resets@lab.example'))[0]!.text_body);
    const { res } = await publicPost('/api/password/set', { token, newPassword: 'a brand new secret' });
    expect(res.status, JSON.stringify(res.body)).to.equal(200);

    await other.agent.get('/api/session').expect(401);
    const again = await signedInAgent(ctx.app, { username: 'ren.resets', password: 'a brand new secret' });
    const me = await again.agent.get('/api/session').expect(200);
    expect(me.body.user.mustChangePassword).to.equal(false);
    const anon = await anonymousAgent(ctx.app);
    const old = await anon.agent.post('/api/session').set(CSRF_HEADER, anon.csrf).send({ username: 'ren.resets', password: person.password });
    expect(old.status).to.equal(401);
    const event = await ctx
      .db('trail_events')
      .where({ event_type: 'user.password_set_by_link', entity_id: String(person.id) })
      .first();
    expect(event).to.include({ actor_user_id: person.id });
    expect(JSON.stringify(event)).not.to.include('a brand new secret');
  });

  it('voids every open link of the person when a password is set', async () => {
    const person = await createPerson(ctx.db, { username: 'two.links', roles: [] });
    await publicPost('/api/password/forgot', { email: 'two.links@lab.example' });
    const reset = tokenIn((await mailsTo(ctx.db, 'two.links@lab.example'))[0]!.text_body);
    // A second open link of another purpose (as if an invitation were still open).
    const admin = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['admin'] }));
    await ctx.db('user_tokens').insert({
      user_id: person.id,
      purpose: 'invitation',
      token_sha256: 'f'.repeat(64),
      created_at: new Date(),
      expires_at: new Date(Date.now() + 3_600_000),
      used_at: null,
      created_by: null,
    });
    expect((await admin.agent.get(`/api/users/${person.id}`).expect(200)).body.invitationPending).to.equal(true);
    await publicPost('/api/password/set', { token: reset, newPassword: 'fresh and long enough' });
    expect(await ctx.db('user_tokens').where({ user_id: person.id }).whereNull('used_at')).to.have.length(0);
    expect((await admin.agent.get(`/api/users/${person.id}`).expect(200)).body.invitationPending).to.equal(false);
  });
});
