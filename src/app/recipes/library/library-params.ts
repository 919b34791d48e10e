import type { ParamMap, Params } from '@angular/router';
import { toHv } from '@shared/hardness';
import { RECIPE_SORT_FIELDS, type RecipeListQuery } from '@shared/schemas/recipe';
import {
  HARDNESS_SCALES,
  type HardnessScale,
  MATERIAL_GROUPS,
  type MaterialGroup,
  RECIPE_STATUSES,
  type RecipeStatus,
  SHAPES,
  type Shape,
} from '@shared/vocabulary';

export type LibrarySortField = (typeof RECIPE_SORT_FIELDS)[number];

/**
 * The library's view as it lives in the URL (`/library?group=…&size=30&sort=updatedAt…`),
 * so a filtered view can be shared and survives a reload.
 */
export interface LibraryParams {
  q: string;
  group: MaterialGroup | '';
  shape: Shape | '';
  machineId: number | null;
  status: RecipeStatus | '';
  /** 'overdue': only recipes whose periodic review date has passed. */
  review: 'overdue' | '';
  /** A size the recipe must cover, mm. */
  size: number | null;
  /** A hardness the recipe must cover, on `scale`. */
  hardness: number | null;
  scale: HardnessScale;
  sort: LibrarySortField;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export const LIBRARY_DEFAULTS: LibraryParams = {
  q: '',
  group: '',
  shape: '',
  machineId: null,
  status: '',
  review: '',
  size: null,
  hardness: null,
  scale: 'HV',
  sort: 'number',
  dir: 'asc',
  page: 0,
  pageSize: 25,
};

export const LIBRARY_PAGE_SIZES = [10, 25, 50, 100];

function oneOf<T extends string>(value: string | null, allowed: readonly T[]): T | '' {
  return allowed.find((a) => a === value) ?? '';
}

function positiveNumber(value: string | null): number | null {
  if (value === null || value.trim() === '') return null;
  const n = Number(value);
  return Number.isFinite(n) && n > 0 ? n : null;
}

/** Reads the URL's query parameters; anything unknown or malformed falls back to the default. */
export function readLibraryParams(map: ParamMap): LibraryParams {
  const id = positiveNumber(map.get('machine'));
  const page = Number(map.get('page'));
  const pageSize = Number(map.get('pageSize'));
  return {
    q: (map.get('q') ?? '').trim().slice(0, 100),
    group: oneOf(map.get('group'), MATERIAL_GROUPS),
    shape: oneOf(map.get('shape'), SHAPES),
    machineId: id !== null && Number.isInteger(id) ? id : null,
    status: oneOf(map.get('status'), RECIPE_STATUSES),
    review: oneOf(map.get('review'), ['overdue'] as const),
    size: positiveNumber(map.get('size')),
    hardness: positiveNumber(map.get('hardness')),
    scale: oneOf(map.get('scale'), HARDNESS_SCALES) || 'HV',
    sort: oneOf(map.get('sort'), RECIPE_SORT_FIELDS) || LIBRARY_DEFAULTS.sort,
    dir: map.get('dir') === 'desc' ? 'desc' : 'asc',
    page: Number.isInteger(page) && page > 0 ? page : 0,
    pageSize: LIBRARY_PAGE_SIZES.includes(pageSize) ? pageSize : LIBRARY_DEFAULTS.pageSize,
  };
}

/** The URL query parameters for a view; defaults are left out so links stay short. */
export function toLibraryQueryParams(p: LibraryParams): Params {
  const d = LIBRARY_DEFAULTS;
  return {
    q: p.q || null,
    group: p.group || null,
    shape: p.shape || null,
    machine: p.machineId ?? null,
    status: p.status || null,
    review: p.review || null,
    size: p.size ?? null,
    hardness: p.hardness ?? null,
    scale: p.hardness !== null && p.scale !== 'HV' ? p.scale : null,
    sort: p.sort !== d.sort ? p.sort : null,
    dir: p.dir !== d.dir ? p.dir : null,
    page: p.page || null,
    pageSize: p.pageSize !== d.pageSize ? p.pageSize : null,
  };
}

/**
 * The hardness filter in HV, as the API wants it: the value itself on HV, otherwise the
 * steel conversion (ASTM E140 via shared/hardness.ts); `undefined` when there is no value or
 * no conversion.
 */
export function hardnessInHv(p: Pick<LibraryParams, 'hardness' | 'scale'>): number | undefined {
  if (p.hardness === null) return undefined;
  const hv = toHv(p.hardness, p.scale);
  return hv === null ? undefined : Math.round(hv);
}

/** The API query for a view. */
export function toRecipeListQuery(p: LibraryParams): Partial<RecipeListQuery> {
  return {
    page: p.page,
    pageSize: p.pageSize,
    sort: p.sort,
    dir: p.dir,
    q: p.q || undefined,
    group: p.group || undefined,
    shape: p.shape || undefined,
    machineId: p.machineId ?? undefined,
    status: p.status || undefined,
    review: p.review || undefined,
    size: p.size ?? undefined,
    hardnessHv: hardnessInHv(p),
  };
}
