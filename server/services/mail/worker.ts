/**
 * Sends the mail outbox. Runs on a timer in every app process, like the
 * supersession job, and is safe with several processes: rows are claimed in a short
 * transaction with SKIP LOCKED (claimer and claim end written before it commits), then
 * sent outside any transaction, then marked sent. A failed send records the error and
 * retries later with exponential back-off; a claim that ran out (a process died while
 * sending) makes the row claimable again; a sent row is never sent again.
 */
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import type { Knex } from 'knex';
import nodemailer, { type Transporter } from 'nodemailer';
import { startRepeatingJob } from '../repeating-job';
import { claimDueMails, markMailFailed, markMailSent, type MailRow } from '../../data/mail-outbox';

export const DEFAULT_MAIL_FROM = 'Kerfbook <kerfbook@localhost>';

/** How long a claim holds; longer than the transport's timeouts together. */
export const CLAIM_MS = 5 * 60 * 1000;
/** First retry delay; doubled with every failed attempt, up to RETRY_MAX_MS. */
export const RETRY_BASE_MS = 30 * 1000;
export const RETRY_MAX_MS = 60 * 60 * 1000;
/** Rows claimed per round. */
const BATCH = 20;

/** When to try again after the attempt that brings the count to `attempts` failed. */
export function retryDelayMs(attemptsBefore: number): number {
  return Math.min(RETRY_BASE_MS * 2 ** attemptsBefore, RETRY_MAX_MS);
}

export interface DeliverOptions {
  /** The From address. Default DEFAULT_MAIL_FROM. */
  from?: string;
  /** Names this worker in `sending_claimed_by`. Default host, pid and a random part. */
  workerId?: string;
}

export interface DeliveryResult {
  sent: number;
  failed: number;
}

/** A worker name unique to this process and call site. */
export function newWorkerId(): string {
  return `${os.hostname().slice(0, 60)}:${process.pid}:${randomBytes(4).toString('hex')}`;
}

/** An SMTP transport for SMTP_URL. Timeouts stay well inside CLAIM_MS. */
export function createMailTransport(smtpUrl: string, options: { ignoreTls?: boolean } = {}): Transporter {
  const url = new URL(smtpUrl);
  return nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port || (url.protocol === 'smtps:' ? 465 : 25)),
    secure: url.protocol === 'smtps:',
    ...(url.username ? { auth: { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } } : {}),
    // The local catcher offers no STARTTLS (its built-in certificate has expired).
    ...(options.ignoreTls ? { ignoreTLS: true } : {}),
    connectionTimeout: 30 * 1000,
    greetingTimeout: 30 * 1000,
    socketTimeout: 60 * 1000,
  });
}

function errorText(err: unknown): string {
  const text = err instanceof Error ? err.message : String(err);
  return text.slice(0, 2000);
}

async function sendOne(db: Knex, transport: Transporter, row: MailRow, from: string, workerId: string, now: Date, result: DeliveryResult): Promise<void> {
  let messageId: string;
  try {
    const info = await transport.sendMail({
      from,
      to: row.to_address,
      subject: row.subject,
      text: row.text_body,
      ...(row.html_body ? { html: row.html_body } : {}),
    });
    messageId = String(info.messageId ?? '');
  } catch (err) {
    await markMailFailed(db, row.id, workerId, errorText(err), new Date(now.getTime() + retryDelayMs(row.attempts)));
    result.failed += 1;
    return;
  }
  await markSentWhileClaimed(db, row.id, messageId);
  result.sent += 1;
}

/** How long a "sent" mark is tried again (MariaDB away): well inside the claim. */
export const MARK_SENT_RETRY_MS = CLAIM_MS / 2;

/**
 * The mail is out: its mark must land while the claim holds, or the row is sent a second
 * time once the claim runs out. So the mark rides out a database outage (found by
 * `npm run test:soak`: MariaDB killed between the SMTP answer and the mark).
 */
async function markSentWhileClaimed(db: Knex, id: number, messageId: string): Promise<void> {
  const until = Date.now() + MARK_SENT_RETRY_MS;
  for (;;) {
    try {
      await markMailSent(db, id, new Date(), messageId);
      return;
    } catch (err) {
      if (Date.now() > until) throw err;
      await new Promise((r) => setTimeout(r, 1000));
    }
  }
}

/**
 * Claims and sends every mail due at `now` (tests pass a chosen `now`), batch by batch,
 * until none is left for this worker. Each row is claimed by exactly one worker at a time.
 */
export async function deliverDueMails(db: Knex, transport: Transporter, now: Date = new Date(), options: DeliverOptions = {}): Promise<DeliveryResult> {
  const from = options.from ?? DEFAULT_MAIL_FROM;
  const workerId = options.workerId ?? newWorkerId();
  const result: DeliveryResult = { sent: 0, failed: 0 };
  const tried = new Set<number>();
  for (;;) {
    const rows = (await claimDueMails(db, workerId, now, new Date(now.getTime() + CLAIM_MS), BATCH)).filter((r) => !tried.has(r.id));
    if (rows.length === 0) return result;
    for (const row of rows) {
      tried.add(row.id);
      await sendOne(db, transport, row, from, workerId, now, result);
    }
  }
}

/**
 * Sends due mail now and then every `intervalMs` until stopped. A run never overlaps the
 * previous one in the same process; a failed run is logged and the next one tries again.
 * Stopping also closes the transport.
 */
export function startMailWorker(
  db: Knex,
  transport: Transporter,
  intervalMs: number,
  options: { from?: string; log?: (...args: unknown[]) => void } = {},
): () => void {
  const log = options.log ?? console.error;
  const workerId = newWorkerId();
  const stop = startRepeatingJob(
    'mail',
    async () => {
      const result = await deliverDueMails(db, transport, new Date(), { workerId, ...(options.from ? { from: options.from } : {}) });
      if (result.failed > 0) log(`[mail] ${result.failed} mail(s) could not be sent; they stay in the outbox and are retried.`);
    },
    intervalMs,
    log,
  );
  return () => {
    stop();
    transport.close();
  };
}
