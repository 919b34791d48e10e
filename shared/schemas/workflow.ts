/**
 * Review and approval: the bodies of the state transitions. Every
 * transition carries the revision the person saw, so acting on a version that changed
 * since the page was opened is refused.
 */
import { z } from 'zod';
import { enteredPassword } from './fields';
import { requiredText, text } from './numbers';
import { TRAIL_FAMILIES } from '../vocabulary';

const revision = z.number({ error: 'Revision is required.' }).int().min(0);

/**
 * The signer's username, the first of the two signature components. The first signing in a
 * continuous session needs it with the password; later ones in the same session may leave it
 * out (21 CFR 11.200(a)(1)(i)–(ii)).
 */
const signerUsername = z.string({ error: 'Username must be text.' }).trim().max(40, 'Username must be at most 40 characters.').optional();

/** YYYY-MM-DD (UTC calendar date). */
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2027-01-31.');

/** POST …/versions/:n/submit — author sends the draft for review. */
export const submitBody = z.strictObject({ revision });
export type SubmitBody = z.infer<typeof submitBody>;

/** POST …/versions/:n/return — approver sends it back with comments. */
export const returnBody = z.strictObject({
  revision,
  comment: requiredText('Comment', 4000),
});
export type ReturnBody = z.infer<typeof returnBody>;

/** The meanings a signature can carry (21 CFR 11.50: the meaning is shown with the signature). */
export const SIGNATURE_MEANINGS = ['approved', 'withdrawn'] as const;
export type SignatureMeaning = (typeof SIGNATURE_MEANINGS)[number];

/** POST …/versions/:n/approve — electronic signature: (username and) password again, meaning, optional comment. */
export const approveBody = z.strictObject({
  revision,
  username: signerUsername,
  password: enteredPassword,
  meaning: z.literal('approved', { error: 'The meaning of this signature is "approved".' }),
  comment: text('Comment', 2000).default(''),
  /** Ids of every warning-level check, each acknowledged by the approver. */
  acknowledgedWarnings: z.array(z.string().max(80)).max(100).default([]),
  /** The day the version becomes current; today when omitted. Never in the past. */
  effectiveDate: isoDate.optional(),
});
export type ApproveBody = z.infer<typeof approveBody>;

/** POST …/versions/:n/withdraw — an approved version taken out of use, signed. */
export const withdrawBody = z.strictObject({
  revision,
  username: signerUsername,
  password: enteredPassword,
  meaning: z.literal('withdrawn', { error: 'The meaning of this signature is "withdrawn".' }),
  reason: requiredText('Reason', 2000),
});
export type WithdrawBody = z.infer<typeof withdrawBody>;

/** POST /api/recipes/:id/versions — a new draft from the current approved version. */
export const newVersionBody = z.strictObject({
  fromVersion: z.number().int().positive(),
  changeReason: requiredText('Change reason', 1000),
});
export type NewVersionBody = z.infer<typeof newVersionBody>;

/** POST …/versions/:n/comments — a review comment, optionally on one field. */
export const commentBody = z.strictObject({
  body: requiredText('Comment', 4000),
  /** Content path the comment is about, e.g. "cutting.feedMmS"; empty for the whole version. */
  path: text('Field', 120).default(''),
});
export type CommentBody = z.infer<typeof commentBody>;

/** GET /api/recipes/:id/compare */
export const compareQuery = z.strictObject({
  from: z.coerce.number().int().positive(),
  to: z.coerce.number().int().positive(),
});
export type CompareQuery = z.infer<typeof compareQuery>;

/** GET /api/trail and /api/trail.csv — keyset pagination by id, newest first. */
export const trailQuery = z.strictObject({
  recipeId: z.coerce.number().int().positive().optional(),
  userId: z.coerce.number().int().positive().optional(),
  type: z.string().trim().max(60).optional(),
  /** A family of event types (recipes, signatures, stock, people, sign-ins, …). */
  family: z.enum(TRAIL_FAMILIES, { error: `Choose one of: ${TRAIL_FAMILIES.join(', ')}.` }).optional(),
  /** "true" leaves sign-ins, sign-outs and refused sign-ins out. */
  hideSignIns: z.enum(['true', 'false'], { error: 'Use true or false.' }).optional(),
  /** Inclusive UTC dates. */
  from: isoDate.optional(),
  to: isoDate.optional(),
  /** Return events with an id below this one (the previous page's `nextBefore`). */
  before: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type TrailQuery = z.infer<typeof trailQuery>;
