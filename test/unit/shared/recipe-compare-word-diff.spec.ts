import { expect } from 'chai';
import { wordDiff } from '../../../shared/recipe-compare';

const side = (parts: ReturnType<typeof wordDiff>, which: 'before' | 'after') =>
  parts
    .filter((p) => (which === 'before' ? !p.added : !p.removed))
    .map((p) => p.value)
    .join('');

describe('wordDiff (line blocks first, then words)', () => {
  it('rebuilds both texts and marks only the changed words of long multi-line text', () => {
    const lines = Array.from({ length: 300 }, (_, i) => `${i + 1}. Keep the feed steady through section ${i + 1}.`);
    const before = lines.join('\n');
    const after = lines.map((l, i) => (i % 5 === 4 ? l.replace('steady', 'slow') : l)).join('\n') + '\nNew last line.';
    const parts = wordDiff(before, after);
    expect(side(parts, 'before')).to.equal(before);
    expect(side(parts, 'after')).to.equal(after);
    const removed = parts.filter((p) => p.removed).map((p) => p.value.trim());
    expect(removed).to.have.length(60);
    expect(new Set(removed)).to.deep.equal(new Set(['steady']));
  });

  it('answers one unchanged part for equal texts and words for a one-line change', () => {
    expect(wordDiff('same text', 'same text')).to.deep.equal([{ value: 'same text' }]);
    expect(wordDiff('cut at 3000 rpm', 'cut at 2800 rpm')).to.deep.equal([
      { value: 'cut at ' },
      { value: '3000', removed: true },
      { value: '2800', added: true },
      { value: ' rpm' },
    ]);
  });
});
