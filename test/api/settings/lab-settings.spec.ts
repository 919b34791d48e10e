import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { LabSettingsDto } from '../../../shared/schemas/lab-settings';
import { restoreLabSettings } from '../../../server/data/empty-tables';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { signedInAgent, type Agent } from '../support/test-app';
import { asJson, countRows } from '../support/test-database';

describe('Lab settings', () => {
  const ctx = apiTestContext();
  let admin: { agent: Agent; csrf: string };
  let author: { agent: Agent; csrf: string };
  let adminId: number;

  before(async () => {
    const a = await createPerson(ctx.db, { roles: ['admin'], displayName: 'Ada Admin' });
    adminId = a.id;
    admin = await signedInAgent(ctx.app, a);
    author = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['author', 'approver', 'auditor'] }));
  });
  beforeEach(() => restoreLabSettings(ctx.db));

  const current = async (): Promise<LabSettingsDto> => (await author.agent.get('/api/settings/lab').expect(200)).body as LabSettingsDto;
  const save = (who: { agent: Agent; csrf: string }, body: object) => who.agent.put('/api/settings/lab').set(CSRF_HEADER, who.csrf).send(body);
  const bodyOf = ({ updatedAt: _u, ...rest }: LabSettingsDto) => rest;

  it('answers every setting, with the limits the checks use, to anyone signed in', async () => {
    const settings = await current();
    expect(settings).to.include({ labName: 'Our lab', sheetPaper: 'A4', reviewIntervalMonths: 24, defaultUnits: 'metric', dateFormat: 'iso', revision: 1 });
    const limits = (await author.agent.get('/api/settings/limits').expect(200)).body;
    const {
      labName: _l,
      sheetPaper: _s,
      reviewIntervalMonths: _r,
      defaultUnits: _d,
      dateFormat: _f,
      sealIntervalHours: _h,
      revision: _v,
      updatedAt: _u,
      ...settingsLimits
    } = settings;
    expect(settingsLimits).to.deep.equal(limits);
    expect(settings.feedCeilings.length).to.be.greaterThan(0);
  });

  it('saves a change, raises the revision, and writes one trail row with only the changed values before and after', async () => {
    const before = await current();
    const ceilings = before.feedCeilings.map((c, i) => (i === 0 ? { ...c, maxFeedMmS: 0.25 } : c));
    const res = await save(admin, {
      ...bodyOf(before),
      labName: 'Metallography, building 4',
      dateFormat: 'dmy-dot',
      powerWarningPct: 70,
      feedCeilings: ceilings,
    });
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    expect(res.body).to.include({ labName: 'Metallography, building 4', dateFormat: 'dmy-dot', powerWarningPct: 70, revision: 2 });

    // In effect where the checks read them.
    const limits = (await author.agent.get('/api/settings/limits').expect(200)).body;
    expect(limits.powerWarningPct).to.equal(70);
    expect(limits.feedCeilings[0].maxFeedMmS).to.equal(0.25);

    const events = await ctx.db('trail_events').where({ event_type: 'lab_settings.changed' });
    expect(events).to.have.length(1);
    expect(events[0]).to.include({ entity_type: 'lab_settings', entity_id: '1', actor_user_id: adminId });
    const beforeJson = asJson(events[0].before_json) as Record<string, unknown>;
    const afterJson = asJson(events[0].after_json) as Record<string, unknown>;
    expect(Object.keys(afterJson).sort()).to.deep.equal(['dateFormat', 'feedCeilings', 'labName', 'powerWarningPct']);
    expect(beforeJson).to.include({ labName: 'Our lab', dateFormat: 'iso', powerWarningPct: 80 });
    expect(afterJson).to.include({ labName: 'Metallography, building 4', dateFormat: 'dmy-dot', powerWarningPct: 70 });
    expect((beforeJson['feedCeilings'] as { maxFeedMmS: number }[])[0]!.maxFeedMmS).to.equal(before.feedCeilings[0]!.maxFeedMmS);
    expect((afterJson['feedCeilings'] as { maxFeedMmS: number }[])[0]!.maxFeedMmS).to.equal(0.25);
  });

  it('refuses bad values with a message for each, and changes nothing', async () => {
    const before = await current();
    const trailRows = await countRows(ctx.db, 'trail_events');
    const res = await save(admin, {
      ...bodyOf(before),
      labName: '  ',
      reviewIntervalMonths: 0,
      wornDiameterShare: 1.2,
      powerWarningPct: 150,
      feedCeilings: [{ group: 'unobtainium', hardness: null, machineClass: 'precision', maxFeedMmS: 0.1 }],
      specificEnergyJMm3: { copper: -3 },
    });
    expect(res.status).to.equal(400);
    const byPath = Object.fromEntries((res.body.errors as { path: string; message: string }[]).map((e) => [e.path, e.message]));
    expect(byPath).to.include({
      labName: 'Lab name is required.',
      reviewIntervalMonths: 'Review interval must be at least 1 month.',
      wornDiameterShare: 'Worn wheel share must be at most 0.99 of the new diameter.',
      powerWarningPct: 'Power warning share must be at most 100 %.',
      'feedCeilings.0.group': 'Choose a material group.',
      'specificEnergyJMm3.copper': 'Specific cutting energy must be more than 0 J/mm³.',
    });
    expect(await current()).to.deep.equal(before);
    expect(await countRows(ctx.db, 'trail_events')).to.equal(trailRows);
  });

  it('refuses a save based on an older revision with 409 and the current settings', async () => {
    const opened = await current();
    await save(admin, { ...bodyOf(opened), reviewIntervalMonths: 12 }).expect(200);
    const res = await save(admin, { ...bodyOf(opened), labName: 'Late save' });
    expect(res.status).to.equal(409);
    expect(res.body.errors[0]).to.include({ path: 'revision' });
    expect(res.body.current).to.include({ reviewIntervalMonths: 12, labName: 'Our lab', revision: 2 });
    expect((await current()).labName).to.equal('Our lab');
  });

  it('refuses anyone but an admin, and changes nothing', async () => {
    const before = await current();
    const trailRows = await countRows(ctx.db, 'trail_events');
    const res = await save(author, { ...bodyOf(before), labName: 'Not mine to change' });
    expect(res.status).to.equal(403);
    expect(await current()).to.deep.equal(before);
    expect(await countRows(ctx.db, 'trail_events')).to.equal(trailRows);
  });

  it('writes no trail row for a save that changes nothing', async () => {
    const before = await current();
    const trailRows = await countRows(ctx.db, 'trail_events');
    await save(admin, bodyOf(before)).expect(200);
    expect(await countRows(ctx.db, 'trail_events')).to.equal(trailRows);
  });
});
