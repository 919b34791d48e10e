/** The session clean-up job of server/jobs.ts: expired sessions go, live ones stay. */
import { expect } from 'chai';
import { deleteExpiredSessions } from '../../../server/data/sessions';
import { apiTestContext } from '../support/hooks';

describe('Session clean-up job', () => {
  const ctx = apiTestContext();

  it('deletes the sessions whose expiry has passed and keeps the others', async () => {
    const now = new Date('2027-03-01T08:00:00.000Z');
    const session = (sid: string, expired: Date) => ({ sid, sess: JSON.stringify({ cookie: {} }), expired });
    await ctx
      .db('sessions')
      .insert([
        session('gone-yesterday', new Date(now.getTime() - 86_400_000)),
        session('gone-a-second-ago', new Date(now.getTime() - 1000)),
        session('live-for-an-hour', new Date(now.getTime() + 3_600_000)),
      ]);
    expect(await deleteExpiredSessions(ctx.db, now)).to.equal(2);
    const left = (await ctx.db('sessions').where('sid', 'in', ['gone-yesterday', 'gone-a-second-ago', 'live-for-an-hour']).pluck('sid')) as string[];
    expect(left).to.deep.equal(['live-for-an-hour']);
  });
});
