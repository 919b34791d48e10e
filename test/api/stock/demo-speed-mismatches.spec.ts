/**
 * The demo stock has no machine that can turn one of its wheels above the marked maximum
 * (OSHA 29 CFR 1910.215(d)(1)). It once had one: a 200 mm blade marked 50 m/s (4774 rpm) on
 * a precision saw reaching 5000 rpm; the saw's spindle limit, recorded with who set it, now
 * keeps it within the marking. Loaded exactly as `npm start` loads it.
 */
import { expect } from 'chai';
import type { SpeedMismatch } from '../../../shared/spindle-speed';
import type { MachineRecord, WheelRecord } from '../../../shared/stock-types';
import { seedDemoIfEmpty } from '../../../server/tools/db-setup';
import { apiTestContext } from '../support/hooks';
import { sessionFor } from '../workflow/workflow-support';

describe('Demo stock: machine speed against wheel marking', () => {
  const ctx = apiTestContext();

  before(async function () {
    this.timeout(60000);
    expect(await seedDemoIfEmpty(ctx.db)).to.equal(true);
  });

  it('lists no mismatch', async () => {
    const reader = await sessionFor(ctx.app, ctx.db, ['operator']);
    const res = await reader.agent.get('/api/stock/speed-mismatches').expect(200);
    expect(res.body as SpeedMismatch[]).to.deep.equal([]);
  });

  it('finds the old mismatch once the precision saw’s limit is taken off, and keeps the fields on the records', async () => {
    const reader = await sessionFor(ctx.app, ctx.db, ['operator']);
    const machines = (await reader.agent.get('/api/machines?pageSize=200').expect(200)).body.items as MachineRecord[];
    const saw = machines.find((m) => m.name === 'Clean-room precision saw')!;
    expect(saw).to.deep.include({ rpmMax: 5000, spindleLimitRpm: 4500 });
    expect(saw.spindleLimitSetBy).to.match(/Maintenance, work order/);
    const wheels = (await reader.agent.get('/api/wheels?pageSize=200').expect(200)).body.items as WheelRecord[];
    expect(wheels.find((w) => w.name === 'CBN rim 150')).to.deep.include({ maxSpeedMarkedIn: 'rpm', maxSpeedRpm: 6000 });
    expect(wheels.find((w) => w.name === 'Diamond rim 200 metal bond')).to.deep.include({
      maxSpeedMarkedIn: 'm/s',
      maxSpeedMs: 50,
      restrictions: ['wet-use-only'],
    });

    await ctx.db('machines').where({ id: saw.id }).update({ spindle_limit_rpm: null, spindle_limit_set_by: '' });
    try {
      const res = await reader.agent.get('/api/stock/speed-mismatches').expect(200);
      expect((res.body as SpeedMismatch[]).map((m) => `${m.machineName} / ${m.wheelName} / ${m.topRpm} > ${m.wheelMaxRpm}`)).to.deep.equal([
        'Clean-room precision saw / Diamond rim 200 metal bond / 5000 > 4774',
      ]);
    } finally {
      await ctx.db('machines').where({ id: saw.id }).update({ spindle_limit_rpm: saw.spindleLimitRpm, spindle_limit_set_by: saw.spindleLimitSetBy });
    }
  });
});
