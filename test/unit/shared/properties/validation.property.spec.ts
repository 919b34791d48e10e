import { expect } from 'chai';
import fc from 'fast-check';
import { recipeContent } from '../../../../shared/schemas/recipe';
import { toFieldErrors } from '../../../../shared/validation';
import { halfTypedContent, RUNS_HEAVY } from './arbitraries';

describe('shared/validation (properties)', () => {
  it('gives one {path, message} per zod issue, the path dotted and the message in words', () => {
    fc.assert(
      fc.property(halfTypedContent, (c) => {
        const r = recipeContent.safeParse(c);
        if (r.success) return;
        const errors = toFieldErrors(r.error);
        expect(errors).to.have.length(r.error.issues.length);
        errors.forEach((e, i) => {
          expect(e.path).to.equal(r.error.issues[i]!.path.map(String).join('.'));
          expect(e.path).to.not.match(/^\.|\.$|\.\./);
          expect(e.message).to.be.a('string').and.not.equal('');
        });
      }),
      { numRuns: RUNS_HEAVY },
    );
  });
});
