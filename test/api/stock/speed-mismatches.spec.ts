/**
 * The machine's top speed against each wheel's marked maximum (OSHA 29 CFR 1910.215(d)(1):
 * checked before the wheel is mounted): GET /api/stock/speed-mismatches against the real
 * MariaDB, and a recipe naming such a pair refused at submit (409 BLOCKERS). Worked by hand:
 * a 200 mm wheel marked 50 m/s may turn at most 60 000·50/(π·200) = 4774.6 rpm.
 */
import { expect } from 'chai';
import type { SpeedMismatch } from '../../../shared/spindle-speed';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { act, createDraft, post, sessionFor, type Session } from '../workflow/workflow-support';

describe('Stock: machines that can over-speed a wheel', () => {
  const ctx = apiTestContext();
  let author: Session;
  let operator: Session;
  /** A precision saw reaching 5000 rpm with a 200 mm rim blade marked 50 m/s. */
  let risky: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Ana Operator');
    risky = await createStockSet(ctx.db, {
      material: { name: 'Alumina rod', designation: '', group: 'ceramic-glass', hardness: { value: 1500, scale: 'HV' } },
      machine: {
        name: 'Precision saw P1',
        machineClass: 'precision',
        wheelDiameterMinMm: 100,
        wheelDiameterMaxMm: 200,
        flangeDiameterMm: 50,
        rpmMin: 50,
        rpmMax: 5000,
        feedMinMmS: 0.005,
        feedMaxMmS: 0.2,
        cutMotions: ['straight-plunge'],
        clampingMethods: ['adhesive-wax-mount'],
      },
      wheel: { name: 'Diamond blade 200', kind: 'rim', specification: 'D151N100M', diameterMm: 200, thicknessMm: 0.8, boreMm: 12.7, maxSpeedMs: 50 },
    });
  });

  it('lists the pair with the numbers, for everyone signed in', async () => {
    const res = await operator.agent.get('/api/stock/speed-mismatches').expect(200);
    const found = (res.body as SpeedMismatch[]).filter((m) => m.machineId === risky.machine.id);
    expect(found).to.have.length(1);
    expect(found[0]).to.deep.include({
      machineName: 'Precision saw P1',
      wheelId: risky.wheel.id,
      wheelName: 'Diamond blade 200',
      topRpm: 5000,
      limited: false,
      wheelMaxRpm: 4774,
      markedIn: 'm/s',
      marked: 50,
    });
    expect(found[0]!.speedAtTopMs).to.be.closeTo(52.36, 0.005);
  });

  it('refuses to submit a recipe naming the pair: 409 BLOCKERS with the machine-over-wheel reason, even at a safe recipe rpm', async () => {
    // 4000 rpm is 41.9 m/s at 200 mm: the recipe's own speed is within the marking.
    const draft = await createDraft(author, risky, {
      title: 'Alumina rod on the risky saw',
      scope: { sizeMinMm: 5, sizeMaxMm: 20, hardness: null },
      cutting: { wheelRpm: 4000, feedMmS: 0.05 },
      clamping: { method: 'adhesive-wax-mount' },
      coolant: { type: 'water-soluble', concentrationPct: 3, flowLMin: null },
    });
    const blocker = draft.checks.find((c) => c.id === 'machine-can-overspeed-wheel');
    expect(blocker, JSON.stringify(draft.checks)).to.not.equal(undefined);
    expect(draft.checks.map((c) => c.id)).to.not.include('wheel-overspeed');
    const res = await act.submit(author, draft);
    expect(res.status).to.equal(409);
    expect(res.body.code).to.equal('BLOCKERS');
    expect(res.body.errors).to.deep.include({ path: 'cutting.wheelId', message: blocker!.message });
    expect(blocker!.message).to.contain('reaches 5000 rpm').and.contain('4774 rpm');
  });

  it('is gone once a spindle limit at or below the marking is recorded on the machine, and the recipe goes to review', async () => {
    const machine = await author.agent.get(`/api/machines/${risky.machine.id}`).expect(200);
    const { id: _id, archived: _a, updatedAt: _u, ...body } = machine.body;
    const saved = await author.agent
      .put(`/api/machines/${risky.machine.id}`)
      .set('x-csrf-token', author.csrf)
      .send({ ...body, spindleLimitRpm: 4500, spindleLimitSetBy: 'Maintenance, work order 2291' });
    expect(saved.status, JSON.stringify(saved.body)).to.equal(200);
    const res = await operator.agent.get('/api/stock/speed-mismatches').expect(200);
    expect((res.body as SpeedMismatch[]).filter((m) => m.machineId === risky.machine.id)).to.deep.equal([]);

    const draft = await createDraft(author, risky, {
      title: 'Alumina rod on the limited saw',
      scope: { sizeMinMm: 5, sizeMaxMm: 20, hardness: null },
      cutting: { wheelRpm: 4000, feedMmS: 0.05 },
      clamping: { method: 'adhesive-wax-mount' },
      coolant: { type: 'water-soluble', concentrationPct: 3, flowLMin: null },
    });
    expect(draft.checks.filter((c) => c.severity === 'blocker')).to.deep.equal([]);
    expect((await act.submit(author, draft)).status).to.equal(200);
  });

  it('leaves out archived wheels and wheels the machine does not take', async () => {
    const slow = await post(author, '/api/wheels', {
      name: 'Slow 150 blade',
      kind: 'rim',
      specification: 'D91N75B',
      diameterMm: 150,
      thicknessMm: 0.4,
      boreMm: 12.7,
      maxSpeedMarkedIn: 'rpm',
      maxSpeedRpm: 4000,
    });
    expect(slow.status, JSON.stringify(slow.body)).to.equal(201);
    const big = await post(author, '/api/wheels', {
      name: 'Big 350',
      kind: 'bonded',
      specification: 'A36K5B',
      diameterMm: 350,
      thicknessMm: 2.5,
      boreMm: 32,
      maxSpeedMs: 30,
    });
    expect(big.status, JSON.stringify(big.body)).to.equal(201);
    let list = (await operator.agent.get('/api/stock/speed-mismatches').expect(200)).body as SpeedMismatch[];
    // The 4500 rpm limit is above the 4000 rpm marked on the slow blade; the 350 mm wheel does not fit the saw.
    expect(list.filter((m) => m.machineId === risky.machine.id).map((m) => [m.wheelName, m.topRpm, m.limited, m.markedIn, m.marked])).to.deep.equal([
      ['Slow 150 blade', 4500, true, 'rpm', 4000],
    ]);
    expect(list.map((m) => m.wheelName)).to.not.include('Big 350');
    await post(author, `/api/wheels/${slow.body.id}/archive`).expect(200);
    list = (await operator.agent.get('/api/stock/speed-mismatches').expect(200)).body as SpeedMismatch[];
    expect(list.map((m) => m.wheelName)).to.not.include('Slow 150 blade');
  });
});
