/** GET /api/dev/outbox: the outbox as an admin sees it in development, newest first. */
import { expect } from 'chai';
import { enqueueMail } from '../../../server/services/mail/outbox';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { signedInAgent } from '../support/test-app';

describe('Development outbox API', () => {
  const ctx = apiTestContext();

  it('lists the outbox newest first with recipient, subject, kind, times, attempts and last error; admins only', async () => {
    await ctx.db.transaction((trx) =>
      enqueueMail(trx, { to: 'first@lab.example', subject: 'First', text: 'One.', kind: 'test.first' }, new Date('2027-01-01T10:00:00.000Z')),
    );
    const secondId = await ctx.db.transaction((trx) =>
      enqueueMail(
        trx,
        { to: 'second@lab.example', subject: 'Second', text: 'Two.', html: '<p>Two.</p>', kind: 'test.second' },
        new Date('2027-01-02T10:00:00.000Z'),
      ),
    );
    await ctx.db('mail_outbox').where({ id: secondId }).update({ attempts: 2, last_error: 'connect ECONNREFUSED 127.0.0.1:2525' });

    const admin = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['admin'] }));
    const res = await admin.agent.get('/api/dev/outbox').expect(200);
    const items = res.body.items as Record<string, unknown>[];
    expect(items.map((i) => i['subject'])).to.deep.equal(['Second', 'First']);
    expect(items[0]).to.include({
      to: 'second@lab.example',
      kind: 'test.second',
      created: '2027-01-02T10:00:00.000Z',
      sent: null,
      attempts: 2,
      lastError: 'connect ECONNREFUSED 127.0.0.1:2525',
    });
    expect(items[1]).to.include({ to: 'first@lab.example', attempts: 0, lastError: null });

    const author = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['author'] }));
    const refused = await author.agent.get('/api/dev/outbox').expect(403);
    expect(refused.body.code).to.equal('FORBIDDEN');
  });
});
