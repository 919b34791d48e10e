/**
 * The Today page (everyone's home screen) and the review-due list: what waits for the signed-in person,
 * per role, with the cuts operators flagged and, for operators, the versions in use on
 * their machines that they have not acknowledged yet.
 */
import type { Knex } from 'knex';
import type { Role } from '../../../shared/roles';
import type { RecipeSummary, TodayDto } from '../../../shared/recipe-types';
import { flaggedCutRows } from '../../data/cuts';
import { myDraftRows, reviewDueRows, toAcknowledgeRows, waitingForReviewRows, type WorkflowSummaryRow } from '../../data/workflow';
import { addDays, dayOf, utcDay } from '../../../shared/calendar-dates';
import { toRecipeSummary } from '../recipes/recipe-dto';

/** How far ahead "review due" looks, days. */
export const REVIEW_DUE_WINDOW_DAYS = 60;

/** Rows per list: Today is a start page, the library holds the rest. */
const LIST_LIMIT = 100;

export type ReviewDueSummary = RecipeSummary & { reviewDueOn: string };

function withDueDate(row: WorkflowSummaryRow): ReviewDueSummary {
  return { ...toRecipeSummary(row), reviewDueOn: dayOf(row.review_due_on)! };
}

/**
 * Current approved versions whose periodic review is due within 60 days or overdue,
 * soonest first. `version` and `status` are those of the current (approved) version.
 */
export async function listReviewsDue(db: Knex, now = new Date()): Promise<ReviewDueSummary[]> {
  const rows = await reviewDueRows(db, addDays(utcDay(now), REVIEW_DUE_WINDOW_DAYS), LIST_LIMIT);
  return rows.map(withDueDate);
}

export async function getToday(db: Knex, user: { id: number; roles: readonly Role[] }, now = new Date()): Promise<Omit<TodayDto, 'notices'>> {
  const is = (role: Role) => user.roles.includes(role);
  const [myDrafts, waiting, due, flagged, unacknowledged] = await Promise.all([
    is('author') ? myDraftRows(db, user.id, LIST_LIMIT) : Promise.resolve([]),
    is('approver') ? waitingForReviewRows(db, user.id, LIST_LIMIT) : Promise.resolve([]),
    is('author') || is('approver') ? listReviewsDue(db, now) : Promise.resolve([]),
    // Cuts that were not good, on recipes the author created or edited, until an author clears them.
    is('author') ? flaggedCutRows(db, user.id, LIST_LIMIT) : Promise.resolve([]),
    is('operator') ? toAcknowledgeRows(db, user.id, LIST_LIMIT) : Promise.resolve([]),
  ]);
  return {
    myDrafts: myDrafts.map(toRecipeSummary),
    waitingForMyReview: waiting.map(toRecipeSummary),
    reviewsDue: due,
    flaggedCuts: flagged.map((f) => ({ recipeId: f.recipe_id, number: f.number, title: f.title, count: f.count })),
    toAcknowledge: unacknowledged.map(toRecipeSummary),
  };
}
