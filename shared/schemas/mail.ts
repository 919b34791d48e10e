import { z } from 'zod';
import { idParam, newPassword } from './fields';

/** Machines an operator runs (their acknowledgements and the finder's default machine): ids of existing machines, each once. */
export const machineIdList = z
  .array(idParam, { error: 'Machines must be a list of machine ids.' })
  .max(100, 'At most 100 machines.')
  .refine((ids) => new Set(ids).size === ids.length, 'Each machine may appear only once.');

/** A required, real e-mail address (invitations and resets go there). */
export const requiredEmail = z
  .string({ error: 'E-mail is required.' })
  .trim()
  .min(1, 'E-mail is required.')
  .max(200, 'E-mail must be at most 200 characters.')
  .pipe(z.email('Enter a valid e-mail address.'));

/** POST /api/password/forgot — the same answer whether or not the address is known. */
export const forgotPasswordBody = z.strictObject({ email: requiredEmail });
export type ForgotPasswordBody = z.infer<typeof forgotPasswordBody>;

/** A single-use link's token: 43 base64url characters (32 random bytes). */
export const linkToken = z
  .string({ error: 'The link is incomplete.' })
  .trim()
  .regex(/^[A-Za-z0-9_-]{43}$/, 'This link is not valid. Copy the whole link from the mail, or ask for a new one.');

/** POST /api/password/link — what a link is for, before the person types a password. */
export const linkTokenBody = z.strictObject({ token: linkToken });
export type LinkTokenBody = z.infer<typeof linkTokenBody>;

/** POST /api/password/set — use an invitation or reset link to set a password. */
export const setPasswordBody = z.strictObject({ token: linkToken, newPassword });
export type SetPasswordBody = z.infer<typeof setPasswordBody>;

/** Why the request to acknowledge a new version has no off switch. */
export const MANDATORY_KIND_MESSAGE =
  'The mail asking you to acknowledge a new version in use on your machine cannot be turned off: operators must hear of every change to their recipes.';

/**
 * PATCH /api/session/notifications — turn optional mails on or off; absent kinds stay as
 * they are. The mandatory kind is named so that sending it gets its own reason, not
 * "unknown key".
 */
const onOff = (kind: string) => z.boolean({ error: `"${kind}" must be true or false.` }).optional();
export const notificationPreferencesBody = z
  .strictObject({
    'review-requested': onOff('review-requested'),
    'review-outcome': onOff('review-outcome'),
    'review-due': onOff('review-due'),
    'cut-flagged': onOff('cut-flagged'),
    'version-current': z.never({ error: MANDATORY_KIND_MESSAGE }).optional().describe('Cannot be sent: this mail cannot be turned off.'),
  })
  .refine((b) => Object.values(b).some((v) => v !== undefined), 'Nothing to change.');
export type NotificationPreferencesBody = z.infer<typeof notificationPreferencesBody>;
