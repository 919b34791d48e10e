import { formatDateTime } from '@shared/date-format';
import type { DateFormat } from '@shared/vocabulary';

/**
 * How the trail writes a moment: "05.12.2026 14:03 UTC" in the lab's date format, to the
 * minute, in UTC like every time Kerfbook stores; the exact instant stays in the row's
 * `datetime` and its detail. An unreadable value is shown as it came.
 */
export function trailTime(iso: string, format: DateFormat): string {
  return formatDateTime(iso, format) || iso;
}
