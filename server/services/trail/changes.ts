/** Compact before/after for the trail: only the keys whose values differ. */
import { isDeepStrictEqual } from 'node:util';

export interface Changes {
  before: Record<string, unknown>;
  after: Record<string, unknown>;
}

export function changedKeys(before: Record<string, unknown>, after: Record<string, unknown>, ignore: readonly string[] = []): string[] {
  const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
  return [...keys].filter((k) => !ignore.includes(k) && !isDeepStrictEqual(before[k], after[k])).sort();
}

export function diff(before: Record<string, unknown>, after: Record<string, unknown>, ignore: readonly string[] = []): Changes {
  const result: Changes = { before: {}, after: {} };
  for (const key of changedKeys(before, after, ignore)) {
    result.before[key] = before[key] ?? null;
    result.after[key] = after[key] ?? null;
  }
  return result;
}
