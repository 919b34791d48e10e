import { expect } from 'chai';
import fc from 'fast-check';
import type { UnitPreference } from '../../../../shared/api-types';
import {
  compareVersions,
  contentLeafPaths,
  PARAMETER_FIELDS,
  TEXT_FIELDS,
  wordDiff,
  type ComparedVersion,
  type StockNames,
} from '../../../../shared/recipe-compare';
import type { RecipeContent } from '../../../../shared/schemas/recipe';
import { halfTypedContent, halfTypedPrimitiveContent, oddText, outsidePrimitive, RUNS, RUNS_HEAVY, validContent } from './arbitraries';

const names: StockNames = { materials: new Map([[1, 'Q&T alloy steel bar']]), wheels: new Map([[1, 'Alumina 250']]), machines: new Map([[1, 'Bench saw']]) };
const pref = fc.constantFrom<UnitPreference>('metric', 'metric+imperial');

/** The two sides of a word diff: unchanged + removed parts, unchanged + added parts. */
const side = (parts: ReturnType<typeof wordDiff>, which: 'before' | 'after') =>
  parts
    .filter((p) => (which === 'before' ? !p.added : !p.removed))
    .map((p) => p.value)
    .join('');

/** Recipe-like text: words, numbers, punctuation, spaces and line breaks from a small vocabulary, so edits overlap. */
const recipeText = fc
  .array(
    fc.constantFrom(
      'Clamp',
      'the',
      'part',
      'cut',
      'slowly',
      'at',
      '3000',
      'rpm',
      '0.30',
      'mm/s',
      '.',
      ',',
      ' ',
      ' ',
      '  ',
      '\n',
      '\n\n',
      '- ',
      'µm',
      'Ø40',
      '°C',
      '→',
    ),
    { maxLength: 60 },
  )
  .map((ws) => ws.join(''));
/** A text and an edit of it: words inserted, deleted or replaced at a few places. */
const textPair = fc.oneof(
  fc.tuple(recipeText, recipeText),
  recipeText.chain((t) =>
    fc.array(fc.tuple(fc.nat({ max: t.length }), fc.nat({ max: 8 }), fc.oneof(recipeText, oddText)), { maxLength: 4 }).map((edits) => {
      let after = t;
      for (const [at, del, ins] of edits) after = after.slice(0, Math.min(at, after.length)) + ins + after.slice(Math.min(at, after.length) + del);
      return [t, after] as [string, string];
    }),
  ),
  fc.tuple(oddText, oddText),
);

const version = (n: number, content: RecipeContent, title = 'Alloy bar, transverse'): ComparedVersion => ({ version: n, status: 'approved', title, content });

/** Value at a dotted path, for the property's own check. */
function at(source: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((v, k) => (v !== null && typeof v === 'object' ? (v as Record<string, unknown>)[k] : undefined), source);
}
const canonical = (v: unknown): string =>
  JSON.stringify(v ?? null, (_k, x: unknown) =>
    x && typeof x === 'object' && !Array.isArray(x) ? Object.fromEntries(Object.entries(x).sort(([a], [b]) => (a < b ? -1 : 1))) : x,
  );

describe('shared/recipe-compare (properties)', () => {
  it('a word diff rebuilds both texts: unchanged + removed = before, unchanged + added = after', () => {
    fc.assert(
      fc.property(textPair, ([before, after]) => {
        const parts = wordDiff(before, after);
        expect(side(parts, 'before')).to.equal(before);
        expect(side(parts, 'after')).to.equal(after);
        for (const p of parts) {
          expect(p.value).to.not.equal('');
          expect(p.added && p.removed).to.not.equal(true);
        }
        // Neighbours of the same kind are merged into one part.
        for (let i = 1; i < parts.length; i++)
          expect([!!parts[i]!.added, !!parts[i]!.removed]).to.not.deep.equal([!!parts[i - 1]!.added, !!parts[i - 1]!.removed]);
      }),
      { numRuns: RUNS },
    );
  });

  it('a text against itself is one unchanged part (nothing for the empty text)', () => {
    fc.assert(
      fc.property(fc.oneof(recipeText, oddText), (t) => {
        expect(wordDiff(t, t)).to.deep.equal(t ? [{ value: t }] : []);
      }),
      { numRuns: RUNS },
    );
  });

  it('a version against itself (or a copy) reports no change', () => {
    fc.assert(
      fc.property(fc.oneof(validContent, halfTypedPrimitiveContent), pref, (c, p) => {
        const r = compareVersions(version(1, c), version(1, structuredClone(c)), names, p);
        expect(r.parameters).to.deep.equal([]);
        expect(r.texts).to.deep.equal([]);
      }),
      { numRuns: RUNS_HEAVY },
    );
  });

  it('reports a parameter exactly when its value differs, and the text changes rebuild both sides', () => {
    fc.assert(
      fc.property(validContent, validContent, textPair, pref, (a, b, [ta, tb], p) => {
        const withText = (c: RecipeContent, t: string) => ({ ...c, instructionsMd: t });
        const r = compareVersions(version(1, withText(a, ta), ta.slice(0, 20)), version(2, withText(b, tb), tb.slice(0, 20)), names, p);
        const changed = new Set(r.parameters.map((x) => x.path));
        for (const f of PARAMETER_FIELDS) expect(changed.has(f.path), f.path).to.equal(canonical(at(a, f.path)) !== canonical(at(b, f.path)));
        for (const x of r.parameters) {
          expect(x.before).to.not.equal(x.after);
          expect(`${x.before} ${x.after}`).to.not.match(/\bNaN\b|undefined|\[object /);
        }
        for (const t of r.texts) {
          const field = TEXT_FIELDS.find((f) => f.path === t.path)!;
          const before = field.path === 'title' ? ta.slice(0, 20) : String(at(withText(a, ta), field.path) ?? '');
          const after = field.path === 'title' ? tb.slice(0, 20) : String(at(withText(b, tb), field.path) ?? '');
          expect(side(t.parts, 'before')).to.equal(before);
          expect(side(t.parts, 'after')).to.equal(after);
        }
        expect(r.texts.some((t) => t.path === 'instructionsMd')).to.equal(ta !== tb);
      }),
      { numRuns: RUNS_HEAVY },
    );
  });

  it('is symmetric: swapping the versions swaps before and after', () => {
    fc.assert(
      fc.property(validContent, validContent, pref, (a, b, p) => {
        const ab = compareVersions(version(1, a), version(2, b), names, p);
        const ba = compareVersions(version(2, b), version(1, a), names, p);
        expect(ba.parameters).to.deep.equal(ab.parameters.map((x) => ({ ...x, before: x.after, after: x.before })));
      }),
      { numRuns: RUNS_HEAVY },
    );
  });

  it('never throws on stored content of any shape (an older schema, odd primitive leaves, not an object at all)', () => {
    const anyContent = fc.oneof(
      halfTypedPrimitiveContent as fc.Arbitrary<unknown>,
      outsidePrimitive,
      fc.jsonValue({ maxDepth: 3 }),
      fc.dictionary(
        fc.constantFrom('scope', 'cutting', 'clamping', 'coolant', 'instructionsMd', 'extra'),
        fc.oneof(outsidePrimitive, fc.jsonValue({ maxDepth: 2 })),
        { noNullPrototype: true },
      ),
    );
    fc.assert(
      fc.property(anyContent, anyContent, fc.oneof(fc.string(), oddText), pref, (a, b, title, p) => {
        compareVersions(version(1, a as RecipeContent, title), version(2, b as RecipeContent), names, p);
        contentLeafPaths(a);
      }),
      { numRuns: RUNS_HEAVY },
    );
  });

  // A leaf that is an object with its own "toString" or "valueOf" key that is not a function
  // (e.g. instructionsMd = {"toString": null}) once made compareVersions throw "Cannot
  // convert object to primitive value"; only a hand-edited or corrupted row could hold one.
  it('never throws on stored content whose leaves are JSON objects with a "toString" or "valueOf" key', () => {
    fc.assert(
      fc.property(halfTypedContent, halfTypedContent, pref, (a, b, p) => {
        compareVersions(version(1, a), version(2, b), names, p);
      }),
      { numRuns: RUNS_HEAVY },
    );
  });
});
