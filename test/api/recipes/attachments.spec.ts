import { createHash } from 'node:crypto';
import { expect } from 'chai';
import sharp from 'sharp';
import request from 'supertest';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { AttachmentDto, RecipeVersionDto } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, recipeInput } from '../support/stock';
import { signedInAgent, type Agent } from '../support/test-app';
import { asJson, countRows } from '../support/test-database';
import type { RecipeStatus } from '../../../shared/vocabulary';
import { act, createDraft, ok, sessionFor } from '../workflow/workflow-support';

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/** A real photo-like image made with sharp (a gradient, so it compresses like a picture). */
async function makeImage(format: 'png' | 'jpeg' | 'webp', width = 640, height = 480): Promise<Buffer> {
  const raw = Buffer.alloc(width * height * 3);
  for (let y = 0; y < height; y++)
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 3;
      raw[i] = (x * 255) / width;
      raw[i + 1] = (y * 255) / height;
      raw[i + 2] = 128;
    }
  return sharp(raw, { raw: { width, height, channels: 3 } })
    .toFormat(format)
    .toBuffer();
}

/** Binary supertest responses: collect the bytes. */
function binary(res: unknown, cb: (err: Error | null, body: Buffer) => void): void {
  const stream = res as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(Buffer.from(c)));
  stream.on('end', () => cb(null, Buffer.concat(chunks)));
}

describe('Attachments (photos of a version)', () => {
  const ctx = apiTestContext();
  let author: { agent: Agent; csrf: string };
  let operator: { agent: Agent; csrf: string };
  let draft: RecipeVersionDto;
  let png: Buffer;

  before(async () => {
    author = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['author'] }));
    operator = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['operator'] }));
    const stock = await createStockSet(ctx.db);
    draft = (await author.agent.post('/api/recipes').set(CSRF_HEADER, author.csrf).send(recipeInput(stock)).expect(201)).body;
    png = await makeImage('png');
  });

  const uploadUrl = () => `/api/recipes/${draft.recipeId}/versions/1/attachments`;
  const upload = (
    bytes: Buffer,
    filename: string,
    contentType: string,
    fields: Record<string, string> = { role: 'setup', caption: 'Vise set-up' },
    who = author,
  ) => {
    let req = who.agent.post(uploadUrl()).set(CSRF_HEADER, who.csrf);
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    return req.attach('file', bytes, { filename, contentType });
  };

  async function expectNothingStored(before: { attachments: number; events: number }) {
    expect(await countRows(ctx.db, 'attachments')).to.equal(before.attachments);
    expect(await countRows(ctx.db, 'trail_events')).to.equal(before.events);
  }
  const counts = async () => ({ attachments: await countRows(ctx.db, 'attachments'), events: await countRows(ctx.db, 'trail_events') });

  describe('accepted', () => {
    let stored: AttachmentDto;

    it('stores a real PNG with its sniffed type, size, SHA-256, dimensions and a trail row', async () => {
      const before = await counts();
      const res = await upload(png, 'setup.png', 'image/png');
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      stored = res.body;
      expect(stored).to.include({
        role: 'setup',
        caption: 'Vise set-up',
        fileName: 'setup.png',
        mimeType: 'image/png',
        sizeBytes: png.length,
        sha256: sha256(png),
        width: 640,
        height: 480,
      });
      expect(stored.url).to.equal(`/api/attachments/${stored.id}`);
      expect(stored.thumbnailUrl).to.equal(`/api/attachments/${stored.id}/thumbnail`);
      expect(await countRows(ctx.db, 'attachments')).to.equal(before.attachments + 1);
      const event = await ctx.db('trail_events').where({ event_type: 'attachment.added' }).orderBy('id', 'desc').first();
      expect(asJson(event.after_json)).to.include({ fileName: 'setup.png', sha256: sha256(png), mimeType: 'image/png' });
    });

    it('serves the bytes unchanged with the sniffed type, nosniff, a strong ETag and cache headers; 304 on a match', async () => {
      const res = await author.agent.get(stored.url).buffer(true).parse(binary).expect(200);
      expect(Buffer.compare(res.body as Buffer, png)).to.equal(0);
      expect(res.headers['content-type']).to.equal('image/png');
      expect(res.headers['x-content-type-options']).to.equal('nosniff');
      expect(res.headers['etag']).to.equal(`"${sha256(png)}"`);
      expect(res.headers['cache-control'])
        .to.match(/private/)
        .and.match(/max-age=\d+/);
      const again = await author.agent.get(stored.url).set('If-None-Match', `"${sha256(png)}"`);
      expect(again.status).to.equal(304);
    });

    it('serves a 320 px wide thumbnail', async () => {
      const res = await author.agent.get(stored.thumbnailUrl).buffer(true).parse(binary).expect(200);
      expect(res.headers['content-type']).to.equal('image/webp');
      expect(res.headers['x-content-type-options']).to.equal('nosniff');
      expect(res.headers['etag']).to.match(/^"[0-9a-f]{64}"$/);
      const meta = await sharp(res.body as Buffer).metadata();
      expect(meta.format).to.equal('webp');
      expect(meta.width).to.equal(320);
      expect(meta.height).to.equal(240);
    });

    it('lists the attachment (without bytes) in the version', async () => {
      // A draft: its author reads it (operators see released versions only).
      const res = await author.agent.get(`/api/recipes/${draft.recipeId}/versions/1`).expect(200);
      expect(res.body.attachments).to.deep.equal([stored]);
      const versions = await author.agent.get(`/api/recipes/${draft.recipeId}/versions`).expect(200);
      expect(versions.body[0].attachments).to.deep.equal([stored]);
    });

    it('stores a JPEG and a WebP', async () => {
      const jpeg = await makeImage('jpeg', 400, 800);
      const j = await upload(jpeg, 'good face.JPG', 'image/jpeg', { role: 'good-face' });
      expect(j.status, JSON.stringify(j.body)).to.equal(201);
      expect(j.body).to.include({ mimeType: 'image/jpeg', width: 400, height: 800, role: 'good-face', caption: '' });
      const webp = await makeImage('webp', 300, 200);
      const w = await upload(webp, 'bad.webp', 'image/webp', { role: 'bad-face' });
      expect(w.status, JSON.stringify(w.body)).to.equal(201);
      expect(w.body).to.include({ mimeType: 'image/webp', width: 300, height: 200 });
      // Smaller than the thumbnail width: not enlarged.
      const thumb = await author.agent.get(w.body.thumbnailUrl).buffer(true).parse(binary).expect(200);
      expect((await sharp(thumb.body as Buffer).metadata()).width).to.equal(300);
    });

    it('stores an image close to the 10 MB cap intact (written in pieces)', async function () {
      this.timeout(60000);
      // 1800 × 1800 RGB noise, uncompressed PNG: about 9.7 MB.
      const side = 1800;
      const raw = Buffer.alloc(side * side * 3);
      for (let i = 0; i < raw.length; i++) raw[i] = (i * 2654435761) >>> 24;
      const big = await sharp(raw, { raw: { width: side, height: side, channels: 3 } })
        .png({ compressionLevel: 0 })
        .toBuffer();
      expect(big.length)
        .to.be.greaterThan(9 * 1024 * 1024)
        .and.lessThan(10 * 1024 * 1024);
      const res = await upload(big, 'big.png', 'image/png');
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      expect(res.body.sha256).to.equal(sha256(big));
      const got = await author.agent.get(res.body.url).buffer(true).parse(binary).expect(200);
      expect(sha256(got.body as Buffer)).to.equal(sha256(big));
    });
  });

  describe('refused, storing nothing', () => {
    it('refuses a text file named .png (415)', async () => {
      const before = await counts();
      const res = await upload(Buffer.from('just some notes, not a picture\n'), 'photo.png', 'image/png');
      expect(res.status).to.equal(415);
      expect(res.body.code).to.equal('UNSUPPORTED_MEDIA_TYPE');
      expect(res.body.errors[0]).to.include({ path: 'file' });
      expect(res.body.errors[0].message).to.match(/JPEG, PNG and WebP/);
      await expectNothingStored(before);
    });

    it('refuses PDF and HTML bytes sent as a .png declared image/jpeg', async () => {
      const before = await counts();
      const pdf = Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n');
      const html = Buffer.from('<!DOCTYPE html><html><body><script>alert(1)</script></body></html>');
      for (const bytes of [pdf, html]) {
        const res = await upload(bytes, 'photo.png', 'image/jpeg');
        expect(res.status).to.be.oneOf([400, 415]);
        expect(res.body.errors[0].path).to.equal('file');
      }
      await expectNothingStored(before);
    });

    it('refuses a real PNG whose declared type or extension says otherwise (400)', async () => {
      const before = await counts();
      const declared = await upload(png, 'photo.png', 'image/jpeg');
      expect(declared.status).to.equal(400);
      expect(declared.body.errors[0].message).to.match(/image\/jpeg.*image\/png/);
      const named = await upload(png, 'photo.jpg', 'image/png');
      expect(named.status).to.equal(400);
      expect(named.body.errors[0].message).to.match(/photo\.jpg/);
      await expectNothingStored(before);
    });

    it('refuses SVG (it can carry scripts)', async () => {
      const before = await counts();
      const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(1)</script><rect width="10" height="10"/></svg>');
      for (const [name, type] of [
        ['x.svg', 'image/svg+xml'],
        ['x.png', 'image/png'],
      ]) {
        const res = await upload(svg, name!, type!);
        expect(res.status, name).to.equal(415);
      }
      await expectNothingStored(before);
    });

    it('refuses a truncated PNG that cannot be decoded', async () => {
      const before = await counts();
      const res = await upload(png.subarray(0, Math.floor(png.length / 2)), 'cut.png', 'image/png');
      expect(res.status).to.equal(400);
      expect(res.body.errors[0].message).to.match(/could not be read/);
      await expectNothingStored(before);
    });

    it('answers 413 over 10 MB', async function () {
      this.timeout(60000);
      const before = await counts();
      const big = Buffer.concat([png, Buffer.alloc(10 * 1024 * 1024 + 1 - png.length)]);
      const res = await upload(big, 'huge.png', 'image/png');
      expect(res.status).to.equal(413);
      expect(res.body.code).to.equal('PAYLOAD_TOO_LARGE');
      expect(res.body.errors[0].message).to.match(/10 MB/);
      await expectNothingStored(before);
    });

    it('asks for the file when none is sent, and checks the fields', async () => {
      const before = await counts();
      const none = await author.agent.post(uploadUrl()).set(CSRF_HEADER, author.csrf).field('role', 'setup');
      expect(none.status).to.equal(400);
      expect(none.body.errors[0].path).to.equal('file');
      const json = await author.agent.post(uploadUrl()).set(CSRF_HEADER, author.csrf).send({ role: 'setup' });
      expect(json.status).to.equal(400);
      const role = await upload(png, 'x.png', 'image/png', { role: 'selfie' });
      expect(role.status).to.equal(400);
      expect(role.body.errors[0].path).to.equal('role');
      const wrongField = await author.agent
        .post(uploadUrl())
        .set(CSRF_HEADER, author.csrf)
        .attach('photo', png, { filename: 'x.png', contentType: 'image/png' });
      expect(wrongField.status).to.equal(400);
      await expectNothingStored(before);
    });

    it('refuses uploads from non-authors and without the CSRF token', async () => {
      const before = await counts();
      const asOperator = await upload(png, 'x.png', 'image/png', {}, operator);
      expect(asOperator.status).to.equal(403);
      const noToken = await author.agent.post(uploadUrl()).attach('file', png, { filename: 'x.png', contentType: 'image/png' });
      expect(noToken.status).to.equal(403);
      expect(noToken.body.code).to.equal('CSRF_INVALID');
      await expectNothingStored(before);
    });

    it('keeps multipart bodies off routes that take JSON', async () => {
      const res = await author.agent.post('/api/materials').set(CSRF_HEADER, author.csrf).field('name', 'x');
      expect(res.status).to.equal(415);
    });
  });

  describe('delete, and only on drafts', () => {
    it('deletes an attachment of a draft with a trail row; 404 afterwards', async () => {
      const added = (await upload(png, 'gone.png', 'image/png').expect(201)).body as AttachmentDto;
      await author.agent.delete(`${uploadUrl()}/${added.id}`).set(CSRF_HEADER, author.csrf).expect(204);
      expect((await author.agent.get(added.url)).status).to.equal(404);
      const event = await ctx
        .db('trail_events')
        .where({ event_type: 'attachment.deleted', entity_id: String(added.id) })
        .first();
      expect(asJson(event.before_json)).to.include({ fileName: 'gone.png', sha256: sha256(png) });
      expect((await author.agent.delete(`${uploadUrl()}/${added.id}`).set(CSRF_HEADER, author.csrf)).status).to.equal(404);
    });

    it('refuses to add or delete once the version is no longer a draft (409)', async () => {
      // A version of its own, submitted through the API: the database allows no way back to draft.
      const shared = draft;
      const stock = await createStockSet(ctx.db, {
        material: { name: 'Submitted steel' },
        wheel: { name: 'Submitted wheel' },
        machine: { name: 'Submitted saw' },
      });
      draft = (await author.agent.post('/api/recipes').set(CSRF_HEADER, author.csrf).send(recipeInput(stock)).expect(201)).body;
      try {
        const added = (await upload(png, 'kept.png', 'image/png').expect(201)).body as AttachmentDto;
        const current = (await author.agent.get(`/api/recipes/${draft.recipeId}/versions/1`).expect(200)).body as RecipeVersionDto;
        await author.agent
          .post(`/api/recipes/${draft.recipeId}/versions/1/submit`)
          .set(CSRF_HEADER, author.csrf)
          .send({ revision: current.revision })
          .expect(200);
        const before = await counts();
        const del = await author.agent.delete(`${uploadUrl()}/${added.id}`).set(CSRF_HEADER, author.csrf);
        expect(del.status).to.equal(409);
        const add = await upload(png, 'late.png', 'image/png');
        expect(add.status).to.equal(409);
        await expectNothingStored(before);
        expect((await author.agent.get(added.url)).status).to.equal(200);
      } finally {
        draft = shared;
      }
    });
  });

  describe("follow their version's visibility", () => {
    // Attachment ids are sequential: an operator could read every draft's photos by counting.
    // One version in each state, reached through the API, each with a photo added while a draft.
    const photos = new Map<RecipeStatus, AttachmentDto>();
    let readers: { role: string; who: { agent: Agent; csrf: string } }[];

    before(async () => {
      const stock = await createStockSet(ctx.db, { material: { name: 'Visible steel' }, wheel: { name: 'Visible wheel' }, machine: { name: 'Visible saw' } });
      const writer = await sessionFor(ctx.app, ctx.db, ['author']);
      const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
      const withPhoto = async (title: string) => {
        const made = await createDraft(writer, stock, { title });
        let req = writer.agent.post(`/api/recipes/${made.recipeId}/versions/1/attachments`).set(CSRF_HEADER, writer.csrf).field('role', 'setup');
        req = req.field('caption', 'Not released yet');
        const photo = (await req.attach('file', png, { filename: 'draft.png', contentType: 'image/png' }).expect(201)).body as AttachmentDto;
        return { photo, version: ok(await act.get(writer, made)) };
      };
      const approvedOne = async (title: string) => {
        const made = await withPhoto(title);
        return { ...made, version: ok(await act.approve(approver, ok(await act.submit(writer, made.version)))) };
      };
      photos.set('draft', (await withPhoto('Photo of a draft')).photo);
      const review = await withPhoto('Photo in review');
      ok(await act.submit(writer, review.version));
      photos.set('in-review', review.photo);
      const returned = await withPhoto('Photo returned');
      ok(await act.return(approver, ok(await act.submit(writer, returned.version))));
      photos.set('returned', returned.photo);
      photos.set('approved', (await approvedOne('Photo approved')).photo);
      const old = await approvedOne('Photo superseded');
      const next = ok(await act.newVersion(writer, old.version.recipeId, 1), 201);
      ok(await act.approve(approver, ok(await act.submit(writer, next))));
      photos.set('superseded', old.photo);
      const gone = await approvedOne('Photo withdrawn');
      ok(await act.withdraw(approver, gone.version));
      photos.set('withdrawn', gone.photo);
      readers = [];
      for (const role of ['author', 'approver', 'auditor', 'admin'] as const)
        readers.push({ role, who: await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: [role] })) });
    });

    for (const status of ['draft', 'in-review', 'returned'] as const) {
      it(`answers an operator 404 for the photo and thumbnail of a version that is ${status}, worded as for an unknown id`, async () => {
        const photo = photos.get(status)!;
        for (const url of [photo.url, photo.thumbnailUrl]) {
          const res = await operator.agent.get(url);
          expect(res.status, url).to.equal(404);
          expect(res.body, url).to.deep.equal({ code: 'NOT_FOUND', errors: [{ path: '', message: `There is no attachment with id ${photo.id}.` }] });
          expect(res.headers['etag'], url).not.to.equal(`"${photo.sha256}"`);
          // Not even a 304 tells the operator that the guessed id exists.
          expect((await operator.agent.get(url).set('If-None-Match', `"${photo.sha256}"`)).status, url).to.equal(404);
        }
        for (const { role, who } of readers) expect((await who.agent.get(photo.url)).status, role).to.equal(200);
      });
    }

    for (const status of ['approved', 'superseded', 'withdrawn'] as const) {
      it(`serves an operator the photo of a version that is ${status}`, async () => {
        const photo = photos.get(status)!;
        expect((await operator.agent.get(photo.url)).status).to.equal(200);
        expect((await operator.agent.get(photo.thumbnailUrl)).status).to.equal(200);
      });
    }

    it('answers anonymous callers 401', async () => {
      const res = await request(ctx.app).get(photos.get('draft')!.url);
      expect(res.status).to.equal(401);
    });
  });
});
