import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { RecipeVersionDto, StaleSaveBody } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, recipeInput, type StockSet } from '../support/stock';
import { signedInAgent, type Agent } from '../support/test-app';
import { asJson, countRows } from '../support/test-database';
import { act, ok, sessionFor, type Session } from '../workflow/workflow-support';

describe('Recipes and drafts', () => {
  const ctx = apiTestContext();
  let author: { agent: Agent; csrf: string };
  let author2: { agent: Agent; csrf: string };
  let reader: { agent: Agent; csrf: string };
  let stock: StockSet;

  before(async () => {
    author = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['author'], displayName: 'Ines Author' }));
    author2 = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['author'], displayName: 'Second Author' }));
    reader = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['auditor'] }));
    stock = await createStockSet(ctx.db);
  });

  const create = (body: unknown, who = author) =>
    who.agent
      .post('/api/recipes')
      .set(CSRF_HEADER, who.csrf)
      .send(body as object);
  const save = (id: number, n: number, body: unknown, who = author) =>
    who.agent
      .put(`/api/recipes/${id}/versions/${n}`)
      .set(CSRF_HEADER, who.csrf)
      .send(body as object);
  let approverSession: Session | undefined;
  const approver = async () => (approverSession ??= await sessionFor(ctx.app, ctx.db, ['approver']));
  const draftOf = (v: RecipeVersionDto, change: Partial<RecipeVersionDto['content']> = {}, title = v.title) => ({
    revision: v.revision,
    title,
    content: { ...v.content, ...change },
  });

  describe('create', () => {
    it('hands out the number, makes version 1 a draft, runs the checks and writes one trail row', async () => {
      const events = await countRows(ctx.db, 'trail_events');
      const res = await create(recipeInput(stock));
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      const dto = res.body as RecipeVersionDto;
      expect(dto.number).to.match(/^KB-\d{4}$/);
      expect(dto).to.include({ version: 1, status: 'draft', revision: 0, contentHash: null, title: 'C45 bar, transverse' });
      expect(dto.checks).to.be.an('array');
      expect(dto.checks.filter((c) => c.severity === 'blocker')).to.deep.equal([]);
      expect(dto.createdBy.name).to.equal('Ines Author');
      expect(dto.attachments).to.deep.equal([]);
      expect(dto.content).to.deep.equal(recipeInput(stock).content);
      expect(await countRows(ctx.db, 'trail_events')).to.equal(events + 1);
      const event = await ctx.db('trail_events').orderBy('id', 'desc').first();
      expect(event).to.include({ event_type: 'recipe.created', entity_type: 'recipe', entity_id: String(dto.recipeId) });
      expect(asJson(event.after_json)).to.include({ number: dto.number, version: 1 });
    });

    it('stores the content as canonical JSON (keys sorted at every level)', async () => {
      const res = await create(recipeInput(stock, { title: 'Canonical' })).expect(201);
      const row = await ctx.db('recipe_versions').where({ recipe_id: res.body.recipeId }).first();
      const text: string = row.content_json;
      expect(text.indexOf('"acceptanceMd"')).to.be.lessThan(text.indexOf('"changeReason"'));
      expect(text.indexOf('"cutting"')).to.be.lessThan(text.indexOf('"scope"'));
      expect(text.indexOf('"group"')).to.be.lessThan(text.indexOf('"materialId"'));
      expect(text).to.not.match(/\n|": /);
    });

    it('never gives two concurrent creates the same number', async () => {
      const results = await Promise.all(Array.from({ length: 6 }, (_, i) => create(recipeInput(stock, { title: `Concurrent ${i}` }))));
      for (const r of results) expect(r.status, JSON.stringify(r.body)).to.equal(201);
      const numbers = results.map((r) => r.body.number as string);
      expect(new Set(numbers).size).to.equal(6);
    });

    it('saves a wheel too small for the scope, with a capacity blocker', async () => {
      // 250 mm wheel, 70 mm flange: (250 − 70)/2 − 5 = 85 mm; a 120 mm bar does not fit.
      const res = await create(recipeInput(stock, { title: 'Too big', scope: { sizeMinMm: 90, sizeMaxMm: 120 } }));
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      const blocker = (res.body as RecipeVersionDto).checks.find((c) => c.id.startsWith('scope-exceeds-capacity') || c.id.startsWith('capacity'));
      expect(blocker, JSON.stringify(res.body.checks)).to.not.equal(undefined);
      expect(blocker!.severity).to.equal('blocker');
      const row = await ctx.db('recipe_versions').where({ recipe_id: res.body.recipeId }).first();
      expect(row.worst_check).to.equal('blocker');
    });

    it('warns about archived stock but accepts it', async () => {
      const archivedSet = await createStockSet(ctx.db, { wheel: { name: 'Archived wheel' } });
      await author.agent.post(`/api/wheels/${archivedSet.wheel.id}/archive`).set(CSRF_HEADER, author.csrf).expect(200);
      const res = await create(recipeInput(archivedSet, { title: 'On an archived wheel' }));
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      const warning = (res.body as RecipeVersionDto).checks.find((c) => c.id === 'stock-archived');
      expect(warning).to.include({ severity: 'warning', path: 'cutting.wheelId' });
    });

    it('refuses unknown material, machine and wheel ids with 400 naming each field, writing nothing', async () => {
      const before = {
        recipes: await countRows(ctx.db, 'recipes'),
        versions: await countRows(ctx.db, 'recipe_versions'),
        events: await countRows(ctx.db, 'trail_events'),
      };
      const res = await create(recipeInput(stock, { scope: { materialId: 999991 }, cutting: { machineId: 999992, wheelId: 999993 } }));
      expect(res.status).to.equal(400);
      expect(res.body.code).to.equal('VALIDATION_FAILED');
      expect(res.body.errors.map((e: { path: string }) => e.path).sort()).to.deep.equal([
        'content.cutting.machineId',
        'content.cutting.wheelId',
        'content.scope.materialId',
      ]);
      expect(await countRows(ctx.db, 'recipes')).to.equal(before.recipes);
      expect(await countRows(ctx.db, 'recipe_versions')).to.equal(before.versions);
      expect(await countRows(ctx.db, 'trail_events')).to.equal(before.events);
      const counter = await ctx.db('recipe_number_counter').first();
      const last = await ctx.db('recipes').max({ n: 'number' }).first();
      expect(`KB-${String(counter.last_number).padStart(4, '0')}`).to.equal(last!.n);
    });

    it('refuses a group that is not the material’s own', async () => {
      const res = await create(recipeInput(stock, { scope: { group: 'copper' } }));
      expect(res.status).to.equal(400);
      expect(res.body.errors[0].path).to.equal('content.scope.group');
    });

    const bad: [string, Record<string, object>, string][] = [
      ['zero rpm', { cutting: { wheelRpm: 0 } }, 'content.cutting.wheelRpm'],
      ['a negative feed', { cutting: { feedMmS: -0.1 } }, 'content.cutting.feedMmS'],
      ['NaN sent as text', { cutting: { feedMmS: 'NaN' as unknown as object } }, 'content.cutting.feedMmS'],
      ['a huge size', { scope: { sizeMaxMm: 1e308 } }, 'content.scope.sizeMaxMm'],
      ['a non-numeric rpm', { cutting: { wheelRpm: 'fast' as unknown as object } }, 'content.cutting.wheelRpm'],
      ['an upside-down size window', { scope: { sizeMinMm: 80, sizeMaxMm: 20 } }, 'content.scope.sizeMaxMm'],
      ['an unknown cut motion', { cutting: { cutMotion: 'spiral' as unknown as object } }, 'content.cutting.cutMotion'],
      ['a water-soluble coolant without concentration', { coolant: { concentrationPct: null as unknown as object } }, 'content.coolant.concentrationPct'],
    ];
    for (const [what, change, path] of bad) {
      it(`refuses ${what} with 400 at ${path}, writing nothing`, async () => {
        const versions = await countRows(ctx.db, 'recipe_versions');
        const res = await create(recipeInput(stock, change));
        expect(res.status, JSON.stringify(res.body)).to.equal(400);
        expect(res.body.errors.map((e: { path: string }) => e.path)).to.include(path);
        expect(await countRows(ctx.db, 'recipe_versions')).to.equal(versions);
      });
    }

    it('lets only authors create', async () => {
      const res = await create(recipeInput(stock), reader);
      expect(res.status).to.equal(403);
    });

    it('stores Markdown with script-like text verbatim and returns it as a JSON string', async () => {
      const md = '<script>alert(1)</script>\n\n![x](y.png" onerror="alert(2))\n\n[click](javascript:alert(3))\n\n<img src=x onerror=alert(4)>';
      const res = await create(recipeInput(stock, { title: 'Markdown <b>title</b>', instructionsMd: md })).expect(201);
      expect(res.type).to.equal('application/json');
      const got = await reader.agent.get(`/api/recipes/${res.body.recipeId}/versions/1`).expect(200);
      expect(got.body.content.instructionsMd).to.equal(md);
      expect(got.body.title).to.equal('Markdown <b>title</b>');
    });
  });

  describe('save draft', () => {
    let base: RecipeVersionDto;
    beforeEach(async () => {
      base = (await create(recipeInput(stock, { title: 'Draft to save' })).expect(201)).body;
    });

    it('saves, bumps the revision, re-runs the checks and writes a compact trail row', async () => {
      const res = await save(base.recipeId, 1, draftOf(base, { cutting: { ...base.content.cutting, feedMmS: 0.9 } }, 'Draft, faster feed'));
      expect(res.status, JSON.stringify(res.body)).to.equal(200);
      expect(res.body).to.include({ revision: 1, title: 'Draft, faster feed', status: 'draft' });
      expect(res.body.content.cutting.feedMmS).to.equal(0.9);
      // 0.9 mm/s is above the 0.6 mm/s ceiling for plain steels.
      expect(res.body.checks.map((c: { id: string }) => c.id)).to.include('feed-above-ceiling');
      const event = await ctx.db('trail_events').where({ event_type: 'recipe.draft_saved' }).orderBy('id', 'desc').first();
      expect(asJson(event.before_json)).to.deep.equal({ revision: 0, title: 'Draft to save', worstCheck: null });
      expect(asJson(event.after_json)).to.deep.equal({ revision: 1, changed: ['cutting'], title: 'Draft, faster feed', worstCheck: 'warning' });
      const list = await reader.agent.get('/api/recipes').query({ q: 'faster feed' }).expect(200);
      expect(list.body.items[0]).to.include({ title: 'Draft, faster feed', worstCheck: 'warning' });
    });

    it('lets exactly one of two concurrent saves of the same revision win; the other gets 409 with the current version', async () => {
      const a = draftOf(base, { instructionsMd: 'Version A' });
      const b = draftOf(base, { instructionsMd: 'Version B' });
      const [ra, rb] = await Promise.all([save(base.recipeId, 1, a), save(base.recipeId, 1, b, author2)]);
      const statuses = [ra.status, rb.status].sort();
      expect(statuses, JSON.stringify([ra.body, rb.body])).to.deep.equal([200, 409]);
      const [won, lost] = ra.status === 200 ? [ra, rb] : [rb, ra];
      const body = lost.body as StaleSaveBody;
      expect(body.code).to.equal('CONFLICT');
      expect(body.errors[0]!.path).to.equal('revision');
      expect(body.current.revision).to.equal(1);
      expect(body.current.content.instructionsMd).to.equal(won.body.content.instructionsMd);
      const stored = await reader.agent.get(`/api/recipes/${base.recipeId}/versions/1`).expect(200);
      expect(stored.body.content.instructionsMd).to.equal(won.body.content.instructionsMd);
      expect(stored.body.content).to.deep.equal(won.body.content);
      expect(
        await ctx
          .db('trail_events')
          .where({ event_type: 'recipe.draft_saved', entity_id: String(await versionId(base.recipeId)) })
          .count({ n: '*' })
          .first(),
      ).to.deep.equal({ n: 1 });
    });

    async function versionId(recipeId: number): Promise<number> {
      return (await ctx.db('recipe_versions').where({ recipe_id: recipeId, version: 1 }).first('id')).id;
    }

    it('answers a stale revision with 409 and the current content, writing nothing', async () => {
      await save(base.recipeId, 1, draftOf(base, { cautionsMd: 'first' })).expect(200);
      const events = await countRows(ctx.db, 'trail_events');
      const res = await save(base.recipeId, 1, draftOf(base, { cautionsMd: 'stale' }));
      expect(res.status).to.equal(409);
      expect(res.body.current.content.cautionsMd).to.equal('first');
      expect(res.body.current.revision).to.equal(1);
      expect(await countRows(ctx.db, 'trail_events')).to.equal(events);
    });

    /** Submitted by its author through the API (the database allows no shortcut). */
    async function submitted(v: RecipeVersionDto): Promise<RecipeVersionDto> {
      const res = await author.agent
        .post(`/api/recipes/${v.recipeId}/versions/${v.version}/submit`)
        .set(CSRF_HEADER, author.csrf)
        .send({ revision: v.revision });
      expect(res.status, JSON.stringify(res.body)).to.equal(200);
      return res.body as RecipeVersionDto;
    }

    it('refuses to save a version that is not a draft with 409 and a clear message', async () => {
      ok(await act.approve(await approver(), await submitted(base)));
      const res = await save(base.recipeId, 1, draftOf(base, { cautionsMd: 'too late' }));
      expect(res.status).to.equal(409);
      expect(res.body.code).to.equal('CONFLICT');
      expect(res.body.errors[0].message).to.match(/approved.*only drafts can be edited/);
      const row = await ctx.db('recipe_versions').where({ recipe_id: base.recipeId, version: 1 }).first();
      expect(JSON.parse(row.content_json).cautionsMd).to.equal('');
    });

    it('turns a returned version back into a draft when it is edited', async () => {
      const returned = ok(await act.return(await approver(), await submitted(base)));
      const res = await save(base.recipeId, 1, draftOf(returned, { cautionsMd: 'fixed as asked' }));
      expect(res.status, JSON.stringify(res.body)).to.equal(200);
      expect(res.body.status).to.equal('draft');
      const event = await ctx.db('trail_events').where({ event_type: 'recipe.draft_saved' }).orderBy('id', 'desc').first();
      expect(asJson(event.before_json)).to.include({ status: 'returned' });
      expect(asJson(event.after_json)).to.include({ status: 'draft' });
    });

    it('refuses unknown ids and bad values, leaving the draft as it was', async () => {
      const unknown = await save(base.recipeId, 1, draftOf(base, { cutting: { ...base.content.cutting, wheelId: 999999 } }));
      expect(unknown.status).to.equal(400);
      expect(unknown.body.errors[0].path).to.equal('content.cutting.wheelId');
      const huge = await save(base.recipeId, 1, draftOf(base, { cutting: { ...base.content.cutting, wheelRpm: 1e308 } }));
      expect(huge.status).to.equal(400);
      const noRevision = await save(base.recipeId, 1, { title: 'x', content: base.content });
      expect(noRevision.status).to.equal(400);
      expect(noRevision.body.errors[0].path).to.equal('revision');
      const row = await ctx.db('recipe_versions').where({ recipe_id: base.recipeId, version: 1 }).first();
      expect(row.revision).to.equal(0);
    });

    it('answers 404 for an unknown recipe or version', async () => {
      expect((await save(999999, 1, draftOf(base))).status).to.equal(404);
      expect((await save(base.recipeId, 7, draftOf(base))).status).to.equal(404);
      expect((await reader.agent.get(`/api/recipes/${base.recipeId}/versions/7`)).status).to.equal(404);
      expect((await reader.agent.get('/api/recipes/999999/versions')).status).to.equal(404);
    });

    it('lists versions newest first', async () => {
      const res = await reader.agent.get(`/api/recipes/${base.recipeId}/versions`).expect(200);
      expect(res.body.map((v: RecipeVersionDto) => v.version)).to.deep.equal([1]);
      expect(res.body[0].checks).to.be.an('array');
    });
  });

  describe('library list', () => {
    let other: StockSet;
    before(async () => {
      other = await createStockSet(ctx.db, {
        material: { name: 'Brass rod', designation: 'CW614N', group: 'copper', hardness: { value: 130, scale: 'HV' } },
        wheel: { name: 'SiC 250', specification: 'C80P5B' },
        machine: { name: 'Second bench saw' },
      });
      await create(recipeInput(other, { title: 'Brass small', scope: { group: 'copper', sizeMinMm: 5, sizeMaxMm: 20, hardness: null } })).expect(201);
      await create(
        recipeInput(other, {
          title: 'Brass tube',
          scope: { group: 'copper', shape: 'tube', wallMm: 2, sizeMinMm: 10, sizeMaxMm: 40, hardness: { min: 100, max: 160, scale: 'HV' } },
        }),
      ).expect(201);
      await create(recipeInput(stock, { title: 'Steel hard window', scope: { hardness: { min: 25, max: 35, scale: 'HRC' } } })).expect(201);
    });

    it('searches number, title, material name and designation', async () => {
      const byDesignation = await reader.agent.get('/api/recipes').query({ q: 'cw614' }).expect(200);
      expect(byDesignation.body.items.map((r: { title: string }) => r.title).sort()).to.deep.equal(['Brass small', 'Brass tube']);
      const byMaterial = await reader.agent.get('/api/recipes').query({ q: 'brass rod' }).expect(200);
      expect(byMaterial.body.total).to.equal(2);
      const first = byMaterial.body.items[0];
      const byNumber = await reader.agent.get('/api/recipes').query({ q: first.number }).expect(200);
      expect(byNumber.body.items.map((r: { id: number }) => r.id)).to.include(first.id);
      expect(first).to.include({
        materialName: 'Brass rod',
        machineName: 'Second bench saw',
        wheelName: 'SiC 250',
        version: 1,
        status: 'draft',
        group: 'copper',
      });
    });

    it('filters by group, shape, machine, status, size and hardness', async () => {
      const copper = await reader.agent.get('/api/recipes').query({ group: 'copper' }).expect(200);
      expect(copper.body.total).to.equal(2);
      const tube = await reader.agent.get('/api/recipes').query({ shape: 'tube' }).expect(200);
      expect(tube.body.items.map((r: { title: string }) => r.title)).to.deep.equal(['Brass tube']);
      const onMachine = await reader.agent.get('/api/recipes').query({ machineId: other.machine.id }).expect(200);
      expect(onMachine.body.total).to.equal(2);
      const size30 = await reader.agent.get('/api/recipes').query({ group: 'copper', size: 30 }).expect(200);
      expect(size30.body.items.map((r: { title: string }) => r.title)).to.deep.equal(['Brass tube']);
      const size5 = await reader.agent.get('/api/recipes').query({ group: 'copper', size: 5 }).expect(200);
      expect(size5.body.items.map((r: { title: string }) => r.title)).to.deep.equal(['Brass small']);
      // 30 HRC ≈ 302 HV (ASTM E140): inside the 25–35 HRC window, outside 170–230 HV.
      const hv300 = await reader.agent.get('/api/recipes').query({ hardnessHv: 300 }).expect(200);
      expect(hv300.body.items.map((r: { title: string }) => r.title)).to.include('Steel hard window');
      expect(hv300.body.items.map((r: { title: string }) => r.title)).to.not.include('Brass tube');
      const hv150 = await reader.agent.get('/api/recipes').query({ hardnessHv: 150, group: 'copper' }).expect(200);
      expect(hv150.body.items.map((r: { title: string }) => r.title)).to.deep.equal(['Brass tube']);
      // One version was marked approved by the "not a draft" test above.
      const approved = await reader.agent.get('/api/recipes').query({ status: 'approved', pageSize: 100 }).expect(200);
      expect(approved.body.total).to.equal(1);
      expect(approved.body.items[0].status).to.equal('approved');
      const drafts = await reader.agent.get('/api/recipes').query({ status: 'draft', pageSize: 100 }).expect(200);
      expect(drafts.body.items.every((r: { status: string }) => r.status === 'draft')).to.equal(true);
      expect((await reader.agent.get('/api/recipes').query({ status: 'in-review' }).expect(200)).body.total).to.equal(0);
    });

    it('sorts and pages', async () => {
      const all = await reader.agent.get('/api/recipes').query({ pageSize: 100, sort: 'title' }).expect(200);
      const titles = all.body.items.map((r: { title: string }) => r.title);
      expect(titles).to.deep.equal([...titles].sort((a: string, b: string) => a.localeCompare(b)));
      const byNumberDesc = await reader.agent.get('/api/recipes').query({ pageSize: 100, sort: 'number', dir: 'desc' }).expect(200);
      const numbers = byNumberDesc.body.items.map((r: { number: string }) => r.number);
      expect(numbers).to.deep.equal([...numbers].sort().reverse());
      const bySize = await reader.agent.get('/api/recipes').query({ pageSize: 100, sort: 'sizeMaxMm' }).expect(200);
      const sizes = bySize.body.items.map((r: { sizeMaxMm: number }) => r.sizeMaxMm);
      expect(sizes).to.deep.equal([...sizes].sort((a: number, b: number) => a - b));
      const page1 = await reader.agent.get('/api/recipes').query({ pageSize: 2, page: 1, sort: 'title' }).expect(200);
      expect(page1.body.items.map((r: { title: string }) => r.title)).to.deep.equal(titles.slice(2, 4));
      expect(page1.body.total).to.equal(all.body.total);
    });

    it('answers 400 to a bad query', async () => {
      for (const query of [{ sort: 'content_json' }, { size: -3 }, { hardnessHv: 'hard' }, { machineId: 'x' }, { status: 'lost' }, { pageSize: 1000 }]) {
        const res = await reader.agent.get('/api/recipes').query(query);
        expect(res.status, JSON.stringify(query)).to.equal(400);
        expect(res.body.code).to.equal('VALIDATION_FAILED');
      }
    });
  });

  describe('content stored before the wheel path through a coating existed', () => {
    it('loads without the field, reads as "not given" in the checks, and saves and submits like any other', async () => {
      const coated = await createStockSet(ctx.db, { material: { name: 'Sprayed bar', coated: true, coatingHardness: { value: 1150, scale: 'HV' } } });
      const body = recipeInput(coated, { title: 'Stored before the wheel path' });
      const created = (await create(body).expect(201)).body as RecipeVersionDto;
      // As an older version of Kerfbook stored it: no wheelPath key at all.
      const old = JSON.parse((await ctx.db('recipe_versions').where({ recipe_id: created.recipeId, version: 1 }).first()).content_json);
      delete old.clamping.wheelPath;
      await ctx
        .db('recipe_versions')
        .where({ recipe_id: created.recipeId, version: 1 })
        .update({ content_json: JSON.stringify(old) });

      const loaded = (await reader.agent.get(`/api/recipes/${created.recipeId}/versions/1`).expect(200)).body as RecipeVersionDto;
      expect('wheelPath' in loaded.content.clamping).to.equal(false);
      // A body without the field (an older client) is accepted and the field reads as null.
      const { wheelPath: _none, ...clampingWithout } = loaded.content.clamping;
      const saved = await save(created.recipeId, 1, { ...draftOf(loaded), content: { ...loaded.content, clamping: clampingWithout } });
      expect(saved.status, JSON.stringify(saved.body)).to.equal(200);
      expect(saved.body.content.clamping.wheelPath).to.equal(null);
      const warning = (saved.body as RecipeVersionDto).checks.find((c) => c.id === 'orientation-rule-missing');
      expect(warning).to.deep.include({ severity: 'warning', path: 'clamping.wheelPath' });

      // Stored without the key again, then submitted: the server's checks run on it and pass it with the warning.
      const again = JSON.parse((await ctx.db('recipe_versions').where({ recipe_id: created.recipeId, version: 1 }).first()).content_json);
      delete again.clamping.wheelPath;
      await ctx
        .db('recipe_versions')
        .where({ recipe_id: created.recipeId, version: 1 })
        .update({ content_json: JSON.stringify(again) });
      const submitted = await author.agent
        .post(`/api/recipes/${created.recipeId}/versions/1/submit`)
        .set(CSRF_HEADER, author.csrf)
        .send({ revision: saved.body.revision });
      expect(submitted.status, JSON.stringify(submitted.body)).to.equal(200);
      expect(submitted.body.status).to.equal('in-review');
      expect((submitted.body as RecipeVersionDto).checks.map((c) => c.id)).to.include('orientation-rule-missing');
    });
  });
});
