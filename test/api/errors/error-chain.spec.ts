import { expect } from 'chai';
import express from 'express';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { AppError } from '../../../server/app-error';
import { apiTestContext } from '../support/hooks';
import { CSRF_HEADER } from '../../../shared/api-types';
import { anonymousAgent, buildTestApp } from '../support/test-app';

describe('Error chain, headers and the web app', () => {
  const ctx = apiTestContext();

  it('answers unknown /api routes with a JSON 404', async () => {
    // State-changing requests are checked for CSRF first, so they carry a valid token.
    const { agent, csrf } = await anonymousAgent(ctx.app);
    for (const [method, url] of [
      ['get', '/api/nothing-here'],
      ['post', '/api/users/1/delete'],
      ['delete', '/api/users/1'],
      ['get', '/api'],
    ] as const) {
      const res = await agent[method](url).set(CSRF_HEADER, csrf);
      expect(res.status, url).to.equal(404);
      expect(res.type).to.equal('application/json');
      expect(res.body.code).to.equal('NOT_FOUND');
      expect(res.body.errors[0].message).to.be.a('string');
    }
  });

  describe('faults', () => {
    const logged: unknown[][] = [];
    let app: express.Express;

    before(async () => {
      // Extra routes mounted behind the real middleware, outside the real route table.
      const faults = express.Router();
      faults.get('/__test/throw', () => {
        throw new Error('secret internal detail at /srv/kerfbook/server.ts:42');
      });
      faults.get('/__test/sql', async () => {
        await ctx.db.raw('select * from table_that_does_not_exist where password_hash = ?', ['x']);
      });
      faults.get('/__test/app-error', () => {
        throw new AppError(409, 'CONFLICT', [{ path: 'name', message: 'Taken.' }]);
      });
      const built = await buildTestApp(ctx.db, { extraApiRouter: faults, log: (...args) => logged.push(args) });
      app = built.app;
    });

    it('answers a thrown error with 500 INTERNAL, no stack, and logs the real error', async () => {
      const res = await request(app).get('/api/__test/throw');
      expect(res.status).to.equal(500);
      expect(res.body).to.deep.equal({ code: 'INTERNAL', errors: [{ path: '', message: 'Something went wrong on the server.' }] });
      expect(res.text).not.to.match(/secret internal detail|\.ts:|at /);
      expect(String(logged.at(-1)?.[1])).to.include('secret internal detail');
    });

    it('answers an SQL error with 500 and no SQL text', async () => {
      const res = await request(app).get('/api/__test/sql');
      expect(res.status).to.equal(500);
      expect(res.body.code).to.equal('INTERNAL');
      expect(res.text).not.to.match(/select|table_that_does_not_exist|password_hash|ER_/i);
    });

    it('passes typed errors through as they are', async () => {
      const res = await request(app).get('/api/__test/app-error');
      expect(res.status).to.equal(409);
      expect(res.body).to.deep.equal({ code: 'CONFLICT', errors: [{ path: 'name', message: 'Taken.' }] });
    });
  });

  it('sends helmet headers and a CSP without external hosts or inline scripts', async () => {
    const res = await request(ctx.app).get('/api/health').expect(200);
    expect(res.body).to.deep.equal({ ok: true });
    const csp = res.headers['content-security-policy'] as string;
    const directives = Object.fromEntries(
      csp
        .split(';')
        .map((d) => d.trim().split(/\s+/))
        .map(([k, ...v]) => [k, v]),
    );
    expect(directives['default-src']).to.deep.equal(["'self'"]);
    expect(directives['script-src']).to.deep.equal(["'self'"]);
    expect(directives['object-src']).to.deep.equal(["'none'"]);
    expect(directives['frame-ancestors']).to.deep.equal(["'none'"]);
    expect(directives['connect-src']).to.deep.equal(["'self'"]);
    expect(directives).not.to.have.property('upgrade-insecure-requests');
    expect(csp).not.to.match(/https?:|\*/);
    expect(res.headers['x-content-type-options']).to.equal('nosniff');
    expect(res.headers['x-frame-options']).to.equal('DENY');
    expect(res.headers).not.to.have.property('x-powered-by');
    expect(res.headers).not.to.have.property('strict-transport-security');
  });

  it('answers a too-large body with 413', async () => {
    const res = await request(ctx.app)
      .post('/api/session')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ username: 'x', password: 'y'.repeat(2 * 1024 * 1024) }));
    expect(res.status).to.equal(413);
    expect(res.body.code).to.equal('PAYLOAD_TOO_LARGE');
  });

  describe('the web app', () => {
    it('says to run the build when the built app is missing', async () => {
      const res = await request(ctx.app).get('/people');
      expect(res.status).to.equal(503);
      expect(res.type).to.equal('text/plain');
      expect(res.text).to.include('npm run build');
    });

    it('serves files from the build folder and index.html for deep links', async () => {
      const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfbook-dist-'));
      fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Kerfbook test</title>');
      fs.writeFileSync(path.join(dist, 'main-ABC123.js'), 'console.log(1)');
      const built = await buildTestApp(ctx.db, { config: { distDir: dist } });
      try {
        const deep = await request(built.app).get('/recipes/42/versions/3').expect(200);
        expect(deep.text).to.include('Kerfbook test');
        expect(deep.headers['content-security-policy']).to.be.a('string');
        const js = await request(built.app).get('/main-ABC123.js').expect(200);
        expect(js.type).to.match(/javascript/);
        const api = await request(built.app).get('/api/missing');
        expect(api.status).to.equal(404);
        expect(api.type).to.equal('application/json');
      } finally {
        fs.rmSync(dist, { recursive: true, force: true });
      }
    });
  });
});
