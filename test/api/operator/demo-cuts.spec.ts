/** The demo cut records (seeds/07_demo_cuts.ts): a few cuts by the demo operator, one burnt and flagged for the author. */
import { expect } from 'chai';
import { seedDemoIfEmpty } from '../../../server/tools/db-setup';
import { DEMO_ACCOUNTS } from '../../../seeds/data/demo-accounts';
import { apiTestContext } from '../support/hooks';
import { signedInAgent } from '../support/test-app';

describe('Demo cut records', () => {
  const ctx = apiTestContext();

  before(async function () {
    this.timeout(120000);
    expect(await seedDemoIfEmpty(ctx.db)).to.equal(true);
  });

  const demo = (role: string) => {
    const account = DEMO_ACCOUNTS.find((a) => a.roles.includes(role as never))!;
    return { id: 0, username: account.username, password: account.password, displayName: account.displayName };
  };

  it('records the demo operator’s cuts on versions in force, one burnt with notes', async () => {
    const rows = await ctx.db('cut_records as c').join('recipes as r', 'r.id', 'c.recipe_id').select('c.*', 'r.current_version_id');
    expect(rows.length).to.be.within(4, 10);
    for (const row of rows) {
      expect(row.operator_name).to.equal(demo('operator').displayName);
      expect(row.version_id).to.equal(row.current_version_id);
    }
    const burnt = rows.filter((r) => r.outcome === 'burnt');
    expect(burnt).to.have.length(1);
    expect(burnt[0].notes).to.match(/temper colours/i);
    expect(await ctx.db('trail_events').where({ event_type: 'cut.recorded' }).count({ n: '*' }).first()).to.deep.equal({ n: rows.length });
  });

  it('shows the flag on the demo author’s Today', async () => {
    const { agent } = await signedInAgent(ctx.app, demo('author'));
    const today = (await agent.get('/api/today').expect(200)).body;
    expect(today.flaggedCuts).to.have.length(1);
    expect(today.flaggedCuts[0]).to.include({ title: 'EN AW-6082 bar, transverse', count: 1 });
  });

  it('changes nothing when the seeds run again', async () => {
    const before = await ctx.db('cut_records').count({ n: '*' }).first();
    expect(await seedDemoIfEmpty(ctx.db)).to.equal(false);
    const { seed } = await import('../../../seeds/07_demo_cuts');
    await seed(ctx.db);
    expect(await ctx.db('cut_records').count({ n: '*' }).first()).to.deep.equal(before);
  });
});
