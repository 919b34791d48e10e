/** The record of review-due reminders (one per version and week) and the versions that need one. */
import type { Knex } from 'knex';

export interface ReminderCandidate {
  version_id: number;
  recipe_id: number;
  number: string;
  title: string;
  version: number;
  review_due_on: Date;
}

/**
 * Current approved versions whose review is due on or before `until` and that have no
 * reminder for the period yet: a plain read; the insert under the primary key decides.
 */
export async function reminderCandidates(db: Knex, until: string, periodStart: string): Promise<ReminderCandidate[]> {
  return db('recipes as r')
    .join('recipe_versions as v', 'v.id', 'r.current_version_id')
    .where('v.status', 'approved')
    .whereNotNull('v.review_due_on')
    .andWhere('v.review_due_on', '<=', until)
    .whereNotExists((s) => s.select(db.raw('1')).from('review_reminders as rr').whereRaw('rr.version_id = v.id').andWhere('rr.period_start', periodStart))
    .select('v.id as version_id', 'r.id as recipe_id', 'r.number', 'v.title', 'v.version', 'v.review_due_on')
    .orderBy('v.review_due_on')
    .orderBy('v.id');
}

/**
 * Records the reminder of a version for a period. False when that row exists already
 * (another process or an earlier run sent it): the primary key refuses the second one,
 * and a concurrent inserter waits for the first to commit before it is refused.
 */
export async function insertReminder(trx: Knex.Transaction, versionId: number, periodStart: string, at: Date): Promise<boolean> {
  try {
    await trx('review_reminders').insert({ version_id: versionId, period_start: periodStart, sent_at: at });
    return true;
  } catch (err) {
    if ((err as { code?: string }).code === 'ER_DUP_ENTRY') return false;
    throw err;
  }
}

/** True while the version is still its recipe's current approved version (read again inside the reminder's transaction). */
export async function isStillCurrent(trx: Knex.Transaction, recipeId: number, versionId: number): Promise<boolean> {
  const row = await trx('recipes as r')
    .join('recipe_versions as v', 'v.id', 'r.current_version_id')
    .where({ 'r.id': recipeId, 'v.id': versionId, 'v.status': 'approved' })
    .first('v.id');
  return Boolean(row);
}
