/** Writes to the append-only trail. Reading and the hash chain come with the Trail issue. */
import type { Knex } from 'knex';

export interface AuditEventRow {
  occurred_at: Date;
  actor_user_id: number | null;
  actor_name: string;
  event_type: string;
  entity_type: string;
  entity_id: string | null;
  before_json: string | null;
  after_json: string | null;
  client_address: string | null;
}

export async function insertAuditEvent(db: Knex, row: AuditEventRow): Promise<void> {
  await db('audit_events').insert(row);
}
