/**
 * Recent word diffs, kept per process. A comparison of two long versions costs tens of
 * milliseconds of word diffing (npm run bench: two 30 kB versions), and the same pair is
 * opened again and again — by each reviewer, on every reload of the review screen. The
 * diff is a pure function of the two texts, so a kept result is never stale: the key is
 * a hash of both texts, whatever version, draft revision or recipe they came from.
 */
import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import { wordDiff, type TextDiff } from '../../../shared/recipe-compare';

type Parts = ReturnType<TextDiff>;

/** About 16 MB of kept diff text (each part's characters, counted once). */
const MAX_KEPT_CHARACTERS = 16_000_000;
/** Short texts are diffed in microseconds: not worth a hash and a slot. */
const MIN_CHARACTERS = 2_000;

const kept = new LRUCache<string, Parts>({
  maxSize: MAX_KEPT_CHARACTERS,
  sizeCalculation: (parts) =>
    Math.max(
      1,
      parts.reduce((n, p) => n + p.value.length, 0),
    ),
});

function keyOf(before: string, after: string): string {
  return createHash('sha256').update(before).update('\u0000').update(String(before.length)).update('\u0000').update(after).digest('base64');
}

/** wordDiff, answered from the kept results when the same two texts were diffed lately. */
export const keptWordDiff: TextDiff = (before, after) => {
  if (before.length + after.length < MIN_CHARACTERS) return wordDiff(before, after);
  const key = keyOf(before, after);
  const found = kept.get(key);
  if (found) return found;
  // Frozen: one kept result is handed to every later caller, none may change it.
  const parts = Object.freeze(wordDiff(before, after).map((p) => Object.freeze(p))) as Parts;
  kept.set(key, parts);
  return parts;
};
