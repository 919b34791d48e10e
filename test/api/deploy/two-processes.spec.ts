/**
 * Several app processes on one MariaDB (README.md, "Performance"): two real `server/main.ts` processes
 * behind a round-robin proxy on loopback. Sessions, uploads and the jobs' state live in
 * the database, so a person signed in through one process works through the other, a photo
 * uploaded through one is served by both, and the scheduled jobs and the mail worker —
 * running in both processes at once — do their work once, not twice.
 */
import { createHash } from 'node:crypto';
import { expect } from 'chai';
import type { Knex } from 'knex';
import request from 'supertest';
import sharp from 'sharp';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { AttachmentDto, RecipeVersionDto } from '../../../shared/recipe-types';
import { verifyChain } from '../../../server/services/trail/verify';
import { SESSION_COOKIE } from '../../../server/web/session-cookie';
import { startMailCatcher, type MailCatcher } from '../../../server/tools/mail-catcher';
import { assignMachine } from '../mail/notifications-support';
import { createPerson, type TestPerson } from '../support/people';
import { createStockSet } from '../support/stock';
import { buildTestApp, setCookie, signedInAgent, type Agent } from '../support/test-app';
import { resetTables, testAppDatabaseUrl, testDb } from '../support/test-database';
import { act, approved, createDraft, ok, sessionFor } from '../workflow/workflow-support';
import { freePort, startAppProcess, type AppProcess } from './app-processes';
import { BACKEND_HEADER, startRoundRobinProxy, type RoundRobinProxy } from './round-robin-proxy';

const DAY_MS = 86400000;
const day = (offset: number) => new Date(Date.now() + offset * DAY_MS).toISOString().slice(0, 10);
/** How often each process runs supersession, reminders and the mail worker here. */
const JOB_INTERVAL_MS = 200;
/** The same in both processes: either one must accept the other's session cookie and CSRF token. */
const SESSION_SECRET = 'two-processes-secret-two-processes-secret';

/** Binary supertest responses: collect the bytes. */
function binary(res: unknown, cb: (err: Error | null, body: Buffer) => void): void {
  const stream = res as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(Buffer.from(c)));
  stream.on('end', () => cb(null, Buffer.concat(chunks)));
}

/** Polls `check` until it answers true, at most `timeoutMs`; the last `describe()` says what was still missing. */
async function waitFor(check: () => Promise<boolean>, describe: () => Promise<string>, timeoutMs = 20000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`Not reached within ${timeoutMs} ms: ${await describe()}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('Several app processes behind a reverse proxy on one MariaDB', () => {
  let db: Knex;
  const processes: AppProcess[] = [];
  let proxy: RoundRobinProxy | undefined;
  let catcher: MailCatcher | undefined;

  let traveller: TestPerson;
  /** Recipe whose version 2 was approved for a later day that has now come. */
  let pending: RecipeVersionDto;
  /** Recipe whose current version is due for review within the month. */
  let dueForReview: RecipeVersionDto;
  /** A draft of the traveller, for the photo. */
  let draft: RecipeVersionDto;
  let mailsBefore: Record<string, number>;

  const backendNames = () => processes.map((p) => p.name).sort();

  before(async function () {
    this.timeout(60000);
    db = await testDb();
    await resetTables(db);

    // Data made through the app's own routes and services, in this process, before the
    // two processes start (its own jobs are off: buildTestApp sets every interval to 0).
    const prep = await buildTestApp(db);
    const author = await sessionFor(prep.app, db, ['author'], 'Ines Author');
    const approver = await sessionFor(prep.app, db, ['approver'], 'Tomas Approver');
    const operator = await createPerson(db, { roles: ['operator'], displayName: 'Otto Operator' });
    traveller = await createPerson(db, { roles: ['author'], displayName: 'Tara Traveller' });
    const stock = await createStockSet(db);
    await assignMachine(db, operator.id, stock.machine.id);

    const v1 = await approved(author, approver, stock, { title: 'Effective day has come' });
    const v2 = ok(await act.newVersion(author, v1.recipeId, 1, 'Feed lowered.'), 201);
    const submitted = ok(await act.submit(author, ok(await act.save(author, v2, { cutting: { ...v2.content.cutting, feedMmS: 0.3 } }))));
    pending = ok(await act.approve(approver, submitted, { effectiveDate: day(10) }));
    // The day has come: move the effective date back (as the supersession test does).
    await db('recipe_versions')
      .where({ recipe_id: pending.recipeId, version: 2 })
      .update({ effective_from: day(0) });

    dueForReview = await approved(author, approver, stock, { title: 'Review due soon' });
    await db('recipe_versions')
      .where({ recipe_id: dueForReview.recipeId, version: 1 })
      .update({ review_due_on: day(10) });

    draft = await createDraft({ person: traveller, ...(await signedInAgent(prep.app, traveller)) }, stock, { title: 'Photo from either process' });
    mailsBefore = Object.fromEntries(
      ((await db('mail_outbox').select('kind').count({ n: '*' }).groupBy('kind')) as { kind: string; n: number }[]).map((r) => [r.kind, Number(r.n)]),
    );

    catcher = await startMailCatcher(0, { dir: null });
    const ports = [await freePort(), await freePort()];
    proxy = await startRoundRobinProxy(ports.map((port, i) => ({ name: `app-${i + 1}`, url: `http://127.0.0.1:${port}` })));
    const env = (port: number): NodeJS.ProcessEnv => ({
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: testAppDatabaseUrl(),
      HOST: '127.0.0.1',
      PORT: String(port),
      SESSION_SECRET,
      TRUST_PROXY: '1',
      SMTP_URL: `smtp://127.0.0.1:${catcher!.port}`,
      APP_BASE_URL: proxy!.url,
      KERFBOOK_DIST: '/nonexistent/kerfbook-dist',
      MAIL_INTERVAL_MS: String(JOB_INTERVAL_MS),
      SUPERSESSION_INTERVAL_MS: String(JOB_INTERVAL_MS),
      REVIEW_REMINDER_INTERVAL_MS: String(JOB_INTERVAL_MS),
    });
    const started = await Promise.allSettled(ports.map((port, i) => startAppProcess(`app-${i + 1}`, env(port))));
    for (const s of started) if (s.status === 'fulfilled') processes.push(s.value);
    const failed = started.find((s) => s.status === 'rejected');
    if (failed) throw (failed as PromiseRejectedResult).reason;
  });

  afterEach(function () {
    if (this.currentTest?.state === 'failed') for (const p of processes) console.log(`--- output of ${p.name} ---\n${p.output()}`);
  });

  after(async function () {
    this.timeout(30000);
    await Promise.allSettled(processes.map((p) => p.stop()));
    await proxy?.close();
    await catcher?.stop();
  });

  describe('a signed-in person', () => {
    let agent: Agent;
    let csrf: string;
    /** `kerfbook.sid=…`, for asking a process directly. */
    let sessionCookie: string;

    it('signs in through one process and goes on through the other: reads, a write with CSRF, the read-back', async () => {
      const seen: string[] = [];
      const via = <T extends { headers: Record<string, string> }>(res: T): T => {
        seen.push(res.headers[BACKEND_HEADER]!);
        return res;
      };
      agent = request.agent(proxy!.url);
      csrf = via(await agent.get('/api/session/csrf').expect(200)).body.csrfToken;
      const signIn = via(await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ username: traveller.username, password: traveller.password }));
      expect(signIn.status, JSON.stringify(signIn.body)).to.equal(200);
      csrf = signIn.body.csrfToken;
      sessionCookie = setCookie(signIn, SESSION_COOKIE)!.split(';')[0]!;

      const reads = [];
      for (let i = 0; i < 2; i++) reads.push(via(await agent.get('/api/session').expect(200)));
      for (const r of reads) expect(r.body.user).to.include({ username: traveller.username, units: 'metric' });
      expect(reads.map((r) => r.headers[BACKEND_HEADER]).sort()).to.deep.equal(backendNames());

      const write = via(await agent.patch('/api/session/preferences').set(CSRF_HEADER, csrf).send({ units: 'metric+imperial' }));
      expect(write.status, JSON.stringify(write.body)).to.equal(200);
      expect(write.headers[BACKEND_HEADER], 'the CSRF token from sign-in is taken by the other process').not.to.equal(signIn.headers[BACKEND_HEADER]);
      csrf = write.body.csrfToken;
      const back = via(await agent.get('/api/session').expect(200));
      expect(back.body.user.units).to.equal('metric+imperial');
      expect(back.headers[BACKEND_HEADER], 'read back through the other process').not.to.equal(write.headers[BACKEND_HEADER]);

      expect([...new Set(seen)].sort()).to.deep.equal(backendNames());
    });

    it('uploads a photo through one process, and both serve it', async () => {
      const png = await sharp({ create: { width: 400, height: 300, channels: 3, background: { r: 90, g: 120, b: 150 } } })
        .png()
        .toBuffer();
      const res = await agent
        .post(`/api/recipes/${draft.recipeId}/versions/1/attachments`)
        .set(CSRF_HEADER, csrf)
        .field('role', 'setup')
        .field('caption', 'Vise set-up')
        .attach('file', png, { filename: 'setup.png', contentType: 'image/png' });
      expect(res.status, JSON.stringify(res.body)).to.equal(201);
      const stored = res.body as AttachmentDto;
      const sha = createHash('sha256').update(png).digest('hex');
      expect(stored.sha256).to.equal(sha);

      for (const p of processes) {
        const image = await request(p.url).get(stored.url).set('Cookie', sessionCookie).buffer(true).parse(binary);
        expect(image.status, `${p.name} serves the photo`).to.equal(200);
        expect(image.headers['content-type']).to.equal('image/png');
        expect(Buffer.compare(image.body as Buffer, png), `${p.name} serves the same bytes`).to.equal(0);
        const thumb = await request(p.url).get(stored.thumbnailUrl).set('Cookie', sessionCookie).buffer(true).parse(binary);
        expect(thumb.status, `${p.name} serves the thumbnail`).to.equal(200);
        expect(thumb.headers['content-type']).to.equal('image/webp');
      }
    });
  });

  describe('scheduled jobs and the mail worker (running in both processes)', () => {
    const mailState = async () => {
      const rows = await db('mail_outbox').select('id', 'kind', 'sent_at', 'message_id', 'attempts');
      return { rows, unsent: rows.filter((r) => r.sent_at === null).length, caught: catcher!.messages().length };
    };
    const currentVersionOf = async (recipeId: number) => {
      const row = await db('recipes as r').leftJoin('recipe_versions as v', 'v.id', 'r.current_version_id').where('r.id', recipeId).first('v.version');
      return row?.version ?? null;
    };
    const countWhere = async (table: string, where: Record<string, unknown>) => Number((await db(table).where(where).count({ n: '*' }).first())!['n']);

    it('makes a due version current once, queues a due reminder once and delivers every mail once', async function () {
      this.timeout(40000);
      await waitFor(
        async () => {
          const mail = await mailState();
          return (
            (await currentVersionOf(pending.recipeId)) === 2 &&
            (await countWhere('review_reminders', {})) > 0 &&
            mail.unsent === 0 &&
            mail.caught >= mail.rows.length
          );
        },
        async () => {
          const mail = await mailState();
          return `current version ${await currentVersionOf(pending.recipeId)}, reminders ${await countWhere('review_reminders', {})}, outbox ${mail.rows.length} (${mail.unsent} unsent), caught ${mail.caught}`;
        },
      );
      // Both processes keep running their jobs every JOB_INTERVAL_MS: give each several more
      // runs, which must find nothing left to do (nothing to poll for when nothing happens).
      await new Promise((r) => setTimeout(r, 6 * JOB_INTERVAL_MS));

      // Supersession: one trail event each, the chain intact.
      expect(await currentVersionOf(pending.recipeId)).to.equal(2);
      expect((await db('recipe_versions').where({ recipe_id: pending.recipeId, version: 1 }).first('status')).status).to.equal('superseded');
      expect(await countWhere('trail_events', { event_type: 'recipe.version_effective', recipe_id: pending.recipeId })).to.equal(1);
      expect(await countWhere('trail_events', { event_type: 'recipe.version_superseded', recipe_id: pending.recipeId })).to.equal(1);
      const chain = await verifyChain(db);
      expect(chain.ok, JSON.stringify(chain)).to.equal(true);

      // Review reminder: one row, one mail to the version's one author.
      const dueVersionId = (await db('recipe_versions').where({ recipe_id: dueForReview.recipeId, version: 1 }).first('id')).id;
      expect(await db('review_reminders').pluck('version_id')).to.deep.equal([dueVersionId]);
      expect(await countWhere('mail_outbox', { kind: 'review-due' })).to.equal(1);
      // The operator of the machine is told of the new current version once.
      expect(await countWhere('mail_outbox', { kind: 'version-current' })).to.equal((mailsBefore['version-current'] ?? 0) + 1);

      // Mail: every row sent, each exactly once.
      const { rows, caught } = await mailState();
      expect(rows.length).to.be.greaterThan(Object.values(mailsBefore).reduce((a, b) => a + b, 0));
      expect(rows.every((r) => r.sent_at !== null && r.message_id)).to.equal(true);
      expect(caught).to.equal(rows.length);
      const sentIds = rows.map((r) => r.message_id as string).sort();
      const caughtIds = catcher!
        .messages()
        .map((m) => m.messageId ?? '')
        .sort();
      expect(caughtIds).to.deep.equal(sentIds);
      expect(new Set(caughtIds).size).to.equal(caughtIds.length);
    });
  });
});
