import type { ParamMap, Params } from '@angular/router';
import type { TrailQuery } from '@shared/schemas/workflow';
import { TRAIL_FAMILIES, type TrailFamily } from '@shared/vocabulary';

/** Events per page; the server's default, sent explicitly so a page is the same size everywhere. */
export const TRAIL_PAGE_SIZE = 50;

/**
 * The trail's view as it lives in the URL (`/trail?recipe=KB-0042&type=recipe.created&before=812`),
 * so an auditor can send the exact list they are looking at.
 */
export interface TrailParams {
  /** A recipe number as typed ("KB-0042") or a recipe id ("42"); resolved to an id before asking. */
  recipe: string;
  userId: number | null;
  type: string;
  /** A family of events ("signatures"), or '' for every family. */
  family: TrailFamily | '';
  /** Sign-ins, sign-outs and refused sign-ins left out. */
  hideSignIns: boolean;
  /** Inclusive UTC dates, YYYY-MM-DD. */
  from: string;
  to: string;
  /** Keyset: show events with an id below this one; null for the newest. */
  before: number | null;
}

export const TRAIL_DEFAULTS: TrailParams = { recipe: '', userId: null, type: '', family: '', hideSignIns: false, from: '', to: '', before: null };

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

function positiveInteger(value: string | null): number | null {
  if (value === null || !/^[1-9]\d*$/.test(value.trim())) return null;
  return Number(value);
}

function familyOf(value: string | null): TrailFamily | '' {
  return (TRAIL_FAMILIES as readonly string[]).includes(value ?? '') ? (value as TrailFamily) : '';
}

/** Reads the URL's query parameters; anything malformed is dropped rather than sent to the server. */
export function readTrailParams(map: ParamMap): TrailParams {
  const date = (key: string) => {
    const value = (map.get(key) ?? '').trim();
    return ISO_DATE.test(value) ? value : '';
  };
  return {
    recipe: (map.get('recipe') ?? '').trim().slice(0, 100),
    userId: positiveInteger(map.get('user')),
    type: (map.get('type') ?? '').trim().slice(0, 60),
    family: familyOf(map.get('family')),
    hideSignIns: map.get('signIns') === 'hidden',
    from: date('from'),
    to: date('to'),
    before: positiveInteger(map.get('before')),
  };
}

/** The URL query parameters for a view; empty filters are left out so links stay short. */
export function toTrailQueryParams(p: TrailParams): Params {
  return {
    recipe: p.recipe || null,
    user: p.userId ?? null,
    type: p.type || null,
    family: p.family || null,
    signIns: p.hideSignIns ? 'hidden' : null,
    from: p.from || null,
    to: p.to || null,
    before: p.before ?? null,
  };
}

/** A typed recipe reference that is already an id. */
export function recipeIdOf(reference: string): number | null {
  return positiveInteger(reference);
}

/** The API's filters for a view, once the recipe reference is resolved to an id (without paging). */
export function toTrailFilters(p: TrailParams, recipeId: number | null): Partial<TrailQuery> {
  return {
    recipeId: recipeId ?? undefined,
    userId: p.userId ?? undefined,
    type: p.type || undefined,
    family: p.family || undefined,
    hideSignIns: p.hideSignIns ? 'true' : undefined,
    from: p.from || undefined,
    to: p.to || undefined,
  };
}
