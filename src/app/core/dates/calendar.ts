import { utcDay } from '@shared/calendar-dates';

/**
 * The client's dates in one place. Calendar days are UTC "YYYY-MM-DD" strings, as the server's
 * effective and review dates are (shared/calendar-dates.ts); dates shown in words are UTC too,
 * so everyone in the lab reads the same day.
 */

/** Today as a UTC calendar day, YYYY-MM-DD: the form the server's effective dates take. */
export function utcToday(now = new Date()): string {
  return utcDay(now);
}

/** "2 Dec 2026": the UTC day of an instant, in words. */
export function shortDate(iso: string): string {
  return new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
}

/** "14:05": the local time of day, for a save that just happened on this screen. */
export function shortTime(at: Date): string {
  return at.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
}
