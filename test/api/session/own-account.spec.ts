import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { verifyPassword } from '../../../server/services/auth/passwords';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { signedInAgent } from '../support/test-app';
import { asJson, countRows } from '../support/test-database';

describe('Own account (any signed-in person)', () => {
  const ctx = apiTestContext();
  let person: TestPerson;

  before(async () => {
    person = await createPerson(ctx.db, { username: 'mara.auditor', roles: ['auditor'], password: 'original-pass-1' });
  });

  describe('POST /api/session/password', () => {
    it('refuses a wrong current password with a field error and changes nothing', async () => {
      const { agent, csrf } = await signedInAgent(ctx.app, person);
      const hashBefore = (await ctx.db('users').where({ id: person.id }).first()).password_hash;
      const events = await countRows(ctx.db, 'trail_events');
      const res = await agent.post('/api/session/password').set(CSRF_HEADER, csrf).send({ currentPassword: 'not-it-at-all', newPassword: 'brand-new-pass-1' });
      expect(res.status).to.equal(400);
      expect(res.body.code).to.equal('VALIDATION_FAILED');
      expect(res.body.errors).to.deep.equal([{ path: 'currentPassword', message: 'The current password is not correct.' }]);
      const row = await ctx.db('users').where({ id: person.id }).first();
      expect(row.password_hash).to.equal(hashBefore);
      // The wrong password is recorded in the trail (it counts toward the person's limit), and that is all.
      expect(await countRows(ctx.db, 'trail_events')).to.equal(events + 1);
      const [last] = await ctx.db('trail_events').orderBy('id', 'desc').limit(1);
      expect(last.event_type).to.equal('user.current_password_wrong');
      expect(JSON.stringify(last)).not.to.match(/not-it-at-all/);
      await agent.get('/api/session').expect(200);
    });

    it('refuses a new password that is too short or equal to the current one', async () => {
      const { agent, csrf } = await signedInAgent(ctx.app, person);
      const short = await agent.post('/api/session/password').set(CSRF_HEADER, csrf).send({ currentPassword: person.password, newPassword: 'short' });
      expect(short.status).to.equal(400);
      expect(short.body.errors[0].path).to.equal('newPassword');
      const same = await agent.post('/api/session/password').set(CSRF_HEADER, csrf).send({ currentPassword: person.password, newPassword: person.password });
      expect(same.status).to.equal(400);
      expect(same.body.errors[0].path).to.equal('newPassword');
    });

    it('changes it: new session id, fresh token, other sessions end, one trail row without secrets', async () => {
      const other = await signedInAgent(ctx.app, person);
      const { agent, csrf } = await signedInAgent(ctx.app, person);
      const events = await countRows(ctx.db, 'trail_events');
      const res = await agent
        .post('/api/session/password')
        .set(CSRF_HEADER, csrf)
        .send({ currentPassword: person.password, newPassword: 'Neue-Passphrase-Ü1' });
      expect(res.status, JSON.stringify(res.body)).to.equal(200);
      expect(res.body.user.id).to.equal(person.id);
      expect(res.body.csrfToken).to.be.a('string').and.not.equal(csrf);
      expect(res.headers['set-cookie']?.toString()).to.match(/kerfbook\.sid=/);

      // This session carries on with the new token; the other one is signed out.
      await agent.get('/api/session').expect(200);
      const prefs = await agent.patch('/api/session/preferences').set(CSRF_HEADER, res.body.csrfToken).send({ units: 'metric' });
      expect(prefs.status).to.equal(200);
      expect((await other.agent.get('/api/session')).status).to.equal(401);

      const row = await ctx.db('users').where({ id: person.id }).first();
      expect(await verifyPassword('Neue-Passphrase-Ü1', row.password_hash)).to.equal(true);
      expect(await verifyPassword(person.password, row.password_hash)).to.equal(false);
      const added = await ctx
        .db('trail_events')
        .orderBy('id', 'desc')
        .limit((await countRows(ctx.db, 'trail_events')) - events);
      expect(added.map((e: { event_type: string }) => e.event_type)).to.deep.equal(['user.password_changed']);
      expect(JSON.stringify(added)).not.to.match(/Neue-Passphrase|original-pass|scrypt/);
      person.password = 'Neue-Passphrase-Ü1';
    });
  });

  describe('PATCH /api/session/preferences', () => {
    it('saves the unit preference with one trail row', async () => {
      const { agent, csrf } = await signedInAgent(ctx.app, person);
      const mark = await countRows(ctx.db, 'trail_events');
      const res = await agent.patch('/api/session/preferences').set(CSRF_HEADER, csrf).send({ units: 'metric+imperial' });
      expect(res.status).to.equal(200);
      expect(res.body.user.units).to.equal('metric+imperial');
      expect(res.body.csrfToken).to.be.a('string');
      expect(await countRows(ctx.db, 'trail_events')).to.equal(mark + 1);
      const event = await ctx.db('trail_events').orderBy('id', 'desc').first();
      expect(event.event_type).to.equal('user.preferences_changed');
      expect(asJson(event.before_json)).to.deep.equal({ units: 'metric' });
      expect(asJson(event.after_json)).to.deep.equal({ units: 'metric+imperial' });
      const me = await agent.get('/api/session').expect(200);
      expect(me.body.user.units).to.equal('metric+imperial');
    });

    it('answers 400 to an unknown unit and writes nothing', async () => {
      const { agent, csrf } = await signedInAgent(ctx.app, person);
      const mark = await countRows(ctx.db, 'trail_events');
      for (const body of [{ units: 'imperial' }, {}, { units: 'metric', theme: 'dark' }]) {
        const res = await agent.patch('/api/session/preferences').set(CSRF_HEADER, csrf).send(body);
        expect(res.status, JSON.stringify(body)).to.equal(400);
        expect(res.body.code).to.equal('VALIDATION_FAILED');
      }
      expect(await countRows(ctx.db, 'trail_events')).to.equal(mark);
    });
  });
});
