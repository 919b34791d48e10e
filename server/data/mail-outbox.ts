/** Queries on mail_outbox: insert, claim due rows, mark sent or failed, the outbox list. */
import type { Knex } from 'knex';
import { retryOnDeadlock } from './retry-deadlock';

export interface MailRow {
  id: number;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  kind: string;
  created_at: Date;
  send_after: Date;
  attempts: number;
  last_error: string | null;
  sending_claimed_by: string | null;
  sending_claimed_until: Date | null;
  sent_at: Date | null;
  message_id: string | null;
}

export type NewMailRow = Pick<MailRow, 'to_address' | 'subject' | 'text_body' | 'html_body' | 'kind' | 'created_at' | 'send_after'>;

export async function insertMail(db: Knex, row: NewMailRow): Promise<number> {
  const [id] = await db('mail_outbox').insert({ ...row, attempts: 0 });
  return id!;
}

/**
 * Claims up to `limit` due rows for `workerId` until `claimUntil`, in one short
 * transaction: the rows are locked with SKIP LOCKED (rows another worker is claiming
 * right now are left to it), marked as claimed, and the transaction commits before
 * anything is sent. Due means unsent, `send_after` reached, and no claim that still holds.
 */
export async function claimDueMails(db: Knex, workerId: string, now: Date, claimUntil: Date, limit: number): Promise<MailRow[]> {
  return retryOnDeadlock(() => claimOnce(db, workerId, now, claimUntil, limit));
}

async function claimOnce(db: Knex, workerId: string, now: Date, claimUntil: Date, limit: number): Promise<MailRow[]> {
  return db.transaction(async (trx) => {
    const rows: MailRow[] = await trx('mail_outbox')
      .whereNull('sent_at')
      .where('send_after', '<=', now)
      .where((q) => q.whereNull('sending_claimed_until').orWhere('sending_claimed_until', '<=', now))
      .orderBy([{ column: 'send_after' }, { column: 'id' }])
      .limit(limit)
      .forUpdate()
      .skipLocked();
    if (rows.length === 0) return [];
    await trx('mail_outbox')
      .whereIn(
        'id',
        rows.map((r) => r.id),
      )
      .update({ sending_claimed_by: workerId, sending_claimed_until: claimUntil });
    return rows;
  });
}

/** Records a delivery. Never undone: a row with `sent_at` is never claimed again. */
export async function markMailSent(db: Knex, id: number, sentAt: Date, messageId: string): Promise<void> {
  // Retried: a lost "sent" mark would let the row be sent again once its claim runs out.
  await retryOnDeadlock(() =>
    db('mail_outbox')
      .where({ id })
      .whereNull('sent_at')
      .update({ sent_at: sentAt, message_id: messageId, sending_claimed_by: null, sending_claimed_until: null }),
  );
}

/**
 * Records a failed attempt and when to try again; only while `workerId` still holds the
 * claim (a worker whose claim ran out leaves the row to the one that took it over).
 */
export async function markMailFailed(db: Knex, id: number, workerId: string, error: string, retryAt: Date): Promise<void> {
  await retryOnDeadlock(() =>
    db('mail_outbox')
      .where({ id, sending_claimed_by: workerId })
      .whereNull('sent_at')
      .update({
        attempts: db.raw('attempts + 1'),
        last_error: error,
        send_after: retryAt,
        sending_claimed_by: null,
        sending_claimed_until: null,
      }),
  );
}

/** The outbox, newest first. */
export async function listMails(db: Knex, limit: number): Promise<MailRow[]> {
  return db('mail_outbox')
    .orderBy([
      { column: 'created_at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .limit(limit);
}

/** When the newest mail of a kind was written to the outbox, or null when none was. */
export async function newestMailOfKind(db: Knex, kind: string): Promise<Date | null> {
  const row = (await db('mail_outbox').where({ kind }).max({ at: 'created_at' }).first()) as { at: Date | string | null } | undefined;
  return row?.at ? new Date(row.at) : null;
}
