import { expect } from 'chai';
import fc from 'fast-check';
import { hardnessWindow as hardnessWindowSchema } from '../../../../shared/schemas/stock';
import type { HardnessValue } from '../../../../shared/schemas/stock';
import type { SelectionRow, WheelRecord } from '../../../../shared/stock-types';
import { matchesStarterWheel, STARTER_SELECTION, suggestWheels } from '../../../../shared/wheel-suggestion';
import { WHEEL_KINDS } from '../../../../shared/vocabulary';
import { above, anyNumber, group, hardnessWindow, oddText, orNull, outsidePrimitive, RUNS, scale, validMarking, validWheel } from './arbitraries';

/** A lab's stock (ids 1–8) and selection table pointing at those ids and a few unknown ones. */
const stock: fc.Arbitrary<WheelRecord[]> = fc.array(validWheel, { maxLength: 8 }).map((ws) => ws.map((w, i) => ({ ...w, id: i + 1 })));
const rows: fc.Arbitrary<SelectionRow[]> = fc
  .array(fc.record({ group, hardness: orNull(hardnessWindow), wheelId: fc.integer({ min: 1, max: 10 }), note: fc.string({ maxLength: 20 }) }), {
    maxLength: 12,
  })
  .map((rs) => rs.map((r, i) => ({ ...r, id: i + 1 })));
const hardness: fc.Arbitrary<HardnessValue | null> = orNull(fc.record({ value: above(0, 3000), scale }));

describe('shared/wheel-suggestion (properties)', () => {
  it('offers only stocked, non-archived wheels of rows for the group, each once, with a reason', () => {
    fc.assert(
      fc.property(group, hardness, rows, stock, (g, h, rs, ws) => {
        const out = suggestWheels(g, h, rs, ws);
        const ids = out.map((s) => s.wheel.id);
        expect(new Set(ids).size).to.equal(ids.length);
        for (const s of out) {
          expect(ws).to.include(s.wheel);
          expect(s.wheel.archived).to.equal(false);
          expect(s.row.group).to.equal(g);
          expect(s.row.wheelId).to.equal(s.wheel.id);
          expect(s.reason)
            .to.be.a('string')
            .and.not.match(/NaN|undefined|Infinity/);
        }
      }),
      { numRuns: RUNS },
    );
  });

  it("a band on the hardness's own scale is offered only when it contains the hardness; banded matches come before group-wide rows", () => {
    fc.assert(
      fc.property(group, fc.record({ value: above(0, 3000), scale }), rows, stock, (g, h, rs, ws) => {
        const out = suggestWheels(g, h, rs, ws);
        for (const s of out) {
          const band = s.row.hardness;
          if (band && band.scale === h.scale) expect(h.value).to.be.within(band.min, band.max);
        }
        const firstWide = out.findIndex((s) => s.row.hardness === null);
        if (firstWide >= 0) for (const s of out.slice(firstWide)) expect(s.row.hardness).to.equal(null);
      }),
      { numRuns: RUNS },
    );
  });

  it('without a hardness, group-wide rows come first and banded ones are marked unconfirmed', () => {
    fc.assert(
      fc.property(group, rows, stock, (g, rs, ws) => {
        const out = suggestWheels(g, null, rs, ws);
        const firstBanded = out.findIndex((s) => s.row.hardness !== null);
        if (firstBanded >= 0) for (const s of out.slice(firstBanded)) expect(s.reason).to.contain('not confirmed');
      }),
      { numRuns: RUNS },
    );
  });

  it('never throws on an odd hardness (NaN, ∞, negative, a string) or odd band bounds', () => {
    const oddHardness = fc.record({ value: fc.oneof(anyNumber, outsidePrimitive), scale: fc.oneof(scale, outsidePrimitive) });
    const oddRows = fc.array(
      fc.record({
        id: fc.nat(),
        group,
        hardness: orNull(fc.record({ min: anyNumber, max: anyNumber, scale })),
        wheelId: fc.integer({ min: 1, max: 10 }),
        note: oddText,
      }),
      { maxLength: 6 },
    );
    fc.assert(
      fc.property(group, oddHardness, oddRows, stock, (g, h, rs, ws) => {
        suggestWheels(g, h as HardnessValue, rs, ws);
      }),
      { numRuns: RUNS },
    );
  });

  it("the starter table's bands are valid windows, and a stocked wheel matches a starter row only with its kind and abrasive", () => {
    for (const row of STARTER_SELECTION) if (row.hardness) expect(hardnessWindowSchema.safeParse(row.hardness).success).to.equal(true);
    fc.assert(
      fc.property(fc.constantFrom(...STARTER_SELECTION), fc.constantFrom(...WHEEL_KINDS), fc.oneof(validMarking, oddText), (row, kind, specification) => {
        const match = matchesStarterWheel(row.wheel, { kind, specification });
        if (match) expect(kind).to.equal(row.wheel.kind);
        if (kind !== row.wheel.kind) expect(match).to.equal(false);
      }),
      { numRuns: RUNS },
    );
  });
});
