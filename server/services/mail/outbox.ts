/**
 * The mail outbox, in MariaDB so that any app process can send it. A mail is enqueued in the transaction of the event that
 * causes it — it exists exactly when that event committed, and a refused or rolled-back
 * change leaves no mail. The worker (worker.ts) sends it later, from any process.
 */
import type { Knex } from 'knex';
import type { OutboxEntryDto } from '../../../shared/api-types';
import { insertMail, listMails } from '../../data/mail-outbox';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  /** Optional HTML alternative to the text. */
  html?: string | null;
  /** What the mail is about, e.g. `version.effective`; shown in the outbox list. */
  kind: string;
}

/** Writes the mail into the outbox within the caller's transaction; returns its id. */
export async function enqueueMail(trx: Knex.Transaction, mail: OutgoingMail, now: Date = new Date()): Promise<number> {
  return insertMail(trx, {
    to_address: mail.to,
    subject: mail.subject,
    text_body: mail.text,
    html_body: mail.html ?? null,
    kind: mail.kind,
    created_at: now,
    send_after: now,
  });
}

/** The newest `limit` outbox rows, newest first. */
export async function listOutbox(db: Knex, limit = 200): Promise<OutboxEntryDto[]> {
  return (await listMails(db, limit)).map((r) => ({
    id: r.id,
    to: r.to_address,
    subject: r.subject,
    kind: r.kind,
    created: r.created_at.toISOString(),
    sent: r.sent_at ? r.sent_at.toISOString() : null,
    attempts: r.attempts,
    lastError: r.last_error,
    sendAfter: r.send_after.toISOString(),
    text: r.text_body,
  }));
}
