/**
 * Review-due reminders: a job in every app process mails the authors of each
 * current approved version whose periodic review is due within 30 days or overdue — once a
 * week. The `review_reminders` row (version, Monday of the UTC week) and the mails are
 * written in one transaction; its primary key makes a second run that week, or another
 * process running at the same moment, do nothing.
 */
import type { Knex } from 'knex';
import { startRepeatingJob } from '../repeating-job';
import { insertReminder, isStillCurrent, reminderCandidates } from '../../data/review-reminders';
import { addDays, dayOf, utcDay } from '../../../shared/calendar-dates';
import { DEFAULT_MAIL_SETTINGS, type MailSettings } from './settings';
import { notifyReviewDue } from './notifications';

/** How far ahead the reminder looks, days. */
export const REMINDER_WINDOW_DAYS = 30;

/** Monday (UTC) of the week `now` falls in: the reminder period. */
export function reminderPeriodStart(now: Date): string {
  const sinceMonday = (now.getUTCDay() + 6) % 7;
  return addDays(utcDay(now), -sinceMonday);
}

export interface ReminderResult {
  /** Versions reminded in this run. */
  reminded: number;
  /** Mails enqueued for them. */
  mails: number;
}

export async function sendReviewReminders(db: Knex, now: Date = new Date(), mail: MailSettings = DEFAULT_MAIL_SETTINGS): Promise<ReminderResult> {
  const today = utcDay(now);
  const period = reminderPeriodStart(now);
  const result: ReminderResult = { reminded: 0, mails: 0 };
  for (const c of await reminderCandidates(db, addDays(today, REMINDER_WINDOW_DAYS), period)) {
    await db.transaction(async (trx) => {
      // Superseded or withdrawn since the list was read: its review no longer matters.
      if (!(await isStillCurrent(trx, c.recipe_id, c.version_id))) return;
      if (!(await insertReminder(trx, c.version_id, period, now))) return;
      const ref = { recipeId: c.recipe_id, number: c.number, version: c.version, title: c.title };
      result.mails += await notifyReviewDue(trx, mail, c.version_id, ref, dayOf(c.review_due_on)!, today, now);
      result.reminded += 1;
    });
  }
  return result;
}

/** Runs the job now and then every `intervalMs` until stopped (see repeating-job.ts). */
export function startReviewReminderTimer(
  db: Knex,
  intervalMs: number,
  log: (...args: unknown[]) => void = console.error,
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): () => void {
  return startRepeatingJob('review reminders', () => sendReviewReminders(db, new Date(), mail), intervalMs, log);
}
