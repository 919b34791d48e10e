/**
 * Periodic review: a version's review is due on its date and overdue from the day after.
 * Days are UTC calendar days written YYYY-MM-DD, compared as text.
 */
import { utcDay } from './calendar-dates';

/** True when the review date has passed: due 2027-03-01 is overdue on 2027-03-02, not on the 1st. */
export function isReviewOverdue(reviewDueOn: string | null | undefined, today: string): boolean {
  return !!reviewDueOn && reviewDueOn < today;
}

/** The review fields of a list row, judged against today (UTC). */
export function reviewDue(reviewDueOn: string | null, now = new Date()): { reviewDueOn: string | null; reviewOverdue: boolean } {
  return { reviewDueOn, reviewOverdue: isReviewOverdue(reviewDueOn, utcDay(now)) };
}
