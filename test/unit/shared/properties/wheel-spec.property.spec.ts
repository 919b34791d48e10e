import { expect } from 'chai';
import fc from 'fast-check';
import { abrasiveFamily, gradeBand, parseWheelSpec } from '../../../../shared/wheel-spec';
import { oddText, outsideValue, RUNS, validMarking } from './arbitraries';

const LETTERS = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ';
/** Strings near the marking grammar: its letters and digits, spaces and hyphens, in any order. */
const nearMarking = fc.string({ unit: fc.constantFrom(...'ABCDGMNRSVabcd0123456789 -'.split('')), maxLength: 14 });

/** The marking as a person might type it: lower case, spaces and hyphens between the parts. */
const typed = (marking: string) =>
  fc
    .tuple(fc.array(fc.constantFrom('', ' ', '-', ' - ', '\t'), { minLength: marking.length + 1, maxLength: marking.length + 1 }), fc.boolean())
    .map(([seps, lower]) => {
      const s = seps.map((sep, i) => sep + (marking[i] ?? '')).join('');
      return lower ? s.toLowerCase() : s;
    });

describe('shared/wheel-spec (properties)', () => {
  it('every marking of the grammar parses, and its normalised text parses to the same specification', () => {
    fc.assert(
      fc.property(validMarking, (m) => {
        const r = parseWheelSpec(m);
        expect(r.ok, `${m}: ${!r.ok && r.error}`).to.equal(true);
        if (!r.ok) return;
        expect(parseWheelSpec(r.spec.text)).to.deep.equal(r);
        expect(Number.isInteger(r.spec.grit) && r.spec.grit >= 0).to.equal(true);
        expect(abrasiveFamily(m)).to.equal(abrasiveFamily(r.spec));
      }),
      { numRuns: RUNS },
    );
  });

  it('spaces, hyphens and lower case do not change what a marking means', () => {
    fc.assert(
      fc.property(
        validMarking.chain((m) => fc.tuple(fc.constant(m), typed(m))),
        ([m, t]) => {
          expect(parseWheelSpec(t)).to.deep.equal(parseWheelSpec(m));
        },
      ),
      { numRuns: RUNS },
    );
  });

  it('any text gives a specification or a message in words, and the family follows the parse', () => {
    fc.assert(
      fc.property(fc.oneof(oddText, nearMarking), (s) => {
        const r = parseWheelSpec(s);
        if (r.ok) {
          expect(r.spec.text).to.match(/^[A-Z0-9]+$/);
          expect(abrasiveFamily(s)).to.be.a('string');
        } else {
          expect(r.error).to.be.a('string').and.have.length.above(10);
          expect(abrasiveFamily(s)).to.equal(null);
        }
      }),
      { numRuns: RUNS },
    );
  });

  it('refuses a value that is not text with a message, rather than throwing', () => {
    fc.assert(
      fc.property(
        outsideValue.filter((v) => typeof v !== 'string'),
        (v) => {
          const r = parseWheelSpec(v as string);
          expect(r.ok).to.equal(false);
          if (!r.ok) expect(r.error).to.be.a('string').and.not.equal('');
        },
      ),
      { numRuns: RUNS },
    );
  });

  it('grade bands follow the alphabet: soft, then medium, then hard', () => {
    const order = { soft: 0, medium: 1, hard: 2 } as const;
    fc.assert(
      fc.property(fc.constantFrom(...LETTERS), fc.constantFrom(...LETTERS), (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(order[gradeBand(lo)]).to.be.at.most(order[gradeBand(hi)]);
      }),
      { numRuns: RUNS },
    );
  });
});
