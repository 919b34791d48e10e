import { z } from 'zod';

/**
 * Sign-in names: 3–40 ASCII letters, digits, dot, dash or underscore, stored lower-case.
 * ASCII only so that look-alike Unicode letters cannot make two accounts that read the same.
 */
export const username = z
  .string({ error: 'Username is required.' })
  .trim()
  .min(3, 'Username must be at least 3 characters.')
  .max(40, 'Username must be at most 40 characters.')
  .regex(/^[A-Za-z0-9._-]+$/, 'Username may only use the letters a–z, digits, dot, dash and underscore.')
  .transform((s) => s.toLowerCase());

/** Password limits: long enough to resist guessing, short enough to bound the hashing cost. */
export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 200;

/** A new password. Any Unicode is allowed; it is normalised to NFC before hashing. */
export const newPassword = z
  .string({ error: 'Password is required.' })
  .min(PASSWORD_MIN, `Password must be at least ${PASSWORD_MIN} characters.`)
  .max(PASSWORD_MAX, `Password must be at most ${PASSWORD_MAX} characters.`)
  .refine((s) => s.trim().length > 0, 'Password cannot be only spaces.');

/** A password typed to prove who you are (sign-in, re-entry): no length rule beyond the cap. */
export const enteredPassword = z
  .string({ error: 'Password is required.' })
  .min(1, 'Password is required.')
  .max(PASSWORD_MAX, `Password must be at most ${PASSWORD_MAX} characters.`);

/** A person's printed name, as shown on signatures and sheets. */
export const displayName = z.string({ error: 'Name is required.' }).trim().min(1, 'Name is required.').max(100, 'Name must be at most 100 characters.');

export const email = z
  .string()
  .trim()
  .max(200, 'E-mail must be at most 200 characters.')
  .pipe(z.union([z.literal(''), z.email('Enter a valid e-mail address.')]));

/** Positive integer id from a route parameter or query string. */
export const idParam = z.coerce.number({ error: 'Must be a number.' }).int('Must be a whole number.').positive('Must be a positive number.');
