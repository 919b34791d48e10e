import type { Knex } from 'knex';

/**
 * Deletes the sessions whose expiry has passed, as connect-session-knex's own clean-up
 * does (`expired` is UTC; the connection sends dates as UTC). Safe in every process.
 */
export async function deleteExpiredSessions(db: Knex, now: Date = new Date()): Promise<number> {
  return db('sessions').where('expired', '<', now).del();
}
