/** Machines a person runs: set on create and PATCH (the list replaces the set), shown ascending, audited; bad ids change nothing. */
import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { MACHINES } from '../../../server/services/stock/records';
import { createStock } from '../../../server/services/stock/stock';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { machineInput } from '../support/stock';
import { signedInAgent, type Agent } from '../support/test-app';
import { asJson, countRows } from '../support/test-database';

const SETUP = { userId: null, name: 'test set-up', clientAddress: '' };

describe('People: machine assignment', () => {
  const ctx = apiTestContext();
  let agent: Agent;
  let csrf: string;
  let saws: number[];
  let archived: number;

  before(async () => {
    const admin = await createPerson(ctx.db, { roles: ['admin'] });
    ({ agent, csrf } = await signedInAgent(ctx.app, admin));
    saws = [];
    for (const name of ['Saw 1', 'Saw 2', 'Saw 3']) saws.push((await createStock(ctx.db, SETUP, MACHINES, machineInput({ name }))).id);
    archived = (await createStock(ctx.db, SETUP, MACHINES, machineInput({ name: 'Retired saw' }))).id;
    await ctx.db('machines').where({ id: archived }).update({ archived: true, archived_at: new Date() });
  });

  const send = (method: 'post' | 'patch', path: string, body: object) => agent[method](path).set(CSRF_HEADER, csrf).send(body);

  it('creates a person with machines and shows them ascending everywhere; others have none', async () => {
    const res = await send('post', '/api/users', {
      username: 'mia.operator',
      displayName: 'Mia',
      roles: ['operator'],
      temporaryPassword: 'first-temp-pass',
      machineIds: [saws[2], saws[0]],
    });
    expect(res.status, JSON.stringify(res.body)).to.equal(201);
    expect(res.body.machineIds).to.deep.equal([saws[0], saws[2]]);
    expect(res.body.invitationPending).to.equal(false);
    const one = await agent.get(`/api/users/${res.body.id}`).expect(200);
    expect(one.body.machineIds).to.deep.equal([saws[0], saws[2]]);
    const list = await agent.get('/api/users').expect(200);
    const byName = new Map(list.body.items.map((u: { username: string; machineIds: number[] }) => [u.username, u.machineIds]));
    expect(byName.get('mia.operator')).to.deep.equal([saws[0], saws[2]]);
    expect([...byName.values()].filter((ids) => (ids as number[]).length === 0)).to.have.length(list.body.items.length - 1);
  });

  it('replaces the set on PATCH with one trail event before/after; the same set again records nothing', async () => {
    const person = await createPerson(ctx.db, { roles: ['operator'] });
    await send('patch', `/api/users/${person.id}`, { machineIds: [saws[1]] }).expect(200);
    const res = await send('patch', `/api/users/${person.id}`, { machineIds: [saws[2], saws[0]] });
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    expect(res.body.machineIds).to.deep.equal([saws[0], saws[2]]);
    const events = await ctx
      .db('trail_events')
      .where({ event_type: 'user.machines_changed', entity_id: String(person.id) })
      .orderBy('id');
    expect(events).to.have.length(2);
    expect(asJson(events[1].before_json)).to.deep.equal({ machineIds: [saws[1]] });
    expect(asJson(events[1].after_json)).to.deep.equal({ machineIds: [saws[0], saws[2]] });

    const count = await countRows(ctx.db, 'trail_events');
    await send('patch', `/api/users/${person.id}`, { machineIds: [saws[0], saws[2]] }).expect(200);
    expect(await countRows(ctx.db, 'trail_events')).to.equal(count);
    const cleared = await send('patch', `/api/users/${person.id}`, { machineIds: [] }).expect(200);
    expect(cleared.body.machineIds).to.deep.equal([]);
  });

  it('answers 400 on machineIds for an unknown or archived machine or a repeated id, changing nothing', async () => {
    const person = await createPerson(ctx.db, { displayName: 'Unchanged Name', roles: ['operator'] });
    await send('patch', `/api/users/${person.id}`, { machineIds: [saws[0]] }).expect(200);
    const events = await countRows(ctx.db, 'trail_events');
    for (const machineIds of [[saws[1], 999999], [archived], [saws[1], saws[1]]]) {
      const res = await send('patch', `/api/users/${person.id}`, { displayName: 'Changed Name', machineIds });
      expect(res.status, JSON.stringify(machineIds)).to.equal(400);
      expect(res.body.errors[0].path).to.equal('machineIds');
    }
    const after = await agent.get(`/api/users/${person.id}`).expect(200);
    expect(after.body).to.include({ displayName: 'Unchanged Name' });
    expect(after.body.machineIds).to.deep.equal([saws[0]]);
    expect(await countRows(ctx.db, 'trail_events')).to.equal(events);

    const users = await countRows(ctx.db, 'users');
    const created = await send('post', '/api/users', {
      username: 'no.such.saw',
      displayName: 'N',
      roles: [],
      temporaryPassword: 'first-temp-pass',
      machineIds: [999999],
    });
    expect(created.status).to.equal(400);
    expect(created.body.errors[0].path).to.equal('machineIds');
    expect(await countRows(ctx.db, 'users')).to.equal(users);
  });
});
