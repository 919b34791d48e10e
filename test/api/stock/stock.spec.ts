import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, machineInput, materialInput, recipeInput, wheelInput } from '../support/stock';
import { signedInAgent, type Agent } from '../support/test-app';
import { asJson, countRows } from '../support/test-database';
import { createRecipe } from '../../../server/services/recipes/recipes';
import { restoreLabSettings } from '../../../server/data/empty-tables';
import { DEFAULT_SPECIFIC_ENERGY_J_MM3 } from '../../../migrations/20261205183430_insert_default_cutting_energy';
import type { FeedCeiling } from '../../../shared/schemas/lab-settings';

describe('Stock: materials, wheels, machines', () => {
  const ctx = apiTestContext();
  let author: { agent: Agent; csrf: string };
  let operator: { agent: Agent; csrf: string };
  let authorId: number;

  before(async () => {
    const a = await createPerson(ctx.db, { roles: ['author'], displayName: 'Ines Author' });
    authorId = a.id;
    author = await signedInAgent(ctx.app, a);
    operator = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['operator'] }));
  });

  const post = (url: string, body: unknown) =>
    author.agent
      .post(url)
      .set(CSRF_HEADER, author.csrf)
      .send(body as object);
  const put = (url: string, body: unknown) =>
    author.agent
      .put(url)
      .set(CSRF_HEADER, author.csrf)
      .send(body as object);

  describe('create, read, update', () => {
    it('creates a material with one trail row and reads it back', async () => {
      const before = await countRows(ctx.db, 'trail_events');
      const res = await post(
        '/api/materials',
        materialInput({ name: 'Ti-6Al-4V', designation: 'UNS R56400', group: 'titanium', hardness: { value: 340, scale: 'HV' } }),
      );
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      expect(res.body).to.include({ name: 'Ti-6Al-4V', designation: 'UNS R56400', group: 'titanium', archived: false });
      expect(res.body.hardness).to.deep.equal({ value: 340, scale: 'HV' });
      expect(res.body.updatedAt).to.match(/Z$/);
      const got = await operator.agent.get(`/api/materials/${res.body.id}`).expect(200);
      expect(got.body).to.deep.equal(res.body);
      expect(await countRows(ctx.db, 'trail_events')).to.equal(before + 1);
      const event = await ctx.db('trail_events').orderBy('id', 'desc').first();
      expect(event).to.include({ event_type: 'material.created', entity_type: 'material', entity_id: String(res.body.id), actor_user_id: authorId });
      expect(asJson(event.after_json)).to.include({ name: 'Ti-6Al-4V', group: 'titanium' });
    });

    it('creates a wheel and a machine (lists of motions and clamping round-trip)', async () => {
      const wheel = await post(
        '/api/wheels',
        wheelInput({ name: 'Diamond rim 150', kind: 'rim', specification: 'D126N100M', diameterMm: 150, thicknessMm: 0.5, boreMm: 12.7, maxSpeedMs: 50 }),
      );
      expect(wheel.status, JSON.stringify(wheel.body)).to.equal(201);
      expect(wheel.body).to.include({
        kind: 'rim',
        specification: 'D126N100M',
        diameterMm: 150,
        thicknessMm: 0.5,
        boreMm: 12.7,
        maxSpeedMs: 50,
        dryAllowed: false,
      });
      const machine = await post('/api/machines', machineInput({ cutMotions: ['rocking', 'straight-plunge'], clampingMethods: ['v-block'] }));
      expect(machine.status, JSON.stringify(machine.body)).to.equal(201);
      expect(machine.body.cutMotions).to.deep.equal(['rocking', 'straight-plunge']);
      expect(machine.body.clampingMethods).to.deep.equal(['v-block']);
      expect(machine.body.feedMinMmS).to.equal(0.02);
    });

    it('updates with PUT and records only what changed', async () => {
      const created = await post('/api/wheels', wheelInput({ name: 'Wheel to edit' })).expect(201);
      const res = await put(`/api/wheels/${created.body.id}`, wheelInput({ name: 'Wheel to edit', maxSpeedMs: 80, notes: 'Re-marked' }));
      expect(res.status, JSON.stringify(res.body)).to.equal(200);
      expect(res.body).to.include({ maxSpeedMs: 80, notes: 'Re-marked' });
      const event = await ctx
        .db('trail_events')
        .where({ event_type: 'wheel.updated', entity_id: String(created.body.id) })
        .first();
      // The speed in rpm at the new diameter follows the marked m/s: 60 000·v / (π·250 mm), computed by hand.
      const before = asJson(event.before_json) as Record<string, number | string>;
      const after = asJson(event.after_json) as Record<string, number | string>;
      expect(Object.keys(before).sort()).to.deep.equal(['maxSpeedMs', 'maxSpeedRpm', 'notes']);
      expect(before).to.include({ maxSpeedMs: 63, notes: '' });
      expect(before['maxSpeedRpm']).to.be.closeTo(4812.845, 1e-3);
      expect(after).to.include({ maxSpeedMs: 80, notes: 'Re-marked' });
      expect(after['maxSpeedRpm']).to.be.closeTo(6111.55, 1e-3);
    });

    it('answers 404 for an unknown id and 400 for a non-number id', async () => {
      expect((await operator.agent.get('/api/machines/999999')).status).to.equal(404);
      const bad = await operator.agent.get('/api/machines/abc');
      expect(bad.status).to.equal(400);
      expect(bad.body.errors[0].path).to.equal('id');
    });

    it('lets only authors and admins edit', async () => {
      const res = await operator.agent.post('/api/materials').set(CSRF_HEADER, operator.csrf).send(materialInput());
      expect(res.status).to.equal(403);
    });
  });

  describe('markings and machine limits', () => {
    it('stores a wheel marked in rpm with its speed in m/s computed from the diameter', async () => {
      // v = π·D·n / 60 000, computed by hand: 230 mm at 6600 rpm → 79.482 m/s.
      const res = await post(
        '/api/wheels',
        wheelInput({ name: 'Marked in rpm', diameterMm: 230, maxSpeedMarkedIn: 'rpm', maxSpeedMs: null, maxSpeedRpm: 6600 }),
      );
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      expect(res.body).to.include({ maxSpeedMarkedIn: 'rpm', maxSpeedRpm: 6600 });
      expect(res.body.maxSpeedMs).to.be.closeTo(79.482, 1e-3);
    });

    it('keeps restriction marks and the smallest usable diameter, and refuses a repeated mark', async () => {
      const res = await post('/api/wheels', wheelInput({ name: 'Wet only', restrictions: ['wet-use-only'], minUsableDiameterMm: 180 }));
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      expect(res.body).to.deep.include({ restrictions: ['wet-use-only'], minUsableDiameterMm: 180 });
      const twice = await post('/api/wheels', wheelInput({ name: 'Twice', restrictions: ['wet-use-only', 'wet-use-only'] }));
      expect(twice.status).to.equal(400);
      expect(twice.body.errors.map((e: { path: string }) => e.path)).to.include('restrictions');
      const worn = await post('/api/wheels', wheelInput({ name: 'Worn above new', minUsableDiameterMm: 260 }));
      expect(worn.status).to.equal(400);
      expect(worn.body.errors.map((e: { path: string }) => e.path)).to.include('minUsableDiameterMm');
    });

    it('refuses a wheel without its marked speed in the unit it says', async () => {
      const res = await post('/api/wheels', wheelInput({ name: 'No rpm', maxSpeedMarkedIn: 'rpm', maxSpeedMs: 63, maxSpeedRpm: null }));
      expect(res.status).to.equal(400);
      expect(res.body.errors.map((e: { path: string }) => e.path)).to.include('maxSpeedMs');
    });

    it('asks who set a spindle speed limit, and keeps the limit, the feed direction and the motor power', async () => {
      const missing = await post('/api/machines', machineInput({ name: 'Limited', spindleLimitRpm: 2500 }));
      expect(missing.status).to.equal(400);
      expect(missing.body.errors.map((e: { path: string }) => e.path)).to.include('spindleLimitSetBy');
      const above = await post('/api/machines', machineInput({ name: 'Limited', spindleLimitRpm: 3500, spindleLimitSetBy: 'Maintenance' }));
      expect(above.status).to.equal(400);
      expect(above.body.errors.map((e: { path: string }) => e.path)).to.include('spindleLimitRpm');
      const ok = await post(
        '/api/machines',
        machineInput({
          name: 'Limited',
          spindleLimitRpm: 2500,
          spindleLimitSetBy: 'Maintenance, work order 17',
          feedDirection: 'part-horizontal',
          motorPowerKw: 4,
        }),
      );
      expect(ok.status, JSON.stringify(ok.body)).to.equal(201);
      expect(ok.body).to.include({ spindleLimitRpm: 2500, spindleLimitSetBy: 'Maintenance, work order 17', feedDirection: 'part-horizontal', motorPowerKw: 4 });
    });
  });

  describe('bad input', () => {
    const cases: [string, string, Record<string, unknown>, string][] = [
      ['zero diameter', '/api/wheels', { diameterMm: 0 }, 'diameterMm'],
      ['negative thickness', '/api/wheels', { thicknessMm: -1 }, 'thicknessMm'],
      ['NaN sent as text', '/api/wheels', { maxSpeedMs: 'NaN' }, 'maxSpeedMs'],
      ['a huge number', '/api/wheels', { boreMm: 1e308 }, 'boreMm'],
      ['a non-numeric string', '/api/wheels', { diameterMm: 'two hundred' }, 'diameterMm'],
      ['an unknown kind', '/api/wheels', { kind: 'magic' }, 'kind'],
      ['an unknown field', '/api/wheels', { colour: 'red' }, ''],
      ['an unknown group', '/api/materials', { group: 'unobtainium' }, 'group'],
      ['case-hardened without depth', '/api/materials', { caseHardened: true, caseDepthMm: null }, 'caseDepthMm'],
      ['empty name', '/api/materials', { name: '   ' }, 'name'],
      ['rpm range upside down', '/api/machines', { rpmMin: 3000, rpmMax: 1000 }, 'rpmMax'],
      ['no cut motion', '/api/machines', { cutMotions: [] }, 'cutMotions'],
      ['an unknown clamping method', '/api/machines', { clampingMethods: ['glue-gun'] }, 'clampingMethods.0'],
      ['flange as large as the wheel', '/api/machines', { flangeDiameterMm: 250 }, 'flangeDiameterMm'],
    ];
    for (const [what, url, change, path] of cases) {
      it(`refuses ${what} with 400 naming the field, writing nothing`, async () => {
        const table = url.split('/').pop()!;
        const base = table === 'wheels' ? wheelInput() : table === 'materials' ? materialInput() : machineInput();
        const rows = await countRows(ctx.db, table);
        const events = await countRows(ctx.db, 'trail_events');
        const res = await post(url, { ...base, ...change });
        expect(res.status, JSON.stringify(res.body)).to.equal(400);
        expect(res.body.code).to.equal('VALIDATION_FAILED');
        const paths = (res.body.errors as { path: string; message: string }[]).map((e) => e.path);
        expect(paths, JSON.stringify(res.body)).to.include(path);
        for (const e of res.body.errors) expect(e.message).to.be.a('string').and.not.equal('');
        expect(await countRows(ctx.db, table)).to.equal(rows);
        expect(await countRows(ctx.db, 'trail_events')).to.equal(events);
      });
    }

    it('refuses a bad PUT without changing the record', async () => {
      const created = await post('/api/wheels', wheelInput({ name: 'Unchanged wheel' })).expect(201);
      const res = await put(`/api/wheels/${created.body.id}`, { ...wheelInput(), maxSpeedMs: -5 });
      expect(res.status).to.equal(400);
      const now = await operator.agent.get(`/api/wheels/${created.body.id}`).expect(200);
      expect(now.body).to.deep.equal(created.body);
    });
  });

  describe('list', () => {
    before(async () => {
      for (const [name, designation, group] of [
        ['Alpha 100% steel_1', 'EN 1.0001', 'plain-low-alloy-steel'],
        ['Bravo cast', 'EN-GJL-250', 'cast-iron'],
        ['Charlie brass', 'CW614N', 'copper'],
        ['Delta alu', 'EN AW-6082', 'aluminium-magnesium'],
        ['Echo stainless', 'EN 1.4301', 'stainless-steel'],
      ] as const) {
        await post('/api/materials', materialInput({ name, designation, group })).expect(201);
      }
    });

    it('pages and counts', async () => {
      const first = await operator.agent.get('/api/materials').query({ pageSize: 2, page: 0, sort: 'name' }).expect(200);
      const all = await operator.agent.get('/api/materials').query({ pageSize: 200 }).expect(200);
      expect(first.body.items).to.have.length(2);
      expect(first.body.total).to.equal(all.body.total);
      expect(first.body).to.include({ page: 0, pageSize: 2 });
      const second = await operator.agent.get('/api/materials').query({ pageSize: 2, page: 1, sort: 'name' }).expect(200);
      expect(second.body.items[0].name).to.equal(all.body.items[2].name);
    });

    it('sorts by whitelisted columns only', async () => {
      const desc = await operator.agent.get('/api/materials').query({ sort: 'name', dir: 'desc', pageSize: 200 }).expect(200);
      const names = desc.body.items.map((m: { name: string }) => m.name);
      expect(names).to.deep.equal([...names].sort((a: string, b: string) => b.localeCompare(a)));
      const byGroup = await operator.agent.get('/api/materials').query({ sort: 'group', pageSize: 200 }).expect(200);
      const groups = byGroup.body.items.map((m: { group: string }) => m.group);
      expect(groups).to.deep.equal([...groups].sort());
      const bad = await operator.agent.get('/api/materials').query({ sort: 'password_hash' });
      expect(bad.status).to.equal(400);
      expect(bad.body.errors[0].path).to.equal('sort');
    });

    it('searches name and designation, taking % and _ literally', async () => {
      const byDesignation = await operator.agent.get('/api/materials').query({ q: 'cw614' }).expect(200);
      expect(byDesignation.body.items.map((m: { name: string }) => m.name)).to.deep.equal(['Charlie brass']);
      const percent = await operator.agent.get('/api/materials').query({ q: '100%' }).expect(200);
      expect(percent.body.items.map((m: { name: string }) => m.name)).to.deep.equal(['Alpha 100% steel_1']);
      const underscore = await operator.agent.get('/api/materials').query({ q: 'l_1' }).expect(200);
      expect(underscore.body.total).to.equal(1);
    });

    it('filters by group and by archived', async () => {
      const cast = await operator.agent.get('/api/materials').query({ group: 'cast-iron' }).expect(200);
      expect(cast.body.items.every((m: { group: string }) => m.group === 'cast-iron')).to.equal(true);
      expect(cast.body.total).to.be.greaterThan(0);
      const echo = (await operator.agent.get('/api/materials').query({ q: 'Echo' }).expect(200)).body.items[0];
      await author.agent.post(`/api/materials/${echo.id}/archive`).set(CSRF_HEADER, author.csrf).expect(200);
      const active = await operator.agent.get('/api/materials').query({ q: 'Echo' }).expect(200);
      expect(active.body.total).to.equal(0);
      const archived = await operator.agent.get('/api/materials').query({ q: 'Echo', archived: 'yes' }).expect(200);
      expect(archived.body.items[0]).to.include({ id: echo.id, archived: true });
      const all = await operator.agent.get('/api/materials').query({ q: 'Echo', archived: 'all' }).expect(200);
      expect(all.body.total).to.equal(1);
    });

    it('answers 400 to a bad query', async () => {
      for (const query of [{ pageSize: 0 }, { pageSize: 'x' }, { page: -1 }, { group: 'nope' }, { archived: 'maybe' }, { dir: 'up' }]) {
        const res = await operator.agent.get('/api/wheels').query(query);
        expect(res.status, JSON.stringify(query)).to.equal(400);
        expect(res.body.code).to.equal('VALIDATION_FAILED');
      }
    });
  });

  describe('archive and delete', () => {
    it('archives and unarchives, each with a trail row; archiving twice is a 409', async () => {
      const m = await post('/api/machines', machineInput({ name: 'Old saw' })).expect(201);
      const archived = await author.agent.post(`/api/machines/${m.body.id}/archive`).set(CSRF_HEADER, author.csrf).expect(200);
      expect(archived.body.archived).to.equal(true);
      const again = await author.agent.post(`/api/machines/${m.body.id}/archive`).set(CSRF_HEADER, author.csrf);
      expect(again.status).to.equal(409);
      const back = await author.agent.post(`/api/machines/${m.body.id}/unarchive`).set(CSRF_HEADER, author.csrf).expect(200);
      expect(back.body.archived).to.equal(false);
      const events = await ctx
        .db('trail_events')
        .where({ entity_type: 'machine', entity_id: String(m.body.id) })
        .orderBy('id')
        .pluck('event_type');
      expect(events).to.deep.equal(['machine.created', 'machine.archived', 'machine.unarchived']);
    });

    it('deletes an unreferenced record', async () => {
      const w = await post('/api/wheels', wheelInput({ name: 'Unused wheel' })).expect(201);
      const res = await author.agent.delete(`/api/wheels/${w.body.id}`).set(CSRF_HEADER, author.csrf);
      expect(res.status).to.equal(200);
      expect(res.body).to.deep.equal({ archived: false });
      expect(await ctx.db('wheels').where({ id: w.body.id }).first()).to.equal(undefined);
      const event = await ctx
        .db('trail_events')
        .where({ event_type: 'wheel.deleted', entity_id: String(w.body.id) })
        .first();
      expect(asJson(event.before_json)).to.include({ name: 'Unused wheel' });
    });

    it('archives instead of deleting a record a recipe version references, and the recipe keeps it', async () => {
      const stock = await createStockSet(ctx.db);
      const recipe = await createRecipe(ctx.db, { userId: authorId, name: 'Ines Author', clientAddress: '' }, recipeInput(stock));
      for (const [kind, id] of [
        ['materials', stock.material.id],
        ['wheels', stock.wheel.id],
        ['machines', stock.machine.id],
      ] as const) {
        const res = await author.agent.delete(`/api/${kind}/${id}`).set(CSRF_HEADER, author.csrf);
        expect(res.status, kind).to.equal(200);
        expect(res.body, kind).to.deep.equal({ archived: true });
        const row = await ctx.db(kind).where({ id }).first();
        expect(row, kind).to.not.equal(undefined);
        expect(Boolean(row.archived), kind).to.equal(true);
        expect(row.archived_at, kind).to.be.instanceOf(Date);
      }
      const version = await author.agent.get(`/api/recipes/${recipe.recipeId}/versions/1`).expect(200);
      expect(version.body.content.cutting.wheelId).to.equal(stock.wheel.id);
    });

    it('archives a wheel the selection table points at instead of deleting it', async () => {
      const w = await post('/api/wheels', wheelInput({ name: 'Selected wheel' })).expect(201);
      await post('/api/selection-rows', { group: 'copper', hardness: null, wheelId: w.body.id }).expect(201);
      const res = await author.agent.delete(`/api/wheels/${w.body.id}`).set(CSRF_HEADER, author.csrf).expect(200);
      expect(res.body).to.deep.equal({ archived: true });
    });

    it('answers 404 when deleting what is not there', async () => {
      const res = await author.agent.delete('/api/materials/999999').set(CSRF_HEADER, author.csrf);
      expect(res.status).to.equal(404);
    });
  });

  describe('selection table', () => {
    it('creates, lists, updates and deletes rows, with trail rows', async () => {
      const w = await post('/api/wheels', wheelInput({ name: 'Soft alumina', specification: 'A60J5B' })).expect(201);
      const created = await post('/api/selection-rows', {
        group: 'hardened-tool-steel',
        hardness: { min: 45, max: 65, scale: 'HRC' },
        wheelId: w.body.id,
        note: 'Harder → softer bond.',
      });
      expect(created.status, JSON.stringify(created.body)).to.equal(201);
      expect(created.body).to.deep.include({ group: 'hardened-tool-steel', hardness: { min: 45, max: 65, scale: 'HRC' }, wheelId: w.body.id });
      const list = await operator.agent.get('/api/selection-rows').expect(200);
      expect(list.body.map((r: { id: number }) => r.id)).to.include(created.body.id);
      const updated = await put(`/api/selection-rows/${created.body.id}`, {
        group: 'hardened-tool-steel',
        hardness: null,
        wheelId: w.body.id,
        note: '',
      }).expect(200);
      expect(updated.body.hardness).to.equal(null);
      await author.agent.delete(`/api/selection-rows/${created.body.id}`).set(CSRF_HEADER, author.csrf).expect(204);
      expect(await ctx.db('selection_rows').where({ id: created.body.id }).first()).to.equal(undefined);
      const events = await ctx
        .db('trail_events')
        .where({ entity_type: 'selection_row', entity_id: String(created.body.id) })
        .orderBy('id')
        .pluck('event_type');
      expect(events).to.deep.equal(['selection_row.created', 'selection_row.updated', 'selection_row.deleted']);
    });

    it('refuses an unknown or archived wheel and a bad band, writing nothing', async () => {
      const rows = await countRows(ctx.db, 'selection_rows');
      const unknown = await post('/api/selection-rows', { group: 'copper', hardness: null, wheelId: 999999 });
      expect(unknown.status).to.equal(400);
      expect(unknown.body.errors[0].path).to.equal('wheelId');
      const w = await post('/api/wheels', wheelInput({ name: 'Archived for selection' })).expect(201);
      await author.agent.post(`/api/wheels/${w.body.id}/archive`).set(CSRF_HEADER, author.csrf).expect(200);
      const archived = await post('/api/selection-rows', { group: 'copper', hardness: null, wheelId: w.body.id });
      expect(archived.status).to.equal(400);
      expect(archived.body.errors[0].message).to.match(/archived/);
      const band = await post('/api/selection-rows', { group: 'copper', hardness: { min: 50, max: 20, scale: 'HRB' }, wheelId: w.body.id });
      expect(band.status).to.equal(400);
      expect(band.body.errors.map((e: { path: string }) => e.path)).to.include('hardness.max');
      expect(await countRows(ctx.db, 'selection_rows')).to.equal(rows);
    });
  });

  describe('lab limits', () => {
    it('gives the feed limits from the settings: ceilings by group × hardness band × machine class, traverse removal ceilings, the long-contact length', async () => {
      const res = await operator.agent.get('/api/settings/limits').expect(200);
      expect(Object.keys(res.body).sort()).to.deep.equal([
        'feedCeilings',
        'kerfAllowanceMm',
        'longContactMm',
        'powerWarningPct',
        'specificEnergyJMm3',
        'traverseRemovalCeilings',
        'wornDiameterShare',
      ]);
      const rows = res.body.feedCeilings as FeedCeiling[];
      const of = (group: string, machineClass: string) => rows.filter((c) => c.group === group && c.machineClass === machineClass);
      // The starting values the data migration carried over from the per-group ceilings (common practice; band limits from memory).
      expect(of('plain-low-alloy-steel', 'floor-abrasive')).to.deep.equal([
        { group: 'plain-low-alloy-steel', hardness: { min: 80, max: 345, scale: 'HV' }, machineClass: 'floor-abrasive', maxFeedMmS: 0.6 },
        { group: 'plain-low-alloy-steel', hardness: { min: 35, max: 50, scale: 'HRC' }, machineClass: 'floor-abrasive', maxFeedMmS: 0.4 },
        { group: 'plain-low-alloy-steel', hardness: { min: 50, max: 68, scale: 'HRC' }, machineClass: 'floor-abrasive', maxFeedMmS: 0.25 },
      ]);
      expect(of('cemented-carbide', 'precision')).to.deep.equal([{ group: 'cemented-carbide', hardness: null, machineClass: 'precision', maxFeedMmS: 0.05 }]);
      expect(of('hardened-tool-steel', 'bench-abrasive').map((c) => c.maxFeedMmS)).to.deep.equal([0.3, 0.2]);
      expect(Object.keys(res.body.traverseRemovalCeilings)).to.have.length(12);
      // 0.6 mm/s through the 40 mm reference section: 24 mm³/s per mm of wheel width
      expect(res.body.traverseRemovalCeilings['plain-low-alloy-steel']).to.equal(24);
      expect(res.body.longContactMm).to.equal(60);
    });

    it('leaves out what does not pass its schema in the stored settings (a bad row, an unknown group, a length that is not positive)', async () => {
      const stored = {
        plunge: [
          { group: 'copper', hardness: null, machineClass: 'precision', maxFeedMmS: 0.1 },
          { group: 'copper', hardness: null, machineClass: 'precision', maxFeedMmS: -1 },
          { group: 'unobtainium', hardness: null, machineClass: 'precision', maxFeedMmS: 0.1 },
          'nonsense',
        ],
        traverseRemoval: { copper: 30, unobtainium: 5, titanium: 'x', __proto__: 3 },
      };
      try {
        await ctx
          .db('lab_settings')
          .where({ id: 1 })
          .update({ feed_limits_json: JSON.stringify(stored), long_contact_mm: 0 });
        const res = await operator.agent.get('/api/settings/limits').expect(200);
        const { feedCeilings, traverseRemovalCeilings, longContactMm } = res.body;
        expect({ feedCeilings, traverseRemovalCeilings, longContactMm }).to.deep.equal({
          feedCeilings: [{ group: 'copper', hardness: null, machineClass: 'precision', maxFeedMmS: 0.1 }],
          traverseRemovalCeilings: { copper: 30 },
          longContactMm: null,
        });
      } finally {
        await restoreLabSettings(ctx.db);
      }
    });
  });

  describe("a coated material's coating hardness", () => {
    it('round-trips on a coated material and is refused on one that is not coated', async () => {
      const coated = await post('/api/materials', materialInput({ name: 'Sprayed coupon', coated: true, coatingHardness: { value: 1150, scale: 'HV' } }));
      expect(coated.status, JSON.stringify(coated.body)).to.equal(201);
      expect(coated.body.coatingHardness).to.deep.equal({ value: 1150, scale: 'HV' });
      expect((await operator.agent.get(`/api/materials/${coated.body.id}`).expect(200)).body.coatingHardness).to.deep.equal({ value: 1150, scale: 'HV' });
      const plain = await post('/api/materials', materialInput({ name: 'Bare coupon', coated: false, coatingHardness: { value: 1150, scale: 'HV' } }));
      expect(plain.status).to.equal(400);
      expect(plain.body.errors.map((e: { path: string }) => e.path)).to.include('coatingHardness');
      const { coatingHardness: _left, ...older } = materialInput({ name: 'Coupon without the field' });
      expect((await post('/api/materials', older).expect(201)).body.coatingHardness).to.equal(null);
    });

    it("gives the worn wheel's default share and the kerf allowance: Kerfbook's defaults (common practice) until the lab sets its own", async () => {
      const res = await operator.agent.get('/api/settings/limits').expect(200);
      expect(res.body).to.deep.include({ wornDiameterShare: 0.7, kerfAllowanceMm: 0.2 });
      try {
        await ctx.db('lab_settings').where({ id: 1 }).update({ worn_diameter_share: 0.75, kerf_allowance_mm: 0.3 });
        expect((await operator.agent.get('/api/settings/limits').expect(200)).body).to.deep.include({ wornDiameterShare: 0.75, kerfAllowanceMm: 0.3 });
        // A value that is no share (or no allowance) is not passed on: the checks get Kerfbook's default.
        await ctx.db('lab_settings').where({ id: 1 }).update({ worn_diameter_share: 1.5, kerf_allowance_mm: null });
        expect((await operator.agent.get('/api/settings/limits').expect(200)).body).to.deep.include({ wornDiameterShare: 0.7, kerfAllowanceMm: 0.2 });
      } finally {
        await ctx.db('lab_settings').where({ id: 1 }).update({ worn_diameter_share: 0.7, kerf_allowance_mm: 0.2 });
      }
    });

    it('gives the specific cutting energy per material group and the motor power share that warns, as the data migration sets them', async () => {
      const res = await operator.agent.get('/api/settings/limits').expect(200);
      // Order-of-magnitude defaults (Malkin & Guo; Kalpakjian & Schmid — from memory), J/mm³.
      expect(res.body.specificEnergyJMm3).to.deep.equal(DEFAULT_SPECIFIC_ENERGY_J_MM3);
      expect(res.body.specificEnergyJMm3['plain-low-alloy-steel']).to.equal(30);
      expect(res.body.specificEnergyJMm3['aluminium-magnesium']).to.equal(10);
      expect(Object.keys(res.body.specificEnergyJMm3)).to.have.length(12);
      expect(res.body.powerWarningPct).to.equal(80);
    });

    it('reads a lab that changed them, and leaves out a group whose value is not a usable number', async () => {
      try {
        await ctx
          .db('lab_settings')
          .where({ id: 1 })
          .update({ specific_energy_json: JSON.stringify({ 'cast-iron': 18, titanium: 'x', copper: -1, unknown: 5 }), power_warning_pct: 70 });
        const res = await operator.agent.get('/api/settings/limits').expect(200);
        expect(res.body.specificEnergyJMm3).to.deep.equal({ 'cast-iron': 18 });
        expect(res.body.powerWarningPct).to.equal(70);
      } finally {
        await restoreLabSettings(ctx.db);
      }
    });
  });
});
