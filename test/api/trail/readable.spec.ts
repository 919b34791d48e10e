/**
 * The trail as an auditor reads it: each event names its record as people know it, the
 * list filters by family of events and can leave sign-ins out (the CSV follows), and the
 * person filter lists everyone by name. Reading only: the chain stays as it was.
 */
import { expect } from 'chai';
import sharp from 'sharp';
import type { PersonNameDto, TrailEventDto, TrailPage } from '../../../shared/recipe-types';
import { TRAIL_FAMILIES } from '../../../shared/vocabulary';
import { addAttachment } from '../../../server/services/recipes/attachments';
import { appendTrailEvent } from '../../../server/services/trail/append';
import { createRecipe } from '../../../server/services/recipes/recipes';
import { verifyChain } from '../../../server/services/trail/verify';
import { listTrail } from '../../../server/services/trail/query';
import { trailQuery } from '../../../shared/schemas/workflow';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { createStockSet, recipeInput, type StockSet } from '../support/stock';
import { signedInAgent, type Agent } from '../support/test-app';

describe('Trail an auditor can read', function () {
  this.timeout(60000);
  const ctx = apiTestContext();
  let auditor: { agent: Agent; csrf: string };
  let writer: TestPerson;
  let stock: StockSet;
  let recipeNumber: string;

  const list = async (query: Record<string, string | number>): Promise<TrailPage> => {
    const res = await auditor.agent.get('/api/trail').query({ limit: 200, ...query });
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    return res.body as TrailPage;
  };
  const types = (items: TrailEventDto[]) => [...new Set(items.map((e) => e.type))].sort();

  before(async () => {
    writer = await createPerson(ctx.db, { roles: ['author'], displayName: 'Wren Author' });
    auditor = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['auditor'], displayName: 'Ada Auditor' }));
    await signedInAgent(ctx.app, writer);
    stock = await createStockSet(ctx.db);
    const w = { userId: writer.id, name: writer.displayName, clientAddress: '' };
    const created = await createRecipe(ctx.db, w, recipeInput(stock, { title: 'Named recipe' }));
    recipeNumber = created.number;
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#808080' } })
      .png()
      .toBuffer();
    await addAttachment(ctx.db, w, created.recipeId, 1, { role: 'setup', caption: '' }, { bytes: png, fileName: 'vise.png', declaredType: 'image/png' });
    // A record that no longer exists keeps the name its event recorded.
    await appendTrailEvent(ctx.db, w, { type: 'material.deleted', entityType: 'material', entityId: 987654, before: { name: 'Gone bronze' } });
    await appendTrailEvent(ctx.db, w, { type: 'user.details_changed', entityType: 'user', entityId: writer.id, after: { email: 'w@example.test' } });
  });

  it('names each record as people know it: recipe number and version, photo, material, person', async () => {
    const items = (await list({})).items;
    const what = (type: string) => items.find((e) => e.type === type)!.what;
    expect(what('recipe.created')).to.equal(`${recipeNumber} · Named recipe`);
    expect(what('attachment.added')).to.equal(`vise.png · ${recipeNumber} v1`);
    expect(items.find((e) => e.type === 'material.created' && e.entityId === String(stock.material.id))!.what).to.equal(stock.material.name);
    expect(items.find((e) => e.type === 'wheel.created' && e.entityId === String(stock.wheel.id))!.what).to.equal(stock.wheel.name);
    expect(items.find((e) => e.type === 'machine.created' && e.entityId === String(stock.machine.id))!.what).to.equal(stock.machine.name);
    expect(what('material.deleted')).to.equal('Gone bronze');
    expect(what('user.details_changed')).to.equal('Wren Author');
    expect(items.filter((e) => e.type === 'session.signed_in').map((e) => e.what)).to.include.members(['Ada Auditor', 'Wren Author']);
  });

  it('looks names up once per kind of record on a page, not once per row', async () => {
    let queries = 0;
    const count = () => queries++;
    ctx.db.on('query', count);
    try {
      const items = (await listTrail(ctx.db, trailQuery.parse({ limit: 200 }))).items;
      expect(items.length).to.be.greaterThan(8);
      // The page itself, then at most one lookup for each of the eight kinds of record.
      expect(queries).to.be.at.most(1 + 8);
    } finally {
      ctx.db.removeListener('query', count);
    }
  });

  it('filters by family of events; an approval is both a recipe event and a signature', async () => {
    expect(types((await list({ family: 'stock' })).items).every((t) => /^(material|wheel|machine|selection_row)\./.test(t))).to.equal(true);
    expect(types((await list({ family: 'stock' })).items)).to.include.members(['material.created', 'material.deleted', 'wheel.created', 'machine.created']);
    expect(types((await list({ family: 'people' })).items)).to.deep.equal(['user.details_changed']);
    expect(types((await list({ family: 'recipes' })).items)).to.deep.equal(['attachment.added', 'recipe.created']);
    expect(types((await list({ family: 'sign-ins' })).items)).to.deep.equal(['session.signed_in']);
    expect((await list({ family: 'signatures' })).items).to.deep.equal([]);
    expect((await list({ family: 'settings' })).items).to.deep.equal([]);
    // A literal underscore: "selection_row." must not match "selectionXrow.".
    await appendTrailEvent(
      ctx.db,
      { userId: null, name: 'x', clientAddress: '' },
      { type: 'selectionXrow.test' as never, entityType: 'selection_row', entityId: null },
    );
    expect(types((await list({ family: 'stock' })).items)).to.not.include('selectionXrow.test');
    // Family and person combine.
    const mine = (await list({ family: 'recipes', userId: writer.id })).items;
    expect(mine.map((e) => e.actorId)).to.deep.equal([writer.id, writer.id]);
  });

  it('leaves sign-ins out on request, in the list and in the CSV', async () => {
    const all = (await list({})).items;
    const shown = (await list({ hideSignIns: 'true' })).items;
    expect(all.some((e) => e.type === 'session.signed_in')).to.equal(true);
    expect(shown.some((e) => e.type.startsWith('session.'))).to.equal(false);
    expect(shown.length).to.equal(all.filter((e) => !e.type.startsWith('session.')).length);
    const csv = await auditor.agent.get('/api/trail.csv').query({ hideSignIns: 'true', family: 'stock' });
    expect(csv.status).to.equal(200);
    const ids = csv.text
      .replace(/^\uFEFF/, '')
      .split('\r\n')
      .slice(1, -1)
      .map((line) => Number(line.split(',')[0]));
    expect(ids).to.deep.equal((await list({ family: 'stock', hideSignIns: 'true' })).items.map((e) => e.id));
    expect(ids.length).to.be.greaterThan(2);
  });

  it('refuses an unknown family or toggle with a clear message and the field', async () => {
    for (const [query, path] of [
      [{ family: 'everything' }, 'family'],
      [{ hideSignIns: 'yes' }, 'hideSignIns'],
    ] as const) {
      const res = await auditor.agent.get('/api/trail').query(query);
      expect(res.status).to.equal(400);
      expect(res.body.code).to.equal('VALIDATION_FAILED');
      const error = (res.body.errors as { path: string; message: string }[]).find((e) => e.path === path)!;
      expect(error, JSON.stringify(res.body)).to.not.equal(undefined);
      if (path === 'family') for (const family of TRAIL_FAMILIES) expect(error.message).to.include(family);
    }
  });

  it('lists everyone by name for the person filter, to auditors and admins only', async () => {
    const res = await auditor.agent.get('/api/trail/people');
    expect(res.status).to.equal(200);
    const people = res.body.items as PersonNameDto[];
    expect(people.find((p) => p.id === writer.id)).to.deep.equal({ id: writer.id, displayName: 'Wren Author', active: true });
    const names = people.map((p) => p.displayName);
    expect(names).to.deep.equal([...names].sort((a, b) => a.localeCompare(b)));
    expect(Object.keys(people[0]!).sort()).to.deep.equal(['active', 'displayName', 'id']);
    const author = await signedInAgent(ctx.app, writer);
    expect((await author.agent.get('/api/trail/people')).status).to.equal(403);
  });

  it('leaves the chain intact: reading changes no row', async () => {
    expect((await verifyChain(ctx.db)).ok).to.equal(true);
  });
});
