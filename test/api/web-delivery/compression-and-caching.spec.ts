import { expect } from 'chai';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { isContentHashed } from '../../../server/web/spa';
import { apiTestContext } from '../support/hooks';
import { buildTestApp } from '../support/test-app';

describe('Delivery of the web app: compression and caching', () => {
  const ctx = apiTestContext();
  let dist: string;

  before(() => {
    dist = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfbook-dist-'));
    fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Kerfbook test</title>');
    // Large and repetitive, as built scripts are, so that gzip pays off.
    fs.writeFileSync(path.join(dist, 'chunk-SV5VRIF7.js'), 'export const a = "kerf";\n'.repeat(2000));
    fs.writeFileSync(path.join(dist, 'favicon.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
  });
  after(() => fs.rmSync(dist, { recursive: true, force: true }));

  it('sends scripts gzipped and caches content-hashed files for a year', async () => {
    const built = await buildTestApp(ctx.db, { config: { distDir: dist } });
    const res = await request(built.app).get('/chunk-SV5VRIF7.js').set('Accept-Encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).to.equal('gzip');
    expect(res.headers['cache-control']).to.equal('public, max-age=31536000, immutable');
    expect(res.text).to.equal('export const a = "kerf";\n'.repeat(2000));
    // Kept gzipped in memory: the next request gets the same bytes.
    const again = await request(built.app).get('/chunk-SV5VRIF7.js').set('Accept-Encoding', 'gzip, deflate').expect(200);
    expect(again.headers['content-length']).to.equal(res.headers['content-length']);
    expect(Number(again.headers['content-length'])).to.be.below(2000);
    expect(again.headers['content-type']).to.equal('text/javascript; charset=utf-8');

    const data = await request(built.app).get('/api/health').set('Accept-Encoding', 'gzip').expect(200);
    expect(data.type).to.equal('application/json');

    const icon = await request(built.app).get('/favicon.svg').expect(200);
    expect(icon.headers['cache-control']).to.equal('public, max-age=3600');

    const index = await request(built.app).get('/library').set('Accept-Encoding', 'gzip').expect(200);
    expect(index.headers['cache-control']).to.equal('no-cache');
  });

  it('sends nothing compressed to a client that does not ask for it', async () => {
    const built = await buildTestApp(ctx.db, { config: { distDir: dist } });
    const res = await request(built.app).get('/chunk-SV5VRIF7.js').set('Accept-Encoding', 'identity').expect(200);
    expect(res.headers['content-encoding']).to.equal(undefined);
    expect(res.text).to.have.length(50000);
    expect(res.headers['cache-control']).to.equal('public, max-age=31536000, immutable');
  });

  it('tells hashed build files from others by their name', () => {
    expect(isContentHashed('/x/chunk-SV5VRIF7.js')).to.equal(true);
    expect(isContentHashed('/x/media/roboto-latin-400-normal-54N5OGOO.woff2')).to.equal(true);
    expect(isContentHashed('/x/styles-X4TIJKXE.css')).to.equal(true);
    expect(isContentHashed('/x/favicon.svg')).to.equal(false);
    expect(isContentHashed('/x/index.html')).to.equal(false);
  });

  it('serves the app from a build inside a dot folder (KERFBOOK_DIST=.data/…)', async () => {
    const hidden = path.join(dist, '.hidden-build');
    fs.mkdirSync(hidden, { recursive: true });
    fs.writeFileSync(path.join(hidden, 'index.html'), '<!doctype html><title>Kerfbook hidden</title>');
    fs.writeFileSync(path.join(hidden, 'chunk-ABCD2345.js'), 'export const b = 1;\n');
    const built = await buildTestApp(ctx.db, { config: { distDir: hidden } });
    const page = await request(built.app).get('/library').expect(200);
    expect(page.text).to.contain('Kerfbook hidden');
    expect((await request(built.app).get('/chunk-ABCD2345.js').expect(200)).text).to.equal('export const b = 1;\n');
  });
});
