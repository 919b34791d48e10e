/**
 * Dates in the lab's one format, on every screen. The day shown is the UTC day, as Kerfbook
 * stores and compares days (calendar-dates.ts), so everyone in the lab reads the same day;
 * a time is shown as UTC and says so. ISO 8601 writes year-month-day; the others are the
 * usual European (day first, with dots or slashes) and US (month first) orders.
 */
import type { DateFormat } from './vocabulary';

const pad = (n: number) => String(n).padStart(2, '0');

/** An instant, an ISO string, or a "YYYY-MM-DD" calendar day as a Date; null when it does not read as one. */
function toInstant(value: string | Date): Date | null {
  const at = typeof value === 'string' ? new Date(/^\d{4}-\d{2}-\d{2}$/.test(value) ? `${value}T00:00:00Z` : value) : value;
  return Number.isNaN(at.getTime()) ? null : at;
}

/** "2026-12-05", "05.12.2026", "05/12/2026" or "12/05/2026": the UTC day of `value`; '' for nothing or an unreadable value. */
export function formatDate(value: string | Date | null | undefined, format: DateFormat): string {
  if (value === null || value === undefined || value === '') return '';
  const at = toInstant(value);
  if (!at) return '';
  const y = String(at.getUTCFullYear());
  const m = pad(at.getUTCMonth() + 1);
  const d = pad(at.getUTCDate());
  switch (format) {
    case 'dmy-dot':
      return `${d}.${m}.${y}`;
    case 'dmy-slash':
      return `${d}/${m}/${y}`;
    case 'mdy-slash':
      return `${m}/${d}/${y}`;
    default:
      return `${y}-${m}-${d}`;
  }
}

/** The day as formatDate gives it, then the UTC time of day: "05.12.2026 14:05 UTC". */
export function formatDateTime(value: string | Date | null | undefined, format: DateFormat): string {
  const day = formatDate(value, format);
  if (!day) return '';
  const at = toInstant(value!)!;
  return `${day} ${pad(at.getUTCHours())}:${pad(at.getUTCMinutes())} UTC`;
}
