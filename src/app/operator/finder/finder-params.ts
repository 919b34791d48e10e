import type { ParamMap, Params } from '@angular/router';
import type { FinderQuery } from '@shared/schemas/operator';
import { HARDNESS_SCALES, MATERIAL_GROUPS, SHAPES } from '@shared/vocabulary';

/** The finder's query parameters are named as the API names them, so the page URL and the request agree. */
export const FINDER_PARAM_KEYS = ['materialId', 'group', 'hardnessValue', 'hardnessScale', 'shape', 'sizeMm', 'machineId'] as const;

function positive(value: string | null, whole = false): number | undefined {
  if (value === null || value.trim() === '') return undefined;
  const n = Number(value);
  if (!Number.isFinite(n) || n <= 0 || (whole && !Number.isInteger(n))) return undefined;
  return n;
}

function oneOf<T extends string>(value: string | null, allowed: readonly T[]): T | undefined {
  return allowed.find((a) => a === value);
}

/** Reads the URL; anything unknown or malformed is left out rather than sent. */
export function readFinderParams(map: ParamMap): FinderQuery {
  const query: FinderQuery = {
    materialId: positive(map.get('materialId'), true),
    group: oneOf(map.get('group'), MATERIAL_GROUPS),
    hardnessValue: positive(map.get('hardnessValue')),
    hardnessScale: oneOf(map.get('hardnessScale'), HARDNESS_SCALES),
    shape: oneOf(map.get('shape'), SHAPES),
    sizeMm: positive(map.get('sizeMm')),
    machineId: positive(map.get('machineId'), true),
  };
  // A scale alone says nothing about the part.
  if (query.hardnessValue === undefined) query.hardnessScale = undefined;
  return query;
}

/** The query as URL (and request) parameters, without the empty fields. */
export function finderParams(query: FinderQuery): Params {
  const params: Params = {};
  for (const key of FINDER_PARAM_KEYS) {
    const value = query[key];
    if (value !== undefined && value !== null) params[key] = String(value);
  }
  return params;
}

export function isEmptyQuery(query: FinderQuery): boolean {
  return Object.keys(finderParams(query)).length === 0;
}
