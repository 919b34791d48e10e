/**
 * Reading the trail: filters (recipe, person, type, UTC days), keyset pages newest first,
 * and the CSV export (RFC 4180, UTF-8 with BOM, formula cells neutralised).
 */
import { expect } from 'chai';
import sharp from 'sharp';
import type { TrailEventDto, TrailPage } from '../../../shared/recipe-types';
import { addAttachment } from '../../../server/services/recipes/attachments';
import { appendTrailEvent } from '../../../server/services/trail/append';
import { createRecipe, saveDraft } from '../../../server/services/recipes/recipes';
import { openTrailCsv } from '../../../server/services/trail/csv';
import { trailQuery } from '../../../shared/schemas/workflow';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { createStockSet, recipeInput } from '../support/stock';
import { anonymousAgent, signedInAgent, type Agent } from '../support/test-app';

/** A small RFC 4180 reader: quoted fields, doubled quotes, CRLF records. */
function parseCsv(text: string): string[][] {
  const records: string[][] = [];
  let field = '';
  let record: string[] = [];
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') {
      record.push(field);
      field = '';
    } else if (ch === '\r' && text[i + 1] === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      i++;
    } else field += ch;
  }
  if (field !== '' || record.length > 0) throw new Error('The CSV does not end with CRLF.');
  return records;
}

describe('Trail list and CSV export', function () {
  this.timeout(60000);
  const ctx = apiTestContext();
  let auditor: { agent: Agent; csrf: string };
  let writer: TestPerson;
  let other: TestPerson;
  let recipeA: number;
  let recipeB: number;

  const list = async (query: Record<string, string | number>): Promise<TrailPage> => {
    const res = await auditor.agent.get('/api/trail').query(query);
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    return res.body as TrailPage;
  };

  /** Every page, following nextBefore. */
  const everything = async (query: Record<string, string | number>): Promise<TrailEventDto[]> => {
    const items: TrailEventDto[] = [];
    let before: number | null = null;
    for (let guard = 0; guard < 100; guard++) {
      const page = await list(before === null ? query : { ...query, before });
      items.push(...page.items);
      if (page.nextBefore === null) return items;
      before = page.nextBefore;
    }
    throw new Error('Paging did not end.');
  };

  before(async () => {
    auditor = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['auditor'] }));
    writer = await createPerson(ctx.db, { roles: ['author'], displayName: 'Trail Writer' });
    other = await createPerson(ctx.db, { roles: ['author'], displayName: 'Other Writer' });
    const w = { userId: writer.id, name: writer.displayName, clientAddress: '10.0.0.5' };
    const o = { userId: other.id, name: other.displayName, clientAddress: '10.0.0.6' };
    const stock = await createStockSet(ctx.db);
    const a = await createRecipe(ctx.db, w, recipeInput(stock, { title: 'Recipe A' }));
    const b = await createRecipe(ctx.db, o, recipeInput(stock, { title: 'Recipe B' }));
    recipeA = a.recipeId;
    recipeB = b.recipeId;
    await saveDraft(ctx.db, w, recipeA, 1, { revision: 0, title: 'Recipe A', content: { ...a.content, instructionsMd: 'Cut slowly.' } });
    await saveDraft(ctx.db, o, recipeB, 1, { revision: 0, title: 'Recipe B', content: { ...b.content, instructionsMd: 'Cut.' } });
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#808080' } })
      .png()
      .toBuffer();
    await addAttachment(
      ctx.db,
      w,
      recipeA,
      1,
      { role: 'setup', caption: 'µ-scale setup, Ø 20 mm' },
      { bytes: png, fileName: 'setup.png', declaredType: 'image/png' },
    );

    // Events at chosen moments around UTC day boundaries, and names a spreadsheet could misread.
    const at = (iso: string) => new Date(iso);
    const who = (name: string) => ({ userId: other.id, name, clientAddress: '' });
    await appendTrailEvent(
      ctx.db,
      who('Night Shift'),
      { type: 'user.details_changed', entityType: 'user', entityId: other.id, before: { displayName: 'a' }, after: { displayName: 'b' } },
      at('2020-03-01T23:59:59.999Z'),
    );
    await appendTrailEvent(
      ctx.db,
      who('=HYPERLINK("http://x.example"), "µm" ø'),
      { type: 'user.details_changed', entityType: 'user', entityId: other.id, after: { note: 'says "hi",\nthen leaves' } },
      at('2020-03-02T00:00:00.000Z'),
    );
    await appendTrailEvent(ctx.db, who('+1 plus'), { type: 'user.details_changed', entityType: 'user', entityId: other.id }, at('2020-03-02T23:59:59.999Z'));
    await appendTrailEvent(ctx.db, who('-1 minus'), { type: 'user.details_changed', entityType: 'user', entityId: other.id }, at('2020-03-03T00:00:00.000Z'));
    await appendTrailEvent(ctx.db, who('@at sign'), { type: 'user.details_changed', entityType: 'user', entityId: other.id }, at('2020-03-04T12:00:00.000Z'));
  });

  describe('GET /api/trail', () => {
    it('answers newest first, with the chain hashes and before/after as JSON', async () => {
      const page = await list({ limit: 200 });
      const ids = page.items.map((e) => e.id);
      expect(ids).to.deep.equal([...ids].sort((x, y) => y - x));
      expect(page.nextBefore).to.equal(null);
      const upload = page.items.find((e) => e.type === 'attachment.added')!;
      expect(upload).to.include({ actorId: writer.id, actorName: 'Trail Writer', entityType: 'attachment', clientAddress: '10.0.0.5' });
      expect(upload.after).to.include({ caption: 'µ-scale setup, Ø 20 mm', fileName: 'setup.png' });
      expect(upload.hash).to.match(/^[0-9a-f]{64}$/);
      const older = page.items[page.items.indexOf(upload) + 1]!;
      expect(upload.prevHash).to.equal(older.hash);
    });

    it('filters by recipe: events on the recipe, its versions and its photos, none of another recipe', async () => {
      const a = await everything({ recipeId: recipeA });
      expect(a.map((e) => e.type).sort()).to.deep.equal(['attachment.added', 'recipe.created', 'recipe.draft_saved']);
      const b = await everything({ recipeId: recipeB });
      expect(b.map((e) => e.type).sort()).to.deep.equal(['recipe.created', 'recipe.draft_saved']);
      expect((await list({ recipeId: 999999 })).items).to.deep.equal([]);
    });

    it('filters by person and by type, and combines filters', async () => {
      const mine = await everything({ userId: writer.id });
      expect(mine.length).to.equal(3);
      expect(mine.every((e) => e.actorId === writer.id)).to.equal(true);
      const saves = await everything({ type: 'recipe.draft_saved' });
      expect(saves.map((e) => e.actorId).sort()).to.deep.equal([writer.id, other.id].sort());
      const both = await everything({ type: 'recipe.draft_saved', userId: other.id, recipeId: recipeB });
      expect(both).to.have.length(1);
      expect(await everything({ type: 'recipe.draft_saved', userId: other.id, recipeId: recipeA })).to.deep.equal([]);
    });

    it('takes from and to as whole UTC days, both included', async () => {
      const names = async (q: Record<string, string>) => (await everything(q)).map((e) => e.actorName);
      expect(await names({ from: '2020-03-02', to: '2020-03-02' })).to.deep.equal(['+1 plus', '=HYPERLINK("http://x.example"), "µm" ø']);
      expect(await names({ from: '2020-03-03', to: '2020-03-04' })).to.deep.equal(['@at sign', '-1 minus']);
      expect(await names({ to: '2020-03-01' })).to.deep.equal(['Night Shift']);
      const fromOnly = await names({ from: '2020-03-04' });
      expect(fromOnly).to.include('@at sign').and.not.include('-1 minus');
    });

    it('pages by id with `before`, without gaps or repeats, until nextBefore is null', async () => {
      const all = (await list({ limit: 200 })).items.map((e) => e.id);
      expect(all.length).to.be.greaterThan(5);
      const first = await list({ limit: 2 });
      expect(first.items.map((e) => e.id)).to.deep.equal(all.slice(0, 2));
      expect(first.nextBefore).to.equal(all[1]);
      const paged = (await everything({ limit: 2 })).map((e) => e.id);
      expect(paged).to.deep.equal(all);
      // A page that ends exactly at the last row says so.
      const exact = await list({ limit: all.length });
      expect(exact.nextBefore).to.equal(null);
      const filteredPaged = (await everything({ limit: 1, userId: writer.id })).map((e) => e.id);
      expect(filteredPaged).to.have.length(3);
    });

    it('answers 400 VALIDATION_FAILED with the field for bad queries, and never 500', async () => {
      const cases: [Record<string, string>, string][] = [
        [{ limit: '0' }, 'limit'],
        [{ limit: '201' }, 'limit'],
        [{ before: 'abc' }, 'before'],
        [{ recipeId: '-1' }, 'recipeId'],
        [{ from: '2020-3-1' }, 'from'],
        [{ from: '2020-02-30' }, 'from'],
        [{ to: '2021-13-01' }, 'to'],
        [{ from: '2020-03-05', to: '2020-03-04' }, 'to'],
        [{ type: 'x'.repeat(61) }, 'type'],
        [{ sort: 'id' }, ''],
      ];
      for (const [query, path] of cases) {
        for (const url of ['/api/trail', '/api/trail.csv']) {
          const res = await auditor.agent.get(url).query(query);
          expect(res.status, `${url} ${JSON.stringify(query)}`).to.equal(400);
          expect(res.body.code).to.equal('VALIDATION_FAILED');
          expect(
            res.body.errors.map((e: { path: string }) => e.path),
            JSON.stringify(query),
          ).to.include(path);
        }
      }
    });
  });

  describe('GET /api/trail.csv', () => {
    it('sends every matching row as an attachment: UTF-8 with BOM, header, RFC 4180 quoting, CRLF', async () => {
      const res = await auditor.agent
        .get('/api/trail.csv')
        .buffer(true)
        .parse((r, done) => {
          const chunks: Buffer[] = [];
          r.on('data', (c: Buffer) => chunks.push(c));
          r.on('end', () => done(null, Buffer.concat(chunks)));
        });
      expect(res.status).to.equal(200);
      expect(res.headers['content-type']).to.equal('text/csv; charset=utf-8');
      const day = new Date().toISOString().slice(0, 10).replace(/-/g, '');
      expect(res.headers['content-disposition']).to.equal(`attachment; filename="kerfbook-trail-${day}.csv"`);
      const bytes = res.body as Buffer;
      expect([...bytes.subarray(0, 3)]).to.deep.equal([0xef, 0xbb, 0xbf]);
      const text = bytes.toString('utf8').slice(1);
      const records = parseCsv(text);
      expect(records[0]).to.deep.equal([
        'id',
        'occurred_at_utc',
        'actor_id',
        'actor_name',
        'type',
        'entity_type',
        'entity_id',
        'before',
        'after',
        'client_address',
        'prev_hash',
        'hash',
      ]);

      // The same rows as the list, in the same order, field for field.
      const items = await everything({});
      expect(records.slice(1).map((r) => Number(r[0]))).to.deep.equal(items.map((e) => e.id));
      const byId = new Map(records.slice(1).map((r) => [Number(r[0]), r]));
      const upload = items.find((e) => e.type === 'attachment.added')!;
      const row = byId.get(upload.id)!;
      expect(row.slice(1, 7)).to.deep.equal([upload.occurredAt, String(writer.id), 'Trail Writer', 'attachment.added', 'attachment', upload.entityId]);
      expect(JSON.parse(row[8]!)).to.deep.equal(upload.after);
      expect(row[8]).to.include('µ-scale setup, Ø 20 mm');
      expect(row.slice(9)).to.deep.equal(['10.0.0.5', upload.prevHash, upload.hash]);
    });

    it('neutralises cells a spreadsheet would run as a formula, and quotes commas, quotes and line breaks', async () => {
      const res = await auditor.agent.get('/api/trail.csv').query({ from: '2020-03-01', to: '2020-03-04' });
      const text = res.text.replace(/^\uFEFF/, '');
      // The raw text: quote doubled, the whole cell quoted, a single quote before the "=".
      expect(text).to.include(`"'=HYPERLINK(""http://x.example""), ""µm"" ø"`);
      expect(text).to.include(`"{""note"":""says \\""hi\\"",\\nthen leaves""}"`);
      const names = parseCsv(text)
        .slice(1)
        .map((r) => r[3]);
      expect(names).to.deep.equal(["'@at sign", "'-1 minus", "'+1 plus", `'=HYPERLINK("http://x.example"), "µm" ø`, 'Night Shift']);
    });

    it('applies the list filters, and ignores paging (the export is the whole selection)', async () => {
      const res = await auditor.agent.get('/api/trail.csv').query({ recipeId: recipeA, limit: 1 });
      const records = parseCsv(res.text.replace(/^\uFEFF/, '')).slice(1);
      expect(records.map((r) => r[4]).sort()).to.deep.equal(['attachment.added', 'recipe.created', 'recipe.draft_saved']);
      const empty = await auditor.agent.get('/api/trail.csv').query({ type: 'no.such_type' });
      expect(empty.status).to.equal(200);
      expect(parseCsv(empty.text.replace(/^\uFEFF/, ''))).to.have.length(1);
    });

    it('reads the rows batch by batch without losing or repeating one', async () => {
      const all = await everything({});
      for (const size of [1, 2, 3, all.length, all.length + 1]) {
        let text = '';
        for await (const chunk of await openTrailCsv(ctx.db, trailQuery.parse({}), size)) text += chunk;
        const ids = parseCsv(text.replace(/^\uFEFF/, ''))
          .slice(1)
          .map((r) => Number(r[0]));
        expect(ids, `batch of ${size}`).to.deep.equal(all.map((e) => e.id));
      }
    });
  });

  describe('access', () => {
    it('lets auditors and admins read and export; other roles get 403, strangers 401', async () => {
      const admin = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['admin'] }));
      for (const url of ['/api/trail', '/api/trail.csv']) {
        expect((await admin.agent.get(url)).status, url).to.equal(200);
        expect((await auditor.agent.get(url)).status, url).to.equal(200);
        for (const role of ['author', 'approver', 'operator'] as const) {
          const s = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: [role] }));
          const res = await s.agent.get(url);
          expect(res.status, `${url} as ${role}`).to.equal(403);
          expect(res.body.code).to.equal('FORBIDDEN');
        }
        const anon = await anonymousAgent(ctx.app);
        expect((await anon.agent.get(url)).status).to.equal(401);
      }
    });
  });
});
