import { expect } from 'chai';
import { wordDiff } from '../../../../../shared/recipe-compare';
import { keptWordDiff } from '../../../../../server/services/recipes/text-diff-memo';

/** Numbered steps; `variant` rewords every third (as a reviewer's edit would). */
const steps = (variant: number, n = 60) =>
  Array.from({ length: n }, (_, i) =>
    variant && i % 3 === 0 ? `${i + 1}. Stop the feed after ${i * 2} mm (v${variant}).` : `${i + 1}. Keep the feed steady through section ${i + 1}.`,
  ).join('\n');

describe('Kept word diffs', () => {
  it('gives exactly what wordDiff gives, the first time and later', () => {
    const before = steps(0);
    const after = steps(1);
    const fresh = wordDiff(before, after);
    expect(keptWordDiff(before, after)).to.deep.equal(fresh);
    expect(keptWordDiff(before, after)).to.deep.equal(fresh);
    // And both sides rebuild from the parts: unchanged + removed = before, unchanged + added = after.
    const parts = keptWordDiff(before, after);
    expect(
      parts
        .filter((p) => !p.added)
        .map((p) => p.value)
        .join(''),
    ).to.equal(before);
    expect(
      parts
        .filter((p) => !p.removed)
        .map((p) => p.value)
        .join(''),
    ).to.equal(after);
  });

  it('answers a repeated pair from the kept result, which no caller can change', () => {
    const before = steps(0, 80);
    const after = steps(2, 80);
    const first = keptWordDiff(before, after);
    expect(keptWordDiff(before, after)).to.equal(first);
    expect(Object.isFrozen(first)).to.equal(true);
    const original = first[0]!.value;
    try {
      (first[0] as { value: string }).value = 'changed';
    } catch {
      // Strict mode throws; either way the kept part must stay as it was.
    }
    expect(keptWordDiff(before, after)[0]!.value).to.equal(original);
  });

  it('keeps pairs apart: swapped sides, a moved boundary and another edit each get their own diff', () => {
    const a = steps(0);
    const b = steps(1);
    expect(keptWordDiff(b, a)).to.deep.equal(wordDiff(b, a));
    expect(keptWordDiff(a, b)).to.not.deep.equal(keptWordDiff(b, a));
    // The same characters split differently between the two sides are another pair.
    expect(keptWordDiff(`${a}x`, b)).to.deep.equal(wordDiff(`${a}x`, b));
    expect(keptWordDiff(a, `x${b}`)).to.deep.equal(wordDiff(a, `x${b}`));
    expect(keptWordDiff(a, steps(3))).to.deep.equal(wordDiff(a, steps(3)));
  });

  it('diffs short texts afresh without keeping them', () => {
    const first = keptWordDiff('feed 0.3 mm/s', 'feed 0.2 mm/s');
    expect(first).to.deep.equal(wordDiff('feed 0.3 mm/s', 'feed 0.2 mm/s'));
    expect(keptWordDiff('feed 0.3 mm/s', 'feed 0.2 mm/s')).to.not.equal(first);
  });
});
