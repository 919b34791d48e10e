/** Reading the trail: the filtered list, newest first, with keyset pagination. */
import type { Knex } from 'knex';
import type { TrailPage } from '../../../shared/recipe-types';
import type { TrailQuery } from '../../../shared/schemas/workflow';
import { addDays, isCalendarDay } from '../../../shared/calendar-dates';
import { AppError } from '../../app-error';
import { type TrailFilter, listTrailEventRows } from '../../data/trail-events';
import { toTrailEventDto } from './stored-row';
import { nameSubjects } from './subjects';
import { TRAIL_FAMILY_RULES } from '../../../shared/trail-families';

/** A calendar day written YYYY-MM-DD, refusing days that do not exist (2027-02-31). */
function calendarDay(value: string, path: string): string {
  if (!isCalendarDay(value)) throw AppError.validation([{ path, message: `${value} is not a date on the calendar.` }]);
  return value;
}

/** The UTC midnight that starts a day. */
const startOf = (day: string): Date => new Date(`${day}T00:00:00.000Z`);

/** The query's filters as bounds: `from` and `to` are whole UTC days, both included. */
export function filterOf(query: TrailQuery): TrailFilter {
  const from = query.from === undefined ? undefined : calendarDay(query.from, 'from');
  const to = query.to === undefined ? undefined : calendarDay(query.to, 'to');
  if (from && to && from > to) throw AppError.validation([{ path: 'to', message: 'The last day must not be before the first.' }]);
  const filter: TrailFilter = {};
  if (query.recipeId !== undefined) filter.recipeId = query.recipeId;
  if (query.userId !== undefined) filter.userId = query.userId;
  if (query.type) filter.type = query.type;
  if (query.family) filter.family = TRAIL_FAMILY_RULES[query.family];
  if (query.hideSignIns === 'true') filter.hidePrefixes = TRAIL_FAMILY_RULES['sign-ins'].prefixes;
  if (from) filter.from = startOf(from);
  if (to) filter.toBefore = startOf(addDays(to, 1));
  if (query.before !== undefined) filter.beforeId = query.before;
  return filter;
}

/** A page, newest first; `nextBefore` is set only when an older row exists. */
export async function listTrail(db: Knex, query: TrailQuery): Promise<TrailPage> {
  const rows = await listTrailEventRows(db, filterOf(query), query.limit + 1);
  const events = rows.slice(0, query.limit).map(toTrailEventDto);
  const names = await nameSubjects(db, events);
  const items = events.map((e, i) => ({ ...e, what: names[i]! }));
  const more = rows.length > query.limit;
  return { items, nextBefore: more && items.length > 0 ? items[items.length - 1]!.id : null };
}
