import { expect } from 'chai';
import fc from 'fast-check';
import { z } from 'zod';
import * as fields from '../../../../shared/schemas/fields';
import * as mail from '../../../../shared/schemas/mail';
import { quantity } from '../../../../shared/schemas/numbers';
import * as numbers from '../../../../shared/schemas/numbers';
import * as operator from '../../../../shared/schemas/operator';
import * as recipe from '../../../../shared/schemas/recipe';
import * as session from '../../../../shared/schemas/session';
import * as stock from '../../../../shared/schemas/stock';
import * as users from '../../../../shared/schemas/users';
import * as workflow from '../../../../shared/schemas/workflow';
import { toFieldErrors } from '../../../../shared/validation';
import { anyValue, finite, oddNumber, oddText, outsideValue, RUNS, RUNS_HEAVY, validContent, validMachine, validMaterial, validWheel } from './arbitraries';

/** Every zod schema exported from shared/schemas, by "file.name". */
const SCHEMAS: [string, z.ZodType][] = Object.entries({ fields, mail, numbers, operator, recipe, session, stock, users, workflow }).flatMap(([file, mod]) =>
  Object.entries(mod)
    .filter((e): e is [string, z.ZodType] => e[1] instanceof z.ZodType)
    .map(([name, schema]) => [`${file}.${name}`, schema] as [string, z.ZodType]),
);

/** Values shaped like the schema's own object (its keys with hostile values), so the checks past the type test run too. */
function shapedLike(schema: z.ZodType): fc.Arbitrary<unknown> {
  const shape = (schema as unknown as { shape?: Record<string, unknown> }).shape;
  if (!shape) return anyValue;
  return fc.record(Object.fromEntries(Object.keys(shape).map((k) => [k, fc.oneof(outsideValue, anyValue)])), { requiredKeys: [] });
}

/** A stored record as the body its form posts (no id, archive state or timestamp). */
const body = <T extends { id: number; archived: boolean; updatedAt: string }>({ id: _id, archived: _a, updatedAt: _u, ...rest }: T) => rest;

describe('shared/schemas (properties)', () => {
  it('finds the schemas to test (guards against an empty list)', () => {
    expect(SCHEMAS.length).to.be.above(40);
  });

  for (const [name, schema] of SCHEMAS) {
    // parse() documents one throw: a ZodError for a refused value; nothing else may escape.
    it(`${name}: safeParse never throws on any value, parse throws only a ZodError, and a refusal gives a field path and a message in words`, () => {
      fc.assert(
        fc.property(fc.oneof(anyValue, outsideValue, shapedLike(schema)), (v) => {
          const r = schema.safeParse(v);
          try {
            schema.parse(v);
            expect(r.success).to.equal(true);
          } catch (e) {
            expect(e).to.be.instanceOf(z.ZodError);
            expect(r.success).to.equal(false);
          }
          if (r.success) return;
          expect(r.error.issues.length).to.be.above(0);
          for (const e of toFieldErrors(r.error)) {
            expect(e.path).to.be.a('string');
            expect(e.message).to.be.a('string').and.not.equal('');
          }
        }),
        { numRuns: 120 },
      );
    });
  }

  it('parsing is idempotent: what a schema gives back, it accepts again unchanged', () => {
    fc.assert(
      fc.property(fc.constantFrom(...SCHEMAS), fc.oneof(oddText, fc.string({ maxLength: 50 }), outsideValue), ([name, schema], v) => {
        const once = schema.safeParse(v);
        if (!once.success) return;
        const twice = schema.safeParse(once.data);
        expect(twice.success, name).to.equal(true);
        if (twice.success) expect(twice.data, name).to.deep.equal(once.data);
      }),
      { numRuns: RUNS },
    );
  });

  it('accepts every valid recipe content, wheel, machine and material the generators build (and only with known keys)', () => {
    fc.assert(
      fc.property(validContent, validWheel, validMachine, validMaterial, oddText, (c, w, m, mat, extraKey) => {
        const parsed = recipe.recipeContent.safeParse(c);
        expect(parsed.success, JSON.stringify(!parsed.success && parsed.error.issues)).to.equal(true);
        expect(stock.wheelBody.safeParse(body(w)).success).to.equal(true);
        expect(stock.machineBody.safeParse(body(m)).success).to.equal(true);
        expect(stock.materialBody.safeParse(body(mat)).success).to.equal(true);
        if (!(extraKey in c)) expect(recipe.recipeContent.safeParse({ ...c, [extraKey]: 1 }).success).to.equal(false);
      }),
      { numRuns: RUNS_HEAVY },
    );
  });

  it('a quantity accepts exactly the finite numbers in its window and names the unit when it refuses', () => {
    fc.assert(
      fc.property(finite(-1e6, 1e6), finite(0, 1e6), fc.oneof(fc.double(), oddNumber, outsideValue), fc.boolean(), (min, span, v, inclusiveMin) => {
        const max = min + span;
        const q = quantity('Feed', 'mm/s', min, max, { inclusiveMin });
        const r = q.safeParse(v);
        const inside = typeof v === 'number' && Number.isFinite(v) && (inclusiveMin ? v >= min : v > min) && v <= max;
        expect(r.success, fc.stringify(v)).to.equal(inside);
        if (!r.success) expect(r.error.issues[0]!.message).to.match(/^Feed /);
      }),
      { numRuns: RUNS },
    );
  });

  // zod counts code points, as MariaDB's utf8mb4 columns do (an astral character is one).
  it('text fields trim and cap: any text within the cap (in code points) after trimming is accepted as trimmed', () => {
    fc.assert(
      fc.property(fc.oneof(oddText, fc.string({ maxLength: 60 })), fc.integer({ min: 1, max: 50 }), (s, max) => {
        const r = numbers.text('Note', max).safeParse(s);
        expect(r.success, JSON.stringify(s)).to.equal([...s.trim()].length <= max);
        if (r.success) expect(r.data).to.equal(s.trim());
      }),
      { numRuns: RUNS },
    );
  });
});
