/** Invitations: account, roles, machines, the 72 h link and its mail in one transaction; resend; the link sets a password once. */
import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { MACHINES } from '../../../server/services/stock/records';
import { createStock } from '../../../server/services/stock/stock';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { machineInput } from '../support/stock';
import { anonymousAgent, signedInAgent, type Agent } from '../support/test-app';
import { asJson, countRows } from '../support/test-database';
import { BASE_URL, mailsTo, tampered, tokenIn } from './accounts-support';

const SETUP = { userId: null, name: 'test set-up', clientAddress: '' };

describe('Account mails: invitations', () => {
  const ctx = apiTestContext({ appBaseUrl: BASE_URL });
  let admin: TestPerson;
  let agent: Agent;
  let csrf: string;
  let sawA: number;
  let sawB: number;
  let archived: number;

  before(async () => {
    await ctx.db('lab_settings').where({ id: 1 }).update({ lab_name: 'North Materials Lab' });
    admin = await createPerson(ctx.db, { username: 'ada.admin', displayName: 'Ada Admin', roles: ['admin'] });
    ({ agent, csrf } = await signedInAgent(ctx.app, admin));
    sawA = (await createStock(ctx.db, SETUP, MACHINES, machineInput({ name: 'Saw A' }))).id;
    sawB = (await createStock(ctx.db, SETUP, MACHINES, machineInput({ name: 'Saw B' }))).id;
    archived = (await createStock(ctx.db, SETUP, MACHINES, machineInput({ name: 'Old saw' }))).id;
    await ctx.db('machines').where({ id: archived }).update({ archived: true, archived_at: new Date() });
  });

  const post = (path: string, body?: object) => {
    const req = agent.post(path).set(CSRF_HEADER, csrf);
    return body ? req.send(body) : req;
  };
  async function publicPost(path: string, body: object) {
    const anon = await anonymousAgent(ctx.app);
    return anon.agent.post(path).set(CSRF_HEADER, anon.csrf).send(body);
  }

  it('creates the person, machines, link and mail in one go; the link sets the password once and the person signs in', async () => {
    const res = await post('/api/users/invitations', {
      username: 'olga.operator',
      displayName: 'Olga Berg',
      email: 'olga@lab.example',
      roles: ['operator'],
      machineIds: [sawB, sawA],
    });
    expect(res.status, JSON.stringify(res.body)).to.equal(201);
    expect(res.body).to.include({ username: 'olga.operator', active: true, mustChangePassword: false, invitationPending: true });
    expect(res.body.machineIds).to.deep.equal([sawA, sawB].sort((a, b) => a - b));

    const event = await ctx
      .db('trail_events')
      .where({ event_type: 'user.invited', entity_id: String(res.body.id) })
      .first();
    expect(event).to.include({ actor_user_id: admin.id, actor_name: 'Ada Admin' });
    expect(asJson(event.after_json)).to.include({ username: 'olga.operator', email: 'olga@lab.example' });

    const [mail, ...others] = await mailsTo(ctx.db, 'olga@lab.example');
    expect(others).to.have.length(0);
    expect(mail).to.include({ kind: 'invitation', subject: 'You are invited to Kerfbook — North Materials Lab' });
    expect(mail!.text_body).to.include('Ada Admin invited you').and.to.include('72 hours').and.to.include('olga.operator');
    const token = tokenIn(mail!.text_body);
    expect(mail!.html_body).to.include(`${BASE_URL}/set-password?token=${token}`);
    // Only the hash is stored.
    expect(JSON.stringify(await ctx.db('user_tokens'))).not.to.include(token);

    // The dev outbox shows the text with its link.
    const outbox = await agent.get('/api/dev/outbox').expect(200);
    expect(outbox.body.items.find((i: { to: string }) => i.to === 'olga@lab.example').text).to.include(token);

    // Nobody can sign in before the password is set.
    const anon = await anonymousAgent(ctx.app);
    await anon.agent.post('/api/session').set(CSRF_HEADER, anon.csrf).send({ username: 'olga.operator', password: '' }).expect(400);

    const info = await publicPost('/api/password/link', { token });
    expect(info.status, JSON.stringify(info.body)).to.equal(200);
    expect(info.body).to.include({ purpose: 'invitation', username: 'olga.operator', displayName: 'Olga Berg' });
    const hours = (Date.parse(info.body.expiresAt) - Date.now()) / 3_600_000;
    expect(hours).to.be.within(71.9, 72);

    const tamperedRes = await publicPost('/api/password/set', { token: tampered(token), newPassword: 'olga chose this one' });
    expect(tamperedRes.status).to.equal(400);
    expect(tamperedRes.body.code).to.equal('LINK_INVALID');

    const set = await publicPost('/api/password/set', { token, newPassword: 'olga chose this one' });
    expect(set.status, JSON.stringify(set.body)).to.equal(200);
    expect(set.body.message).to.be.a('string');
    expect(
      await ctx
        .db('trail_events')
        .where({ event_type: 'user.password_set_by_link', entity_id: String(res.body.id) })
        .first(),
    ).to.not.equal(undefined);

    const olga = await signedInAgent(ctx.app, { username: 'olga.operator', password: 'olga chose this one' });
    const me = await olga.agent.get('/api/session').expect(200);
    expect(me.body.user).to.include({ invitationPending: false, mustChangePassword: false });
    expect(me.body.user.machineIds).to.deep.equal(res.body.machineIds);
    expect(me.body.devOutbox).to.equal(true);

    const again = await publicPost('/api/password/set', { token, newPassword: 'someone else tries' });
    expect(again.status).to.equal(410);
    expect(again.body.code).to.equal('LINK_USED');
    const inspectAgain = await publicPost('/api/password/link', { token });
    expect(inspectAgain.status).to.equal(410);

    // Once a password is set, there is nothing to resend.
    const resend = await post(`/api/users/${res.body.id}/invitation`);
    expect(resend.status).to.equal(409);
  });

  it('lets only one of two requests with the same link set the password', async () => {
    const res = await post('/api/users/invitations', { username: 'twin.requests', displayName: 'Twin', email: 'twin@lab.example', roles: [] });
    expect(res.status).to.equal(201);
    const token = tokenIn((await mailsTo(ctx.db, 'twin@lab.example'))[0]!.text_body);
    const answers = await Promise.all([
      publicPost('/api/password/set', { token, newPassword: 'first of the two' }),
      publicPost('/api/password/set', { token, newPassword: 'second of the two' }),
    ]);
    expect(answers.map((a) => a.status).sort()).to.deep.equal([200, 410]);
    expect(await ctx.db('trail_events').where({ event_type: 'user.password_set_by_link', entity_id: String(res.body.id) })).to.have.length(1);
  });

  it('refuses an expired link with 410 LINK_EXPIRED and a clear message', async () => {
    const res = await post('/api/users/invitations', { username: 'late.comer', displayName: 'Late', email: 'late@lab.example', roles: [] });
    const token = tokenIn((await mailsTo(ctx.db, 'late@lab.example'))[0]!.text_body);
    await ctx
      .db('user_tokens')
      .where({ user_id: res.body.id })
      .update({ expires_at: new Date(Date.now() - 1000) });
    for (const path of ['/api/password/link', '/api/password/set']) {
      const answer = await publicPost(path, path.endsWith('/set') ? { token, newPassword: 'too late for this' } : { token });
      expect(answer.status, path).to.equal(410);
      expect(answer.body.code).to.equal('LINK_EXPIRED');
      expect(answer.body.errors[0].message).to.match(/^This link has expired\. Ask for a new one/);
    }
    // Still pending: the admin can send a new one.
    const person = await agent.get(`/api/users/${res.body.id}`).expect(200);
    expect(person.body.invitationPending).to.equal(true);
  });

  it('resends: a new 72 h link, the older one void; 409 for a deactivated person', async () => {
    const res = await post('/api/users/invitations', { username: 'second.chance', displayName: 'Sam Chance', email: 'chance@lab.example', roles: ['author'] });
    const first = tokenIn((await mailsTo(ctx.db, 'chance@lab.example'))[0]!.text_body);
    const resend = await post(`/api/users/${res.body.id}/invitation`);
    expect(resend.status, JSON.stringify(resend.body)).to.equal(200);
    expect(resend.body.message).to.include('chance@lab.example');
    const mails = await mailsTo(ctx.db, 'chance@lab.example');
    expect(mails).to.have.length(2);
    const second = tokenIn(mails[1]!.text_body);
    expect(second).to.not.equal(first);
    expect((await publicPost('/api/password/link', { token: first })).body.code).to.equal('LINK_USED');
    expect((await publicPost('/api/password/link', { token: second })).status).to.equal(200);
    expect(await ctx.db('trail_events').where({ event_type: 'user.invitation_resent', entity_id: String(res.body.id) })).to.have.length(1);

    await post(`/api/users/${res.body.id}/deactivate`).expect(200);
    const refused = await post(`/api/users/${res.body.id}/invitation`);
    expect(refused.status).to.equal(409);
    // A deactivated person's link no longer works either.
    const link = await publicPost('/api/password/link', { token: second });
    expect(link.status).to.equal(400);
    expect(link.body.code).to.equal('LINK_INVALID');
  });

  it('answers 409 on a taken username and 400 on machineIds for an unknown or archived machine, writing nothing', async () => {
    const counts = async () => ({
      users: await countRows(ctx.db, 'users'),
      tokens: await countRows(ctx.db, 'user_tokens'),
      mails: await countRows(ctx.db, 'mail_outbox'),
      events: await countRows(ctx.db, 'trail_events'),
      machines: await countRows(ctx.db, 'user_machines'),
    });
    const before = await counts();
    const taken = await post('/api/users/invitations', { username: 'OLGA.operator', displayName: 'Other', email: 'other@lab.example', roles: [] });
    expect(taken.status).to.equal(409);
    expect(taken.body.errors[0].path).to.equal('username');
    for (const machineIds of [[sawA, 999999], [archived]]) {
      const bad = await post('/api/users/invitations', { username: 'new.one', displayName: 'New', email: 'new@lab.example', roles: ['operator'], machineIds });
      expect(bad.status, JSON.stringify(bad.body)).to.equal(400);
      expect(bad.body.errors[0].path).to.equal('machineIds');
      expect(bad.body.errors[0].message).to.match(/does not exist or is archived/);
    }
    const noMail = await post('/api/users/invitations', { username: 'new.one', displayName: 'New', roles: [] });
    expect(noMail.status).to.equal(400);
    expect(noMail.body.errors[0].path).to.equal('email');
    expect(await counts()).to.deep.equal(before);
  });

  it('is for admins only', async () => {
    const author = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['author'] }));
    const res = await author.agent
      .post('/api/users/invitations')
      .set(CSRF_HEADER, author.csrf)
      .send({ username: 'sneaky', displayName: 'S', email: 's@lab.example', roles: [] });
    expect(res.status).to.equal(403);
  });
});
