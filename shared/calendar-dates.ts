/**
 * UTC calendar days as the workflow uses them (effective dates, review due dates):
 * "YYYY-MM-DD" strings, compared as text. The lab's day is the UTC day, like every time
 * Kerfbook stores.
 */

/** The UTC calendar day of an instant. */
export function utcDay(at: Date): string {
  return at.toISOString().slice(0, 10);
}

/** A DATE column's value (mysql2 with timezone 'Z' reads it as midnight UTC) as a day, or null. */
export function dayOf(value: Date | string | null | undefined): string | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'string') return value.slice(0, 10);
  return utcDay(value);
}

/** True for a real calendar day written YYYY-MM-DD (rejects 2027-02-30). */
export function isCalendarDay(day: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(day)) return false;
  const d = new Date(`${day}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && utcDay(d) === day;
}

/**
 * The same day `months` later; a day the target month lacks becomes its last day
 * (2026-08-31 + 6 months = 2027-02-28), as periodic-review calendars usually count.
 */
export function addMonths(day: string, months: number): string {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  const index = y * 12 + (m - 1) + months;
  const year = Math.floor(index / 12);
  const month = index - year * 12; // 0-based
  const lastDay = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
  return utcDay(new Date(Date.UTC(year, month, Math.min(d, lastDay))));
}

/** `day` plus a number of days. */
export function addDays(day: string, days: number): string {
  const d = new Date(`${day}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return utcDay(d);
}
