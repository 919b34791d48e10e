/**
 * Seals of the trail's chain head, kept outside the database (a seal file with its own hash
 * chain, a mail to each auditor): rows cut from the end of the trail with the chain head
 * moved back, or a sealed event rewritten with every later hash recomputed, leave a chain
 * that verifies on its own — the seals are what still finds them.
 */
import { expect } from 'chai';
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { CSRF_HEADER } from '../../../shared/api-types';
import { createDb } from '../../../server/data/db';
import { DEFAULT_MAIL_SETTINGS } from '../../../server/services/mail/settings';
import { appendTrailEvent } from '../../../server/services/trail/append';
import { TRAIL_EVENTS } from '../../../server/services/trail/event-types';
import { trailHash } from '../../../server/services/trail/hash';
import { appendSeal, parseSealFile, readSealFile, sealFilePath, type SealLine } from '../../../server/services/trail/seal-file';
import { sealTrail, type SealSettings } from '../../../server/services/trail/seals';
import { chainedFields } from '../../../server/services/trail/stored-row';
import { verifyChain } from '../../../server/services/trail/verify';
import { apiTestContext } from '../support/hooks';
import { createStockSet } from '../support/stock';
import { testDatabaseUrl } from '../support/test-database';
import { act, inReview, ok, sessionFor, type Session } from '../workflow/workflow-support';
import { chainRows, insertable, lastEventId, withoutTrigger, type ChainRow } from './support';

const SEAL_DIR = mkdtempSync(path.join(os.tmpdir(), 'kerfbook-seals-spec-'));
const SEAL_FILE = sealFilePath(SEAL_DIR);
const seals: SealSettings = { dir: SEAL_DIR, mail: DEFAULT_MAIL_SETTINGS };
const ACTOR = { userId: null, name: 'Seal test', clientAddress: '' };

/** `npm run trail:verify` in its own process, as an operator would run it. */
function runCli(args: string[] = ['--seals', SEAL_FILE], env: Record<string, string> = {}): Promise<{ code: number; output: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn('npx', ['tsx', 'server/cli/trail-verify.ts', ...args], {
      cwd: process.cwd(),
      env: { ...process.env, DATABASE_URL: testDatabaseUrl(), FORCE_COLOR: '0', ...env },
    });
    let output = '';
    child.stdout.on('data', (c: Buffer) => (output += c.toString()));
    child.stderr.on('data', (c: Buffer) => (output += c.toString()));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code: code ?? -1, output }));
  });
}

const fileSeals = async (file = SEAL_FILE): Promise<SealLine[]> => {
  const read = await readSealFile(file);
  expect(read?.problem ?? null, 'the seal file chain').to.equal(null);
  return read!.seals;
};

const someEvents = async (db: Parameters<typeof appendTrailEvent>[0], n: number) => {
  for (let i = 0; i < n; i++)
    await appendTrailEvent(db, ACTOR, { type: TRAIL_EVENTS.labSettingsChanged, entityType: 'lab_settings', entityId: 1, after: { n: i } });
};

/** Moves the chain head the way someone with the database's admin rights could. */
const setHead = (db: Parameters<typeof appendTrailEvent>[0], row: Pick<ChainRow, 'id' | 'hash'>) =>
  db('trail_chain_head').where({ id: 1 }).update({ last_event_id: row.id, last_hash: row.hash });

describe('Trail seals', function () {
  this.timeout(90000);
  const ctx = apiTestContext({ sealDir: SEAL_DIR });
  let author: Session;
  let approver: Session;
  let auditors: Session[];

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Seal Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Seal Approver');
    auditors = [
      await sessionFor(ctx.app, ctx.db, ['auditor'], 'Seal Auditor One'),
      await sessionFor(ctx.app, ctx.db, ['auditor', 'admin'], 'Seal Auditor Two'),
    ];
    await sessionFor(ctx.app, ctx.db, ['admin'], 'Admin Not Auditor');
  });

  it('seals the chain head after an approval: a line in the seal file, one claim, and a mail to each auditor', async () => {
    const stock = await createStockSet(ctx.db);
    const version = await inReview(author, stock);
    const mailsBefore = await ctx.db('mail_outbox').where({ kind: 'trail-sealed' }).count({ n: '*' }).first();
    ok(await act.approve(approver, version));

    const head = await lastEventId(ctx.db);
    const headRow = (await ctx.db('trail_events').where({ id: head }).first()) as ChainRow;
    expect(headRow.event_type).to.equal(TRAIL_EVENTS.versionApproved);
    const written = await fileSeals();
    expect(written).to.have.length(1);
    expect(written[0]).to.include({ seq: 1, headEventId: head, headHash: headRow.hash, eventCount: head, reason: 'approval' });
    expect(await ctx.db('trail_seals').where({ head_event_id: head }).count({ n: '*' }).first()).to.deep.equal({ n: 1 });

    expect(Number(mailsBefore!.n)).to.equal(0);
    const mails = (await ctx.db('mail_outbox').where({ kind: 'trail-sealed' }).orderBy('to_address')) as {
      to_address: string;
      text_body: string;
      subject: string;
    }[];
    expect(mails.map((m) => m.to_address)).to.deep.equal(auditors.map((a) => `${a.person.username}@lab.example`).sort());
    for (const m of mails) {
      expect(m.subject).to.equal(`Trail sealed at event #${head} (${head} events)`);
      expect(m.text_body).to.include(headRow.hash);
      expect(m.text_body).to.include('It cannot be turned off');
    }
  });

  it('a busy hour of approvals seals each one in the file but mails the auditors at most once an hour; the regular seal always mails', async () => {
    // Without this the soak's 86 approvals in two minutes queued 957 seal mails.
    const stock = await createStockSet(ctx.db);
    const mailed = async () => Number((await ctx.db('mail_outbox').where({ kind: 'trail-sealed' }).count({ n: '*' }).first())!.n);
    const linesBefore = (await fileSeals()).length;
    const mailsBefore = await mailed();
    ok(await act.approve(approver, await inReview(author, stock)));
    ok(await act.approve(approver, await inReview(author, stock)));
    expect((await fileSeals()).length - linesBefore, 'a seal line per approval').to.equal(2);
    expect(await mailed(), 'no seal mail again within the hour').to.equal(mailsBefore);
    // The regular seal mails whatever the hour.
    await someEvents(ctx.db, 1);
    expect(await sealTrail(ctx.db, seals, 'interval')).to.not.equal(null);
    expect(await mailed()).to.equal(mailsBefore + auditors.length);
    // An hour after the last seal mail, an approval's seal mails again.
    await ctx
      .db('mail_outbox')
      .where({ kind: 'trail-sealed' })
      .update({ created_at: new Date(Date.now() - 3600_000 - 1000) });
    ok(await act.approve(approver, await inReview(author, stock)));
    expect(await mailed()).to.equal(mailsBefore + 2 * auditors.length);
  });

  it('writes one seal for one head when two processes seal at the same moment, whatever their seal directories', async () => {
    await someEvents(ctx.db, 3);
    const head = await lastEventId(ctx.db);
    const otherDir = mkdtempSync(path.join(os.tmpdir(), 'kerfbook-seals-other-'));
    const otherDb = createDb(testDatabaseUrl());
    const before = (await fileSeals()).length;
    try {
      const results = await Promise.all([
        sealTrail(ctx.db, seals, 'interval'),
        sealTrail(otherDb, { ...seals, dir: otherDir }, 'interval'),
        sealTrail(otherDb, seals, 'interval'),
        sealTrail(ctx.db, { ...seals, dir: otherDir }, 'interval'),
      ]);
      expect(results.filter((r) => r !== null)).to.have.length(1);
      const inOther = (await readSealFile(sealFilePath(otherDir)))?.seals ?? [];
      const inMain = (await fileSeals()).slice(before);
      expect([...inMain, ...inOther].map((s) => s.headEventId)).to.deep.equal([head]);
      expect(await ctx.db('trail_seals').where({ head_event_id: head }).count({ n: '*' }).first()).to.deep.equal({ n: 1 });
      const mails = await ctx.db('mail_outbox').where({ kind: 'trail-sealed' }).where('subject', 'like', `Trail sealed at event #${head} %`);
      expect(mails).to.have.length(auditors.length);
      // Sealing the same head again writes nothing.
      expect(await sealTrail(ctx.db, seals, 'interval')).to.equal(null);
    } finally {
      await otherDb.destroy();
    }
  });

  it("seals at the lab's seal interval: not before it has passed since the newest seal, then once", async () => {
    await ctx.db('lab_settings').where({ id: 1 }).update({ seal_interval_hours: 6 });
    try {
      await someEvents(ctx.db, 1);
      const newest = (await ctx.db('trail_seals').orderBy('id', 'desc').first()) as { sealed_at: Date };
      const at = (hours: number) => new Date(new Date(newest.sealed_at).getTime() + hours * 3600_000);
      expect(await sealTrail(ctx.db, seals, 'interval', at(5.9), true)).to.equal(null);
      const sealed = await sealTrail(ctx.db, seals, 'interval', at(6), true);
      expect(sealed).to.include({ headEventId: await lastEventId(ctx.db), reason: 'interval' });
      expect(await sealTrail(ctx.db, seals, 'interval', at(7), true)).to.equal(null);
    } finally {
      await ctx.db('lab_settings').where({ id: 1 }).update({ seal_interval_hours: 24 });
    }
  });

  it('lets admins set the seal interval on the lab settings (trailed), and refuses a bad one', async () => {
    const admin = auditors[1]!;
    const current = (await admin.agent.get('/api/settings/lab').expect(200)).body as Record<string, unknown>;
    expect(current['sealIntervalHours']).to.equal(24);
    const { updatedAt: _u, ...body } = current;
    const bad = await admin.agent
      .put('/api/settings/lab')
      .set(CSRF_HEADER, admin.csrf)
      .send({ ...body, sealIntervalHours: 0 });
    expect(bad.status).to.equal(400);
    expect(JSON.stringify(bad.body)).to.include('Seal interval must be at least 1 hour.');
    const good = await admin.agent
      .put('/api/settings/lab')
      .set(CSRF_HEADER, admin.csrf)
      .send({ ...body, sealIntervalHours: 12 });
    expect(good.status, JSON.stringify(good.body)).to.equal(200);
    expect(good.body.sealIntervalHours).to.equal(12);
    const event = (await ctx.db('trail_events').where({ event_type: 'lab_settings.changed' }).orderBy('id', 'desc').first()) as { after_json: unknown };
    expect(JSON.stringify(event.after_json)).to.include('"sealIntervalHours":12');
    await ctx.db('lab_settings').where({ id: 1 }).update({ seal_interval_hours: 24 });
  });

  it('passes trail:verify against the seals while the trail holds them, naming the seal it checked', async () => {
    const last = (await fileSeals()).at(-1)!;
    const cli = await runCli();
    expect(cli.code, cli.output).to.equal(0);
    expect(cli.output).to.include(`Seals verified: checked against seal ${last.seq} of ${SEAL_FILE} (event #${last.headEventId}`);
  });

  it('reports truncation when the last rows are deleted and the chain head rewritten to match, which the chain alone misses', async () => {
    await someEvents(ctx.db, 2);
    const sealed = (await sealTrail(ctx.db, seals, 'interval'))!;
    await someEvents(ctx.db, 2);
    const rows = await chainRows(ctx.db);
    const cut = rows.filter((r) => r.id > sealed.headEventId - 3);
    const keep = rows.filter((r) => r.id <= sealed.headEventId - 3).at(-1)!;
    const head = rows.at(-1)!;
    await withoutTrigger(ctx.db, 'trail_events_refuse_delete', () => ctx.db('trail_events').where('id', '>', keep.id).del());
    await setHead(ctx.db, keep);
    try {
      expect((await verifyChain(ctx.db)).ok, 'the chain alone still holds').to.equal(true);
      const cli = await runCli();
      expect(cli.code, cli.output).to.equal(1);
      expect(cli.output).to.include(
        `Trail TRUNCATED: event #${sealed.headEventId}, sealed ${sealed.sealedAt} (seal ${sealed.seq}), is no longer in the database (its chain now ends at #${keep.id})`,
      );
      expect(cli.output).to.include(
        `Trail TRUNCATED: ${sealed.eventCount} events were sealed ${sealed.sealedAt} (seal ${sealed.seq}); the database holds ${keep.id}`,
      );
      expect(cli.output).to.not.include('Seals verified');
    } finally {
      for (const row of cut) await ctx.db('trail_events').insert(insertable(row));
      await setHead(ctx.db, head);
    }
    const again = await runCli();
    expect(again.code, again.output).to.equal(0);
  });

  it('reports a sealed event rewritten with every later hash recomputed and the head moved along', async () => {
    const sealed = (await sealTrail(ctx.db, seals, 'interval')) ?? (await fileSeals()).at(-1)!;
    await someEvents(ctx.db, 2);
    const rows = await chainRows(ctx.db);
    const from = rows.findIndex((r) => r.id === sealed.headEventId - 2);
    const originals = rows.slice(from);
    // Forge one event before the seal and re-chain every row after it.
    let prev = rows[from - 1]!.hash;
    const forged = originals.map((row, i) => {
      const changed = { ...row, prev_hash: prev, ...(i === 0 ? { actor_name: 'Someone Else' } : {}) };
      const hash = trailHash(chainedFields(changed as never));
      prev = hash;
      return { ...changed, hash };
    });
    await withoutTrigger(ctx.db, 'trail_events_refuse_update', async () => {
      for (const row of forged)
        await ctx.db('trail_events').where({ id: row.id }).update({ actor_name: row['actor_name'], prev_hash: row.prev_hash, hash: row.hash });
    });
    await setHead(ctx.db, forged.at(-1)!);
    try {
      expect((await verifyChain(ctx.db)).ok, 'the chain alone still holds').to.equal(true);
      const cli = await runCli();
      expect(cli.code, cli.output).to.equal(1);
      expect(cli.output).to.include(`Trail REWRITTEN: event #${sealed.headEventId} no longer has the hash sealed ${sealed.sealedAt} (seal ${sealed.seq})`);
    } finally {
      await withoutTrigger(ctx.db, 'trail_events_refuse_update', async () => {
        for (const row of originals)
          await ctx.db('trail_events').where({ id: row.id }).update({ actor_name: row['actor_name'], prev_hash: row.prev_hash, hash: row.hash });
      });
      await setHead(ctx.db, originals.at(-1)!);
    }
    expect((await runCli()).code).to.equal(0);
  });

  it('reports a seal file whose own chain is broken (a line changed or removed), and refuses to seal into it', async () => {
    const text = readFileSync(SEAL_FILE, 'utf8');
    const lines = text.trimEnd().split('\n');
    expect(lines.length).to.be.at.least(3);
    // A lower count in line 2 would hide a truncation: the next line's link gives it away.
    const changed = [...lines];
    const second = JSON.parse(lines[1]!) as SealLine;
    changed[1] = JSON.stringify({ ...second, eventCount: 1 });
    const damaged = path.join(SEAL_DIR, 'changed.jsonl');
    writeFileSync(damaged, `${changed.join('\n')}\n`);
    const cli = await runCli(['--seals', damaged]);
    expect(cli.code, cli.output).to.equal(1);
    expect(cli.output).to.include(`Seal file BROKEN: ${damaged}: line 3 does not link to line 2: line 2 was changed.`);

    expect(parseSealFile(`${[lines[0], lines[2]].join('\n')}\n`).problem).to.equal('line 2 says it is seal 3: a line was removed or inserted');
    expect(parseSealFile(`${lines.slice(1).join('\n')}\n`).problem).to.equal('line 1 says it is seal 2: a line was removed or inserted');
    expect(parseSealFile(lines.join('\n')).problem).to.equal(`line ${lines.length} is incomplete (no end of line)`);

    const brokenDir = mkdtempSync(path.join(os.tmpdir(), 'kerfbook-seals-broken-'));
    writeFileSync(sealFilePath(brokenDir), `${changed.join('\n')}\n`);
    let refused: Error | null = null;
    await appendSeal(brokenDir, { headEventId: 1, headHash: 'a'.repeat(64), eventCount: 1, sealedAt: new Date().toISOString(), reason: 'interval' }).catch(
      (e: Error) => (refused = e),
    );
    expect(refused, 'appended to a damaged seal file').to.not.equal(null);
    expect(readFileSync(sealFilePath(brokenDir), 'utf8')).to.equal(`${changed.join('\n')}\n`);
  });

  it('says so when a named seal file is missing (exit 2), and checks the chain alone when the default one does not exist yet', async () => {
    const missing = await runCli(['--seals', path.join(SEAL_DIR, 'nope.jsonl')]);
    expect(missing.code, missing.output).to.equal(2);
    expect(missing.output).to.include('no seal file at');
    const none = await runCli([], { SEAL_DIR: mkdtempSync(path.join(os.tmpdir(), 'kerfbook-seals-none-')) });
    expect(none.code, none.output).to.equal(0);
    expect(none.output).to.match(/No seal file at .*trail-seals\.jsonl: only the chain inside the database was checked\./);
  });
});
