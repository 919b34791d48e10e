/**
 * The background jobs of an app process: expired sessions, supersession, review-due
 * reminders, trail seals and the mail worker. The entry point starts them once (main.ts, and the
 * bootstrap behind `npm start`); createApp never does, so tests and the load harness
 * build an app without timers. Every job is safe in every process: supersession locks
 * each recipe with SKIP LOCKED and checks again under the lock, a reminder is one row per
 * version and week (primary key), the worker claims outbox rows with SKIP LOCKED and a
 * claim end, and deleting expired sessions twice deletes nothing more.
 */
import type { Knex } from 'knex';
import { sealDirOf, type Config } from './config';
import { deleteExpiredSessions } from './data/sessions';
import { startReviewReminderTimer } from './services/mail/review-reminders';
import { mailSettingsOf } from './services/mail/settings';
import { createMailTransport, startMailWorker } from './services/mail/worker';
import { startSupersessionTimer } from './services/recipes/supersession';
import { startRepeatingJob } from './services/repeating-job';
import { startSealTimer } from './services/trail/seals';

/** Defaults of the intervals README.md lists (MAIL_, SUPERSESSION_, REVIEW_REMINDER_INTERVAL_MS). */
export const SESSION_CLEANUP_INTERVAL_MS = 60 * 60 * 1000;
export const DEFAULT_SUPERSESSION_INTERVAL_MS = 60 * 1000;
export const DEFAULT_REVIEW_REMINDER_INTERVAL_MS = 60 * 60 * 1000;
export const DEFAULT_MAIL_INTERVAL_MS = 15 * 1000;
export const DEFAULT_SEAL_CHECK_INTERVAL_MS = 5 * 60 * 1000;

export interface JobsDeps {
  db: Knex;
  config: Config;
  /** Where a failed run is logged. Default console.error. */
  log?: (...args: unknown[]) => void;
}

export interface Jobs {
  /** Stops every timer (a run in progress finishes). Does not close the database. */
  stop(): void;
}

/**
 * Starts every job: each runs now, then every interval. The mail worker runs only with
 * `config.smtpUrl`; without it mail waits in the outbox.
 */
export function startJobs({ db, config, log = console.error }: JobsDeps): Jobs {
  const mail = mailSettingsOf(config);
  const stops = [
    startRepeatingJob('sessions', () => deleteExpiredSessions(db), SESSION_CLEANUP_INTERVAL_MS, log),
    startSupersessionTimer(db, config.supersessionIntervalMs ?? DEFAULT_SUPERSESSION_INTERVAL_MS, log, mail),
    startReviewReminderTimer(db, config.reviewReminderIntervalMs ?? DEFAULT_REVIEW_REMINDER_INTERVAL_MS, log, mail),
    startSealTimer(db, { dir: sealDirOf(config), mail }, config.sealCheckIntervalMs ?? DEFAULT_SEAL_CHECK_INTERVAL_MS, log),
  ];
  if (config.smtpUrl) {
    const transport = createMailTransport(config.smtpUrl, { ignoreTls: !config.production });
    stops.push(
      startMailWorker(db, transport, config.mailIntervalMs ?? DEFAULT_MAIL_INTERVAL_MS, { ...(config.mailFrom ? { from: config.mailFrom } : {}), log }),
    );
  }
  return { stop: () => stops.forEach((stop) => stop()) };
}
