/**
 * How the trail writes a moment: "2026-12-05 14:03 UTC", to the minute, in UTC like every
 * time Kerfbook stores. One function, so the trail can follow a lab-wide date format later;
 * the exact instant stays in the row's `datetime` and its detail.
 */
export function trailTime(iso: string): string {
  const at = new Date(iso);
  if (Number.isNaN(at.getTime())) return iso;
  return `${at.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}
