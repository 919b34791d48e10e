import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { signedInAgent, type Agent } from '../support/test-app';
import { asJson, countRows } from '../support/test-database';

describe('People (admin)', () => {
  const ctx = apiTestContext();
  let admin: TestPerson;
  let agent: Agent;
  let csrf: string;

  before(async () => {
    admin = await createPerson(ctx.db, { username: 'ada.admin', displayName: 'Ada Admin', roles: ['admin'] });
    ({ agent, csrf } = await signedInAgent(ctx.app, admin));
  });

  async function eventsSince(id: number) {
    return ctx.db('trail_events').where('id', '>', id).orderBy('id');
  }
  async function lastEventId(): Promise<number> {
    const row = await ctx.db('trail_events').max<{ m: number | null }[]>({ m: 'id' }).first();
    return Number(row?.m ?? 0);
  }
  const post = (path: string, body?: object) => {
    const req = agent.post(path).set(CSRF_HEADER, csrf);
    return body ? req.send(body) : req;
  };

  describe('create', () => {
    it('creates a person with a temporary password and one trail row without the password', async () => {
      const mark = await lastEventId();
      const res = await post('/api/users', {
        username: 'New.Person',
        displayName: '  Nadia Quist ',
        email: 'nadia@lab.example',
        roles: ['operator', 'author'],
        temporaryPassword: 'first-temp-pass',
      });
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      expect(res.body).to.include({
        username: 'new.person',
        displayName: 'Nadia Quist',
        email: 'nadia@lab.example',
        active: true,
        mustChangePassword: true,
        units: 'metric',
      });
      expect(res.body.roles).to.deep.equal(['author', 'operator']);
      expect(res.body).not.to.have.property('passwordHash');
      const events = await eventsSince(mark);
      expect(events).to.have.length(1);
      expect(events[0]).to.include({
        event_type: 'user.created',
        actor_user_id: admin.id,
        actor_name: 'Ada Admin',
        entity_type: 'user',
        entity_id: String(res.body.id),
      });
      expect(events[0].before_json).to.equal(null);
      expect(asJson(events[0].after_json)).to.include({ username: 'new.person', mustChangePassword: true });
      expect(JSON.stringify(events)).not.to.match(/first-temp-pass|scrypt/);
    });

    it('answers 409 CONFLICT on a taken username (any case), writing nothing', async () => {
      const users = await countRows(ctx.db, 'users');
      const mark = await lastEventId();
      const res = await post('/api/users', { username: 'NEW.person', displayName: 'Someone Else', roles: [], temporaryPassword: 'another-temp-pass' });
      expect(res.status).to.equal(409);
      expect(res.body.code).to.equal('CONFLICT');
      expect(res.body.errors[0].path).to.equal('username');
      expect(await countRows(ctx.db, 'users')).to.equal(users);
      expect(await eventsSince(mark)).to.have.length(0);
    });

    it('answers 400 with field errors for bad input and writes nothing', async () => {
      const users = await countRows(ctx.db, 'users');
      const events = await countRows(ctx.db, 'trail_events');
      const cases: [object, string][] = [
        [{ username: 'jürgen', displayName: 'J', roles: [], temporaryPassword: 'long-enough-1' }, 'username'],
        [{ username: 'ab', displayName: 'J', roles: [], temporaryPassword: 'long-enough-1' }, 'username'],
        [{ username: 'ok.name', displayName: '', roles: [], temporaryPassword: 'long-enough-1' }, 'displayName'],
        [{ username: 'ok.name', displayName: 'J', roles: ['boss'], temporaryPassword: 'long-enough-1' }, 'roles.0'],
        [{ username: 'ok.name', displayName: 'J', roles: ['admin', 'admin'], temporaryPassword: 'long-enough-1' }, 'roles'],
        [{ username: 'ok.name', displayName: 'J', roles: [], temporaryPassword: 'short' }, 'temporaryPassword'],
        [{ username: 'ok.name', displayName: 'J', email: 'not-an-address', roles: [], temporaryPassword: 'long-enough-1' }, 'email'],
        [{ username: 'ok.name', displayName: 'J', roles: [], temporaryPassword: 'long-enough-1', isAdmin: true }, ''],
      ];
      for (const [body, path] of cases) {
        const res = await post('/api/users', body);
        expect(res.status, JSON.stringify(body)).to.equal(400);
        expect(res.body.code).to.equal('VALIDATION_FAILED');
        expect(
          res.body.errors.map((e: { path: string }) => e.path),
          JSON.stringify(body),
        ).to.include(path);
      }
      expect(await countRows(ctx.db, 'users')).to.equal(users);
      expect(await countRows(ctx.db, 'trail_events')).to.equal(events);
    });

    it('stores SQL-looking and non-ASCII names verbatim', async () => {
      const name = "Robert'); DROP TABLE users;-- Ø Ångström";
      const res = await post('/api/users', { username: 'bobby.tables', displayName: name, roles: [], temporaryPassword: 'long-enough-1' });
      expect(res.status).to.equal(201);
      const got = await agent.get(`/api/users/${res.body.id}`).expect(200);
      expect(got.body.displayName).to.equal(name);
      expect(await ctx.db.schema.hasTable('users')).to.equal(true);
    });
  });

  describe('list', () => {
    before(async () => {
      await createPerson(ctx.db, { username: 'zed.operator', displayName: 'Zed 100% Sure', roles: ['operator'] });
      await createPerson(ctx.db, { username: 'under_score', displayName: 'Una Score', roles: ['auditor'] });
      await createPerson(ctx.db, { username: 'gone.author', displayName: 'Gone Away', roles: ['author'], active: false });
    });

    it('pages, sorts and counts', async () => {
      const total = await countRows(ctx.db, 'users');
      const first = await agent.get('/api/users').query({ pageSize: 2, sort: 'username', dir: 'asc' }).expect(200);
      expect(first.body).to.include({ total, page: 0, pageSize: 2 });
      expect(first.body.items).to.have.length(2);
      const all = await agent.get('/api/users').query({ pageSize: 100 }).expect(200);
      const names = all.body.items.map((u: { username: string }) => u.username);
      expect(names).to.deep.equal([...names].sort());
      const second = await agent.get('/api/users').query({ pageSize: 2, page: 1 }).expect(200);
      expect(second.body.items[0].username).to.equal(names[2]);
      const desc = await agent.get('/api/users').query({ pageSize: 100, sort: 'displayName', dir: 'desc' }).expect(200);
      const display = desc.body.items.map((u: { displayName: string }) => u.displayName.toLowerCase());
      expect(display).to.deep.equal([...display].sort().reverse());
      for (const u of all.body.items) expect(u).not.to.have.property('passwordHash');
    });

    it('searches username, name and e-mail, taking % and _ literally', async () => {
      const byName = await agent.get('/api/users').query({ q: 'una sc' }).expect(200);
      expect(byName.body.items.map((u: { username: string }) => u.username)).to.deep.equal(['under_score']);
      const percent = await agent.get('/api/users').query({ q: '100%' }).expect(200);
      expect(percent.body.items.map((u: { username: string }) => u.username)).to.deep.equal(['zed.operator']);
      const underscore = await agent.get('/api/users').query({ q: '_' }).expect(200);
      expect(underscore.body.items.map((u: { username: string }) => u.username)).to.deep.equal(['under_score']);
      const byMail = await agent.get('/api/users').query({ q: 'gone.author@lab' }).expect(200);
      expect(byMail.body.total).to.equal(1);
      const none = await agent.get('/api/users').query({ q: "' OR 1=1 --" }).expect(200);
      expect(none.body.total).to.equal(0);
    });

    it('filters by role and status', async () => {
      const auditors = await agent.get('/api/users').query({ role: 'auditor' }).expect(200);
      expect(auditors.body.items.every((u: { roles: string[] }) => u.roles.includes('auditor'))).to.equal(true);
      expect(auditors.body.total).to.equal(1);
      const inactive = await agent.get('/api/users').query({ status: 'inactive' }).expect(200);
      expect(inactive.body.items.map((u: { username: string }) => u.username)).to.deep.equal(['gone.author']);
      const active = await agent.get('/api/users').query({ status: 'active', pageSize: 100 }).expect(200);
      expect(active.body.items.every((u: { active: boolean }) => u.active)).to.equal(true);
    });

    it('answers 400 to a bad query', async () => {
      for (const query of [{ pageSize: 1000 }, { page: -1 }, { sort: 'password_hash' }, { role: 'boss' }, { status: 'deleted' }, { extra: 1 }]) {
        const res = await agent.get('/api/users').query(query);
        expect(res.status, JSON.stringify(query)).to.equal(400);
        expect(res.body.code).to.equal('VALIDATION_FAILED');
      }
    });
  });

  describe('get, update', () => {
    let person: TestPerson;
    before(async () => {
      person = await createPerson(ctx.db, { username: 'pia.operator', displayName: 'Pia Lund', roles: ['operator'] });
    });

    it('gets one person; 404 for an unknown id; 400 for a non-number id', async () => {
      const res = await agent.get(`/api/users/${person.id}`).expect(200);
      expect(res.body).to.include({ id: person.id, username: 'pia.operator' });
      const missing = await agent.get('/api/users/999999');
      expect(missing.status).to.equal(404);
      expect(missing.body.code).to.equal('NOT_FOUND');
      const bad = await agent.get('/api/users/abc');
      expect(bad.status).to.equal(400);
      expect(bad.body.errors[0].path).to.equal('id');
    });

    it('changes name and e-mail with one trail row holding before and after', async () => {
      const mark = await lastEventId();
      const res = await agent.patch(`/api/users/${person.id}`).set(CSRF_HEADER, csrf).send({ displayName: 'Pia Lund-Berg', email: 'pia@lab.example' });
      expect(res.status).to.equal(200);
      expect(res.body).to.include({ displayName: 'Pia Lund-Berg', email: 'pia@lab.example' });
      const events = await eventsSince(mark);
      expect(events).to.have.length(1);
      expect(events[0].event_type).to.equal('user.details_changed');
      expect(asJson(events[0].before_json)).to.deep.equal({ displayName: 'Pia Lund', email: 'pia.operator@lab.example' });
      expect(asJson(events[0].after_json)).to.deep.equal({ displayName: 'Pia Lund-Berg', email: 'pia@lab.example' });
    });

    it('changes roles with one trail row holding before and after', async () => {
      const mark = await lastEventId();
      const res = await agent
        .patch(`/api/users/${person.id}`)
        .set(CSRF_HEADER, csrf)
        .send({ roles: ['approver', 'operator'] });
      expect(res.status).to.equal(200);
      expect(res.body.roles).to.deep.equal(['approver', 'operator']);
      const events = await eventsSince(mark);
      expect(events).to.have.length(1);
      expect(events[0].event_type).to.equal('user.roles_changed');
      expect(asJson(events[0].before_json)).to.deep.equal({ roles: ['operator'] });
      expect(asJson(events[0].after_json)).to.deep.equal({ roles: ['approver', 'operator'] });
    });

    it('writes nothing for a change that changes nothing, or for bad input', async () => {
      const mark = await lastEventId();
      await agent
        .patch(`/api/users/${person.id}`)
        .set(CSRF_HEADER, csrf)
        .send({ roles: ['operator', 'approver'] })
        .expect(200);
      for (const body of [{}, { roles: ['boss'] }, { displayName: '' }, { username: 'renamed' }]) {
        const res = await agent.patch(`/api/users/${person.id}`).set(CSRF_HEADER, csrf).send(body);
        expect(res.status, JSON.stringify(body)).to.equal(400);
      }
      expect(await eventsSince(mark)).to.have.length(0);
      const row = await ctx.db('users').where({ id: person.id }).first();
      expect(row.display_name).to.equal('Pia Lund-Berg');
    });

    it('refuses to let an admin remove their own admin role', async () => {
      const mark = await lastEventId();
      const res = await agent
        .patch(`/api/users/${admin.id}`)
        .set(CSRF_HEADER, csrf)
        .send({ roles: ['approver'] });
      expect(res.status).to.equal(409);
      expect(res.body.errors[0]).to.include({ path: 'roles' });
      expect(res.body.errors[0].message).to.match(/own admin role/);
      expect(await eventsSince(mark)).to.have.length(0);
      const roles = await ctx.db('user_roles').where({ user_id: admin.id }).pluck('role');
      expect(roles).to.deep.equal(['admin']);
    });

    it('refuses to let anyone give themselves a role: an admin who made themselves approver could approve alone', async () => {
      for (const extra of ['approver', 'author', 'auditor'] as const) {
        const mark = await lastEventId();
        const res = await agent
          .patch(`/api/users/${admin.id}`)
          .set(CSRF_HEADER, csrf)
          .send({ roles: ['admin', extra] });
        expect(res.status, extra).to.equal(409);
        expect(res.body.errors[0], extra).to.include({ path: 'roles' });
        expect(res.body.errors[0].message, extra).to.match(/cannot give yourself .*another admin/i);
        expect(await eventsSince(mark), extra).to.have.length(0);
      }
      expect(await ctx.db('user_roles').where({ user_id: admin.id }).pluck('role')).to.deep.equal(['admin']);
      // Another admin grants it, with the trail naming who did.
      const second = await createPerson(ctx.db, { username: 'bo.admin', displayName: 'Bo Admin', roles: ['admin'] });
      const other = await signedInAgent(ctx.app, second);
      const mark = await lastEventId();
      const granted = await other.agent
        .patch(`/api/users/${admin.id}`)
        .set(CSRF_HEADER, other.csrf)
        .send({ roles: ['admin', 'approver'] });
      expect(granted.status).to.equal(200);
      const [event] = await eventsSince(mark);
      expect(event).to.include({ event_type: 'user.roles_changed', actor_user_id: second.id, entity_id: String(admin.id) });
      // Giving up a role of one's own (not the last admin's) stays possible.
      expect(
        (
          await agent
            .patch(`/api/users/${admin.id}`)
            .set(CSRF_HEADER, csrf)
            .send({ roles: ['admin'] })
        ).status,
      ).to.equal(200);
    });
  });

  describe('deactivate, reactivate', () => {
    let person: TestPerson;
    before(async () => {
      person = await createPerson(ctx.db, { username: 'ivo.author', roles: ['author'] });
    });

    it('deactivates: one trail row, the person keeps their data, their open sessions end', async () => {
      const theirs = await signedInAgent(ctx.app, person);
      await theirs.agent.get('/api/session').expect(200);
      const mark = await lastEventId();
      const res = await post(`/api/users/${person.id}/deactivate`);
      expect(res.status).to.equal(200);
      expect(res.body).to.include({ id: person.id, active: false });
      const events = await eventsSince(mark);
      expect(events).to.have.length(1);
      expect(events[0]).to.include({ event_type: 'user.deactivated', entity_id: String(person.id) });
      expect(asJson(events[0].before_json)).to.deep.equal({ active: true });
      expect(asJson(events[0].after_json)).to.deep.equal({ active: false });
      const after = await theirs.agent.get('/api/session');
      expect(after.status).to.equal(401);
      expect(await ctx.db('users').where({ id: person.id }).first()).to.include({ username: 'ivo.author' });
      const again = await post(`/api/users/${person.id}/deactivate`);
      expect(again.status).to.equal(409);
    });

    it('reactivates with one trail row; the person can sign in again', async () => {
      const mark = await lastEventId();
      const res = await post(`/api/users/${person.id}/reactivate`);
      expect(res.status).to.equal(200);
      expect(res.body.active).to.equal(true);
      const events = await eventsSince(mark);
      expect(events).to.have.length(1);
      expect(events[0].event_type).to.equal('user.reactivated');
      await signedInAgent(ctx.app, person);
      expect((await post(`/api/users/${person.id}/reactivate`)).status).to.equal(409);
    });

    it('refuses self-deactivation', async () => {
      const mark = await lastEventId();
      const res = await post(`/api/users/${admin.id}/deactivate`);
      expect(res.status).to.equal(409);
      expect(res.body.errors[0].message).to.match(/your own account/);
      expect(await eventsSince(mark)).to.have.length(0);
      await agent.get('/api/session').expect(200);
    });

    it('answers 404 for an unknown person', async () => {
      expect((await post('/api/users/999999/deactivate')).status).to.equal(404);
      expect((await post('/api/users/999999/reactivate')).status).to.equal(404);
    });
  });

  describe('temporary password', () => {
    it('sets it (one trail row without the password), ends their sessions, and forces a change', async () => {
      const person = await createPerson(ctx.db, { username: 'temp.operator', roles: ['operator'] });
      const theirs = await signedInAgent(ctx.app, person);
      const mark = await lastEventId();
      const res = await post(`/api/users/${person.id}/temporary-password`, { password: 'fresh-temp-pass-1' });
      expect(res.status).to.equal(200);
      expect(res.body.mustChangePassword).to.equal(true);
      const events = await eventsSince(mark);
      expect(events).to.have.length(1);
      expect(events[0].event_type).to.equal('user.temporary_password_set');
      expect(JSON.stringify(events)).not.to.match(/fresh-temp-pass-1|scrypt/);
      expect((await theirs.agent.get('/api/session')).status).to.equal(401);

      // The old password no longer works; the temporary one does, with a change pending.
      const { agent: anon } = await signedInAgent(ctx.app, { username: person.username, password: 'fresh-temp-pass-1' });
      const me = await anon.get('/api/session').expect(200);
      expect(me.body.user.mustChangePassword).to.equal(true);
      const blocked = await anon.patch('/api/session/preferences').set(CSRF_HEADER, me.body.csrfToken).send({ units: 'metric+imperial' });
      expect(blocked.status).to.equal(403);
      expect(blocked.body.code).to.equal('PASSWORD_CHANGE_REQUIRED');

      const changed = await anon
        .post('/api/session/password')
        .set(CSRF_HEADER, me.body.csrfToken)
        .send({ currentPassword: 'fresh-temp-pass-1', newPassword: 'my-own-password-1' });
      expect(changed.status, JSON.stringify(changed.body)).to.equal(200);
      expect(changed.body.user.mustChangePassword).to.equal(false);
      const allowed = await anon.patch('/api/session/preferences').set(CSRF_HEADER, changed.body.csrfToken).send({ units: 'metric+imperial' });
      expect(allowed.status).to.equal(200);
    });

    it('answers 400 for a too-short password, writing nothing; refuses one’s own', async () => {
      const person = await createPerson(ctx.db, { roles: ['auditor'] });
      const events = await countRows(ctx.db, 'trail_events');
      const res = await post(`/api/users/${person.id}/temporary-password`, { password: 'short' });
      expect(res.status).to.equal(400);
      expect(res.body.errors[0].path).to.equal('password');
      expect(await countRows(ctx.db, 'trail_events')).to.equal(events);
      const row = await ctx.db('users').where({ id: person.id }).first();
      expect(row.must_change_password).to.equal(0);
      const own = await post(`/api/users/${admin.id}/temporary-password`, { password: 'long-enough-99' });
      expect(own.status).to.equal(409);
    });
  });
});
