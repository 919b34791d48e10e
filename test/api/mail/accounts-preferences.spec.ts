/** GET/PATCH /api/session/notifications: optional mails on and off; the acknowledgement request stays on. */
import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { NOTIFICATION_INFO } from '../../../shared/notification-kinds';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { anonymousAgent, signedInAgent, type Agent } from '../support/test-app';
import { countRows } from '../support/test-database';

describe('Account mails: notification preferences', () => {
  const ctx = apiTestContext();
  let agent: Agent;
  let csrf: string;
  let personId: number;

  before(async () => {
    const person = await createPerson(ctx.db, { roles: ['author', 'operator'] });
    personId = person.id;
    ({ agent, csrf } = await signedInAgent(ctx.app, person));
  });

  const patch = (body: unknown) =>
    agent
      .patch('/api/session/notifications')
      .set(CSRF_HEADER, csrf)
      .send(body as object);
  const enabled = (items: { kind: string; enabled: boolean }[]) => Object.fromEntries(items.map((i) => [i.kind, i.enabled]));

  it('lists every kind, all on at first', async () => {
    const res = await agent.get('/api/session/notifications').expect(200);
    expect(res.body.items.map((i: { kind: string }) => i.kind)).to.deep.equal(NOTIFICATION_INFO.map((i) => i.kind));
    expect(res.body.items.every((i: { enabled: boolean }) => i.enabled)).to.equal(true);
    expect(res.body.items.find((i: { kind: string }) => i.kind === 'version-current')).to.include({ optional: false, enabled: true });
  });

  it('turns kinds off and on again, keeping the others, and records the change', async () => {
    const off = await patch({ 'review-due': false, 'cut-flagged': false });
    expect(off.status, JSON.stringify(off.body)).to.equal(200);
    expect(enabled(off.body.items)).to.deep.equal({
      'review-requested': true,
      'review-outcome': true,
      'review-due': false,
      'cut-flagged': false,
      'version-current': true,
      'integrity-failed': true,
      'trail-sealed': true,
    });
    expect(await ctx.db('notification_opt_outs').where({ user_id: personId }).orderBy('kind').pluck('kind')).to.deep.equal(['cut-flagged', 'review-due']);

    const back = await patch({ 'review-due': true });
    expect(enabled(back.body.items)).to.include({ 'review-due': true, 'cut-flagged': false });
    const read = await agent.get('/api/session/notifications').expect(200);
    expect(enabled(read.body.items)).to.deep.equal(enabled(back.body.items));
    expect(await ctx.db('trail_events').where({ event_type: 'user.notification_preferences_changed', entity_id: String(personId) })).to.have.length(2);

    // The same value again changes nothing and records nothing.
    const events = await countRows(ctx.db, 'trail_events');
    await patch({ 'cut-flagged': false }).expect(200);
    expect(await countRows(ctx.db, 'trail_events')).to.equal(events);
  });

  it('refuses to turn off the acknowledgement request with a clear message, changing nothing', async () => {
    const before = await ctx.db('notification_opt_outs').where({ user_id: personId }).orderBy('kind').pluck('kind');
    const res = await patch({ 'version-current': false, 'review-requested': false });
    expect(res.status).to.equal(400);
    expect(res.body.errors[0].path).to.equal('version-current');
    expect(res.body.errors[0].message).to.match(/cannot be turned off/);
    expect(await ctx.db('notification_opt_outs').where({ user_id: personId }).orderBy('kind').pluck('kind')).to.deep.equal(before);
  });

  it('refuses unknown kinds, non-booleans and an empty change with 400', async () => {
    for (const body of [{ 'no-such-mail': false }, { 'review-due': 'no' }, {}]) {
      const res = await patch(body);
      expect(res.status, JSON.stringify(body)).to.equal(400);
      expect(res.body.code).to.equal('VALIDATION_FAILED');
    }
  });

  it('needs a signed-in person', async () => {
    const anon = await anonymousAgent(ctx.app);
    await anon.agent.get('/api/session/notifications').expect(401);
  });
});
