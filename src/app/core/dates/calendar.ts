import { utcDay } from '@shared/calendar-dates';

/**
 * The client's dates in one place. Calendar days are UTC "YYYY-MM-DD" strings, as the server's
 * effective and review dates are (shared/calendar-dates.ts); dates shown are UTC days too,
 * so everyone in the lab reads the same day. Dates shown to people go through the lab's
 * format (the `labDate` pipe, LabDateFormat).
 */

/** Today as a UTC calendar day, YYYY-MM-DD: the form the server's effective dates take. */
export function utcToday(now = new Date()): string {
  return utcDay(now);
}

/**
 * "14:05 UTC": the time of day of a save that just happened on this screen. The day goes
 * without saying; the time is UTC and says so like every other time Kerfbook shows, so it
 * reads as the same moment as the revision's time on the recipe page and in a save conflict.
 */
export function utcTimeOfDay(at: Date): string {
  return `${String(at.getUTCHours()).padStart(2, '0')}:${String(at.getUTCMinutes()).padStart(2, '0')} UTC`;
}
