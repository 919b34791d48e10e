/**
 * The demo scenario's mail side, loaded as `npm start` loads it: the operator runs the two
 * bay saws, was asked to acknowledge each version that came into use on them, has
 * acknowledged all but the newest, and his Today shows that one.
 */
import { expect } from 'chai';
import { seedDemoIfEmpty } from '../../../server/tools/db-setup';
import { getToday } from '../../../server/services/today';
import { DEMO_ACCOUNTS } from '../../../seeds/data/demo-accounts';
import { apiTestContext } from '../support/hooks';

describe('Demo seeds: machines, acknowledgements and the mail they caused', () => {
  const ctx = apiTestContext();
  const operator = DEMO_ACCOUNTS.find((a) => a.roles.includes('operator'))!;
  let operatorId: number;

  before(async function () {
    this.timeout(60000);
    expect(await seedDemoIfEmpty(ctx.db)).to.equal(true);
    operatorId = ((await ctx.db('users').where({ username: operator.username }).first('id')) as { id: number }).id;
  });

  it('assigns the demo operator to the two bay saws', async () => {
    const names = (await ctx.db('user_machines as um').join('machines as m', 'm.id', 'um.machine_id').where('um.user_id', operatorId).orderBy('m.name').pluck('m.name')) as string[];
    expect(names).to.deep.equal([...operator.machines!].sort());
  });

  it('asked him to acknowledge each version that came into use on them, in the outbox', async () => {
    const mails = (await ctx.db('mail_outbox').where({ to_address: operator.email, kind: 'version-current' }).pluck('subject')) as string[];
    // C45, 6082 and brass approved; 42CrMo4 v1 and v2; the X153 block (the circuit board and alumina run on the precision saw).
    expect(mails.length).to.be.at.least(5);
    expect(mails.some((s) => s.includes('KB-0002'))).to.equal(true);
  });

  it('leaves only the newest version on his saws to acknowledge, on his Today', async () => {
    const today = await getToday(ctx.db, { id: operatorId, roles: operator.roles });
    expect(today.toAcknowledge.map((r) => r.title)).to.deep.equal(['42CrMo4 quenched and tempered bar, large diameters']);
    const events = await ctx.db('audit_events').where({ event_type: 'recipe.version_acknowledged', actor_user_id: operatorId }).count({ n: '*' }).first();
    expect(Number(events!.n)).to.be.at.least(4);
  });
});
