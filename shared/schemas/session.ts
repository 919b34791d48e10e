import { z } from 'zod';
import { enteredPassword, newPassword, username } from './fields';

/** POST /api/session — sign in. */
export const signInBody = z.strictObject({
  username: z.string({ error: 'Username is required.' }).trim().min(1, 'Username is required.').max(40, 'Username must be at most 40 characters.'),
  password: enteredPassword,
});
export type SignInBody = z.infer<typeof signInBody>;

/** POST /api/session/password — change one's own password. */
export const changePasswordBody = z
  .strictObject({
    currentPassword: enteredPassword,
    newPassword,
  })
  .refine((b) => b.currentPassword !== b.newPassword, {
    path: ['newPassword'],
    message: 'The new password must differ from the current one.',
  });
export type ChangePasswordBody = z.infer<typeof changePasswordBody>;

/** PATCH /api/session/preferences — the signed-in user's own settings. */
export const preferencesBody = z.strictObject({
  units: z.enum(['metric', 'metric+imperial'], { error: 'Units must be "metric" or "metric+imperial".' }),
});
export type PreferencesBody = z.infer<typeof preferencesBody>;

export { username };
