/**
 * The operator station: the finder's query, check codes and cut records.
 */
import { z } from 'zod';
import { CUT_OUTCOMES, SHAPES } from '../vocabulary';
import { requiredText, text } from './numbers';
import { hardnessScale, materialGroup } from './stock';

/** GET /api/finder — what the operator has in hand. Every field optional; more fields, better matches. */
export const finderQuery = z.strictObject({
  materialId: z.coerce.number().int().positive().optional(),
  group: materialGroup.optional(),
  hardnessValue: z.coerce.number().positive('Hardness must be more than 0.').max(3000).optional(),
  hardnessScale: hardnessScale.optional(),
  shape: z.enum(SHAPES).optional(),
  /** The part's size across the cut, mm. */
  sizeMm: z.coerce.number().positive('Size must be more than 0 mm.').max(2000, 'Size must be at most 2000 mm.').optional(),
  machineId: z.coerce.number().int().positive().optional(),
});
export type FinderQuery = z.infer<typeof finderQuery>;

/** A check code as printed on a sheet: 8 characters of Crockford base32 (no I, L, O, U), grouped 4-4. */
export const CHECK_CODE_PATTERN = /^[0-9A-HJKMNP-TV-Z]{4}-?[0-9A-HJKMNP-TV-Z]{4}$/;

export const checkCodeParam = z
  .string()
  .trim()
  .toUpperCase()
  .regex(CHECK_CODE_PATTERN, 'A check code has 8 letters and digits, like 7KQ2-M9XD.')
  .transform((c) => c.replace('-', ''));

/** POST /api/recipes/:id/versions/:n/cuts — one cut against the exact version used. */
export const cutRecordBody = z.strictObject({
  specimenId: requiredText('Specimen id', 60),
  /** Part, lot or heat number. */
  partRef: text('Part / lot / heat', 120).default(''),
  quantity: z
    .number({ error: 'Quantity must be a whole number.' })
    .int('Quantity must be a whole number.')
    .min(1, 'At least 1.')
    .max(1000, 'At most 1000.')
    .default(1),
  outcome: z.enum(CUT_OUTCOMES, { error: 'Choose the outcome of the cut.' }),
  notes: text('Notes', 2000).default(''),
});
export type CutRecordBody = z.infer<typeof cutRecordBody>;

/** GET /api/cuts — find cuts by specimen id (traceability: specimen → version and parameters). */
export const cutSearchQuery = z.strictObject({
  specimenId: requiredText('Specimen id', 60),
});
