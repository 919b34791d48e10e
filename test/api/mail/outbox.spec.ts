/**
 * The mail outbox and its worker against the real MariaDB and a real SMTP catcher
 * (smtp-server + mailparser) started by each test: transactional enqueue, delivery,
 * failure with back-off, recovery, several workers at once, and claims that ran out.
 */
import { expect } from 'chai';
import type { Knex } from 'knex';
import type { Transporter } from 'nodemailer';
import type { MailRow } from '../../../server/data/mail-outbox';
import { enqueueMail } from '../../../server/services/mail/outbox';
import { CLAIM_MS, createMailTransport, deliverDueMails, retryDelayMs } from '../../../server/services/mail/worker';
import { startMailCatcher, type MailCatcher } from '../../../server/tools/mail-catcher';
import { startJobs } from '../../../server/jobs';
import { testConfig } from '../support/test-app';
import { countRows, resetTables, testDb } from '../support/test-database';

const T0 = new Date('2027-03-01T08:00:00.000Z');
const at = (ms: number) => new Date(T0.getTime() + ms);

describe('Mail outbox', () => {
  let db: Knex;
  let catcher: MailCatcher | null = null;
  const transports: Transporter[] = [];

  function transportTo(port: number): Transporter {
    const t = createMailTransport(`smtp://127.0.0.1:${port}`, { ignoreTls: true });
    transports.push(t);
    return t;
  }

  async function enqueue(n: number, to = 'operator@lab.example'): Promise<number> {
    return db.transaction((trx) =>
      enqueueMail(
        trx,
        {
          to,
          subject: `New version to read — mail ${n}`,
          text: `Plain text of mail ${n}.`,
          html: `<p>HTML of <b>mail ${n}</b>.</p>`,
          kind: 'test.notice',
        },
        T0,
      ),
    );
  }

  async function row(id: number): Promise<MailRow> {
    return (await db('mail_outbox').where({ id }).first()) as MailRow;
  }

  before(async function () {
    this.timeout(60000);
    db = await testDb();
    // Empty tables: startJobs runs every job once, and other files' recipes must not give it work.
    await resetTables(db);
  });

  beforeEach(async () => {
    await db('mail_outbox').delete();
  });

  afterEach(async () => {
    for (const t of transports.splice(0)) t.close();
    if (catcher) await catcher.stop();
    catcher = null;
  });

  it('writes a mail only when the transaction that enqueues it commits', async () => {
    const refused = db.transaction(async (trx) => {
      await enqueueMail(trx, { to: 'a@lab.example', subject: 'Never', text: 'Never sent.', kind: 'test.notice' });
      throw new Error('the change was refused');
    });
    let failed = false;
    try {
      await refused;
    } catch {
      failed = true;
    }
    expect(failed).to.equal(true);
    expect(await countRows(db, 'mail_outbox')).to.equal(0);

    const id = await enqueue(1);
    const stored = await row(id);
    expect(stored).to.include({ to_address: 'operator@lab.example', kind: 'test.notice', attempts: 0, sent_at: null, sending_claimed_by: null });
    expect(stored.send_after.toISOString()).to.equal(T0.toISOString());
  });

  it('delivers a due mail to the SMTP server with its text and HTML parts, once', async () => {
    catcher = await startMailCatcher(0, { dir: null });
    const transport = transportTo(catcher.port);
    const id = await enqueue(1, 'reader@lab.example');

    const result = await deliverDueMails(db, transport, at(1000), { from: 'Kerfbook Test <kerfbook@lab.example>' });
    expect(result).to.deep.equal({ sent: 1, failed: 0 });

    const mails = catcher.messages();
    expect(mails).to.have.length(1);
    const mail = mails[0]!;
    expect(mail.envelopeTo).to.deep.equal(['reader@lab.example']);
    expect(mail.to).to.deep.equal(['reader@lab.example']);
    expect(mail.from).to.equal('kerfbook@lab.example');
    expect(mail.subject).to.equal('New version to read — mail 1');
    expect(mail.text.trim()).to.equal('Plain text of mail 1.');
    expect(mail.html).to.contain('<b>mail 1</b>');

    const sent = await row(id);
    expect(sent.sent_at).to.be.instanceOf(Date);
    expect(sent.message_id).to.equal(mail.messageId);
    expect(sent.sending_claimed_by).to.equal(null);
    expect(sent.attempts).to.equal(0);

    // Sent is final: later runs, even far later, never send it again.
    expect(await deliverDueMails(db, transport, at(10 * 24 * 3600 * 1000))).to.deep.equal({ sent: 0, failed: 0 });
    expect(catcher.messages()).to.have.length(1);
  });

  it('keeps a mail queued with the error and a later try when the server is down, and delivers it once it is back', async () => {
    catcher = await startMailCatcher(0, { dir: null });
    const port = catcher.port;
    await catcher.stop();
    catcher = null;
    const transport = transportTo(port);
    const id = await enqueue(1);

    expect(await deliverDueMails(db, transport, at(0))).to.deep.equal({ sent: 0, failed: 1 });
    let queued = await row(id);
    expect(queued.sent_at).to.equal(null);
    expect(queued.attempts).to.equal(1);
    expect(queued.last_error).to.match(/ECONNREFUSED|connect/i);
    expect(queued.send_after.toISOString()).to.equal(at(30 * 1000).toISOString());
    expect(queued.sending_claimed_by).to.equal(null);

    // Not due yet: nothing is tried.
    expect(await deliverDueMails(db, transport, at(29 * 1000))).to.deep.equal({ sent: 0, failed: 0 });

    // Second failure: the wait doubles.
    expect(await deliverDueMails(db, transport, at(30 * 1000))).to.deep.equal({ sent: 0, failed: 1 });
    queued = await row(id);
    expect(queued.attempts).to.equal(2);
    expect(queued.send_after.toISOString()).to.equal(at(90 * 1000).toISOString());

    catcher = await startMailCatcher(port, { dir: null });
    expect(await deliverDueMails(db, transport, at(60 * 1000))).to.deep.equal({ sent: 0, failed: 0 });
    expect(catcher.messages()).to.have.length(0);
    expect(await deliverDueMails(db, transport, at(91 * 1000))).to.deep.equal({ sent: 1, failed: 0 });
    expect(await deliverDueMails(db, transport, at(3600 * 1000))).to.deep.equal({ sent: 0, failed: 0 });
    expect(catcher.messages()).to.have.length(1);
    const sent = await row(id);
    expect(sent.sent_at).to.be.instanceOf(Date);
    expect(sent.attempts).to.equal(2);
  });

  it('backs off 30 s, doubling per attempt, and never waits more than an hour', () => {
    expect([0, 1, 2, 3].map(retryDelayMs)).to.deep.equal([30000, 60000, 120000, 240000]);
    expect(retryDelayMs(6)).to.equal(1920000);
    expect(retryDelayMs(7)).to.equal(3600000);
    expect(retryDelayMs(40)).to.equal(3600000);
  });

  it('sends each mail once when two workers run at the same time', async function () {
    this.timeout(60000);
    catcher = await startMailCatcher(0, { dir: null });
    const count = 30;
    for (let i = 1; i <= count; i++) await enqueue(i);

    const [a, b] = await Promise.all([deliverDueMails(db, transportTo(catcher.port), at(1000)), deliverDueMails(db, transportTo(catcher.port), at(1000))]);
    expect(a.failed + b.failed).to.equal(0);
    expect(a.sent + b.sent).to.equal(count);

    const subjects = catcher.messages().map((m) => m.subject);
    expect(subjects).to.have.length(count);
    expect(new Set(subjects).size).to.equal(count);
    expect(await db('mail_outbox').whereNull('sent_at').count<{ n: number }[]>({ n: '*' })).to.deep.equal([{ n: 0 }]);
  });

  it('sends a mail whose claim ran out (its worker died), and leaves one whose claim still holds', async () => {
    catcher = await startMailCatcher(0, { dir: null });
    const transport = transportTo(catcher.port);
    const abandoned = await enqueue(1);
    const held = await enqueue(2);
    await db('mail_outbox')
      .where({ id: abandoned })
      .update({ sending_claimed_by: 'gone:1', sending_claimed_until: at(-1000) });
    await db('mail_outbox')
      .where({ id: held })
      .update({ sending_claimed_by: 'busy:2', sending_claimed_until: at(60 * 1000) });

    expect(await deliverDueMails(db, transport, at(0))).to.deep.equal({ sent: 1, failed: 0 });
    expect(catcher.messages().map((m) => m.subject)).to.deep.equal(['New version to read — mail 1']);
    expect((await row(held)).sent_at).to.equal(null);

    // Once the other worker's claim has run out too, the mail is sent here.
    expect(await deliverDueMails(db, transport, at(60 * 1000))).to.deep.equal({ sent: 1, failed: 0 });
    expect(catcher.messages()).to.have.length(2);
  });

  it('runs on a timer started by startJobs when SMTP_URL is set, and stops when the jobs stop', async function () {
    this.timeout(20000);
    catcher = await startMailCatcher(0, { dir: null });
    const id = await db.transaction((trx) =>
      enqueueMail(trx, { to: 'timer@lab.example', subject: 'From the timer', text: 'Sent by the worker.', kind: 'test.notice' }),
    );
    const jobs = startJobs({
      db,
      config: testConfig({ smtpUrl: `smtp://127.0.0.1:${catcher.port}`, mailFrom: 'Kerfbook Timer <timer-sender@lab.example>', mailIntervalMs: 50 }),
    });
    try {
      const deadline = Date.now() + 10000;
      while (catcher.messages().length === 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 50));
    } finally {
      jobs.stop();
    }
    expect(catcher.messages().map((m) => [m.to, m.from, m.subject])).to.deep.equal([[['timer@lab.example'], 'timer-sender@lab.example', 'From the timer']]);
    expect((await row(id)).sent_at).to.be.instanceOf(Date);

    // Stopped: a mail enqueued now stays in the outbox.
    const later = await enqueue(2);
    await new Promise((r) => setTimeout(r, 300));
    expect((await row(later)).sent_at).to.equal(null);
    expect(catcher.messages()).to.have.length(1);
  });

  it('leaves mail in the outbox when no SMTP_URL is set', async () => {
    const id = await enqueue(1);
    const jobs = startJobs({ db, config: testConfig({ mailIntervalMs: 50 }) });
    try {
      await new Promise((r) => setTimeout(r, 300));
    } finally {
      jobs.stop();
    }
    expect((await row(id)).sent_at).to.equal(null);
    expect((await row(id)).attempts).to.equal(0);
  });

  it('claims a row for longer than the transport may take to give up', () => {
    expect(CLAIM_MS).to.be.greaterThan(2 * 60 * 1000);
  });
});
