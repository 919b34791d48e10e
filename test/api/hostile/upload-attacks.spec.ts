/**
 * Hostile uploads and downloads (OWASP File Upload Cheat Sheet; OWASP WSTG-ATHZ-01
 * "Testing Directory Traversal File Include"). Photos live in MariaDB (multer keeps the
 * upload in memory; server/services/recipes/attachments.ts), and the only folder served from disk
 * is the built web app (server/web/spa.ts). So: names with paths are cut to a plain name
 * or refused, nothing lands on disk, attachment URLs with traversal answer 400/404, the
 * web app never serves a file outside its folder, oversized bodies are 413 with nothing
 * stored, and types other than JPEG, PNG and WebP are refused.
 * test/api/recipes/attachments.spec.ts already covers text, PDF, HTML and SVG bytes, a
 * declared type or extension that disagrees, a truncated PNG and the 10 MB cap.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { expect } from 'chai';
import request from 'supertest';
import sharp from 'sharp';
import { CSRF_HEADER } from '../../../shared/api-types';
import { ROLES } from '../../../shared/roles';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { routes } from '../../../server/web/routes';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, recipeInput } from '../support/stock';
import { buildTestApp, signedInAgent, type Agent } from '../support/test-app';
import { changedTables, dbFingerprint } from '../support/db-fingerprint';
import { createTargets, isWrite, label, pathFor, type Targets } from '../support/route-walk';

/** A marker in every hostile file name, looked for on disk afterwards. */
const MARK = `kbtrav${process.pid}`;

/** Directories a traversal in a file name would write to. */
function filesWithMark(): string[] {
  const dirs = [process.cwd(), path.dirname(process.cwd()), os.tmpdir(), '/', '/etc', '/tmp'];
  return dirs.flatMap((dir) => {
    try {
      return fs
        .readdirSync(dir)
        .filter((f) => f.includes(MARK))
        .map((f) => path.join(dir, f));
    } catch {
      return [];
    }
  });
}

describe('Upload and download attacks', () => {
  const ctx = apiTestContext();
  let author: { agent: Agent; csrf: string };
  let all: { agent: Agent; csrf: string };
  let draft: RecipeVersionDto;
  let png: Buffer;
  let targets: Targets;

  before(async () => {
    author = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['author'] }));
    all = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: [...ROLES] }));
    const stock = await createStockSet(ctx.db);
    draft = (await author.agent.post('/api/recipes').set(CSRF_HEADER, author.csrf).send(recipeInput(stock)).expect(201)).body;
    png = await sharp({ create: { width: 16, height: 16, channels: 3, background: '#406080' } })
      .png()
      .toBuffer();
    targets = await createTargets(ctx.db);
  });

  const uploadUrl = () => `/api/recipes/${draft.recipeId}/versions/1/attachments`;
  const upload = (bytes: Buffer, filename: string, contentType = 'image/png') =>
    author.agent.post(uploadUrl()).set(CSRF_HEADER, author.csrf).field('role', 'setup').attach('file', bytes, { filename, contentType });

  describe('path traversal in file names', () => {
    const names = [
      `../../../../etc/${MARK}.png`,
      `..\\..\\..\\${MARK}.png`,
      `/etc/${MARK}.png`,
      `/tmp/${MARK}.png`,
      `C:\\Windows\\Temp\\${MARK}.png`,
      `%2e%2e%2f%2e%2e%2f${MARK}.png`,
      `..%2f..%2f${MARK}.png`,
      `....//....//${MARK}.png`,
      `${MARK}.png\u0000.html`,
      `${MARK}\u0000/../../x.png`,
      `./${MARK}.png`,
      `${MARK}\r\nContent-Type: text/html.png`,
      `${MARK}".png`,
      `~/${MARK}.png`,
      `\\\\server\\share\\${MARK}.png`,
    ];

    it('stores the photo under a plain name (no folder, no control characters) or refuses it, and writes no file anywhere', async () => {
      const stored: string[] = [];
      for (const name of names) {
        const res = await upload(png, name);
        expect(res.status, `${JSON.stringify(name)}: ${JSON.stringify(res.body)}`).to.be.oneOf([201, 400]);
        if (res.status === 400) {
          expect(res.body.code).to.equal('VALIDATION_FAILED');
          continue;
        }
        const fileName = (await ctx.db('attachments').where({ id: res.body.id }).first('file_name')).file_name as string;
        stored.push(fileName);
        expect(fileName, JSON.stringify(name)).not.to.match(/[\\/\u0000-\u001f"]/);
        expect(path.basename(fileName)).to.equal(fileName);
        expect(fileName.startsWith('..') && fileName.includes('/')).to.equal(false);
        // The download names it plainly too: one safe header, no way out of the quotes.
        const served = await author.agent.get(res.body.url).buffer(true);
        expect(served.status).to.equal(200);
        expect(served.headers['content-disposition']).to.match(/^inline; filename="[\x20-\x21\x23-\x7e]*"$/);
        expect(served.headers['content-type']).to.equal('image/png');
      }
      expect(stored.length, 'some hostile names were cleaned and stored').to.be.greaterThan(5);
      expect(filesWithMark(), 'files written outside the database').to.deep.equal([]);
    });
  });

  describe('path traversal in download paths', () => {
    const attempts = [
      '/api/attachments/..%2f..%2f..%2f..%2fetc%2fpasswd',
      '/api/attachments/%2e%2e%2f%2e%2e%2fetc%2fpasswd',
      '/api/attachments/%2e%2e',
      '/api/attachments/..',
      '/api/attachments/1%00',
      '/api/attachments/1%00.png',
      '/api/attachments/%00',
      '/api/attachments/..%5c..%5cwindows%5cwin.ini',
      '/api/attachments/%2fetc%2fpasswd',
      '/api/attachments/%252e%252e%252fetc%252fpasswd',
      '/api/attachments/%c0%ae%c0%ae%c0%afetc%c0%afpasswd',
      '/api/attachments/1/..%2f..%2f..%2fetc%2fpasswd',
      '/api/attachments/1/thumbnail%2f..%2f..%2fetc%2fpasswd',
      '/api/attachments/-1',
      '/api/attachments/1.5',
      '/api/attachments/99999999999999999999',
      `/api/recipes/1/versions/1/attachments/..%2f..%2f..%2fetc%2fpasswd`,
    ];

    it('answers 400 or 404 in the error shape, never a file', async () => {
      for (const url of attempts) {
        const method = url.startsWith('/api/recipes') ? 'delete' : 'get';
        const res = await author.agent[method](url).set(CSRF_HEADER, author.csrf).buffer(true);
        expect(res.status, url).to.be.oneOf([400, 404]);
        expect(res.headers['content-type'], url).to.match(/^application\/json/);
        expect(res.body.code, url).to.be.oneOf(['VALIDATION_FAILED', 'NOT_FOUND']);
        expect(res.text, url).not.to.match(/root:|\[fonts\]|\[extensions\]/);
      }
    });

    it('serves nothing outside the web app folder, whatever the encoding', async () => {
      const base = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfbook-spa-'));
      const dist = path.join(base, 'dist');
      fs.mkdirSync(dist);
      fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>the app</title>');
      fs.writeFileSync(path.join(dist, 'main-ABCDEFGH.js'), 'console.log(1)');
      fs.writeFileSync(path.join(base, 'secret.txt'), 'TOP-SECRET-SIBLING');
      const built = await buildTestApp(ctx.db, { config: { distDir: dist } });
      try {
        const urls = [
          '/../secret.txt',
          '/..%2fsecret.txt',
          '/%2e%2e/secret.txt',
          '/%2e%2e%2fsecret.txt',
          '/%252e%252e%252fsecret.txt',
          '/..%5csecret.txt',
          '/..\\secret.txt',
          '/.%2e/secret.txt',
          '/%c0%ae%c0%ae/secret.txt',
          '/main-ABCDEFGH.js%00.txt',
          '/main-ABCDEFGH.js/..%2f..%2fsecret.txt',
          '//etc/passwd',
          '/%2e%2e/%2e%2e/%2e%2e/%2e%2e/%2e%2e/etc/passwd',
          '/..%2f..%2f..%2f..%2f..%2fetc%2fpasswd',
          `/${'..%2f'.repeat(20)}etc%2fpasswd`,
        ];
        for (const url of urls) {
          const res = await request(built.app).get(url).buffer(true);
          expect(res.status, url).to.be.below(500);
          expect(res.text, url).not.to.include('TOP-SECRET-SIBLING');
          expect(res.text, url).not.to.match(/root:/);
        }
        // The control: the app's own files are served.
        expect((await request(built.app).get('/main-ABCDEFGH.js')).status).to.equal(200);
      } finally {
        fs.rmSync(base, { recursive: true, force: true });
      }
    });
  });

  describe('oversized bodies', () => {
    it('answers 413 PAYLOAD_TOO_LARGE to a JSON body over 1 MB on every write route, storing nothing', async function () {
      this.timeout(60_000);
      const big = JSON.stringify({ notes: 'z'.repeat(1_100_000) });
      const before = await dbFingerprint(ctx.db);
      for (const route of routes.filter(isWrite)) {
        const res = await all.agent[route.method](pathFor(route, targets)).set(CSRF_HEADER, all.csrf).set('Content-Type', 'application/json').send(big);
        expect(res.status, label(route)).to.equal(413);
        expect(res.body.code, label(route)).to.equal('PAYLOAD_TOO_LARGE');
      }
      expect(changedTables(before, await dbFingerprint(ctx.db))).to.deep.equal([]);
    });

    it('refuses a second file, a huge caption and too many parts (400), storing nothing', async () => {
      const before = await dbFingerprint(ctx.db);
      const two = await author.agent.post(uploadUrl()).set(CSRF_HEADER, author.csrf).attach('file', png, 'a.png').attach('file', png, 'b.png');
      expect(two.status).to.equal(400);
      const caption = await author.agent.post(uploadUrl()).set(CSRF_HEADER, author.csrf).field('caption', 'c'.repeat(20_000)).attach('file', png, 'a.png');
      expect(caption.status).to.equal(400);
      let many = author.agent.post(uploadUrl()).set(CSRF_HEADER, author.csrf);
      for (let i = 0; i < 30; i++) many = many.field(`f${i}`, 'x');
      expect((await many.attach('file', png, 'a.png')).status).to.equal(400);
      const noBoundary = await author.agent.post(uploadUrl()).set(CSRF_HEADER, author.csrf).set('Content-Type', 'multipart/form-data').send('--x\r\n\r\n');
      expect(noBoundary.status).to.equal(400);
      const polluted = await author.agent
        .post(uploadUrl())
        .set(CSRF_HEADER, author.csrf)
        .field('__proto__', 'x')
        .field('constructor', 'y')
        .attach('file', png, 'a.png');
      expect(polluted.status).to.equal(400);
      expect(({} as Record<string, unknown>)['x']).to.equal(undefined);
      expect(changedTables(before, await dbFingerprint(ctx.db))).to.deep.equal([]);
    });

    it('refuses a small file that decodes to a huge bitmap (decompression bomb), storing nothing', async function () {
      this.timeout(30_000);
      const bomb = await sharp({ create: { width: 8_000, height: 6_000, channels: 3, background: '#000000' } })
        .png({ compressionLevel: 9 })
        .toBuffer();
      expect(bomb.length).to.be.below(1024 * 1024);
      const before = await dbFingerprint(ctx.db);
      const res = await upload(bomb, 'bomb.png');
      expect(res.status).to.equal(400);
      expect(res.body.errors[0].message).to.match(/megapixels/);
      expect(changedTables(before, await dbFingerprint(ctx.db))).to.deep.equal([]);
    });
  });

  describe('wrong file types', () => {
    it('refuses real images of other kinds and executables dressed as photos (415), storing nothing', async () => {
      const gif = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#ff0000' } })
        .gif()
        .toBuffer();
      const tiff = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#ff0000' } })
        .tiff()
        .toBuffer();
      const bmp = Buffer.concat([Buffer.from('BM'), Buffer.alloc(52)]);
      const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(120)]);
      const zip = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0, 0, 0]), Buffer.alloc(60)]);
      const before = await dbFingerprint(ctx.db);
      for (const [bytes, name, type] of [
        [gif, 'x.gif', 'image/gif'],
        [gif, 'x.png', 'image/png'],
        [tiff, 'x.tiff', 'image/tiff'],
        [bmp, 'x.png', 'image/png'],
        [elf, 'x.png', 'image/png'],
        [zip, 'x.jpg', 'image/jpeg'],
      ] as const) {
        const res = await upload(bytes, name, type);
        expect(res.status, name).to.be.oneOf([400, 415]);
        expect(res.body.errors[0].path, name).to.equal('file');
      }
      expect(changedTables(before, await dbFingerprint(ctx.db))).to.deep.equal([]);
    });

    it('a PNG with a page glued on is stored as a PNG, and served so that no browser runs it', async () => {
      const polyglot = Buffer.concat([png, Buffer.from('<html><script>alert(1)</script></html>')]);
      const res = await upload(polyglot, 'glued.png');
      expect(res.status, JSON.stringify(res.body)).to.be.oneOf([201, 400]);
      if (res.status !== 201) return;
      const served = await author.agent.get(res.body.url).buffer(true);
      expect(served.headers['content-type']).to.equal('image/png');
      expect(served.headers['x-content-type-options']).to.equal('nosniff');
      expect(served.headers['content-security-policy']).to.match(/sandbox/);
    });
  });
});
