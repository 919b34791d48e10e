import { z } from 'zod';
import { ROLES } from '../roles';
import { displayName, email, newPassword, username } from './fields';
import { machineIdList, requiredEmail } from './mail';

export const role = z.enum(ROLES, { error: `Role must be one of: ${ROLES.join(', ')}.` });

const roleList = z
  .array(role, { error: 'Roles must be a list.' })
  .max(ROLES.length)
  .refine((rs) => new Set(rs).size === rs.length, 'Each role may appear only once.');

/** POST /api/users — an admin creates a person with a temporary password. */
export const createUserBody = z.strictObject({
  username,
  displayName,
  email: email.optional().default(''),
  roles: roleList,
  temporaryPassword: newPassword,
  /** Machines an operator runs: their acknowledgements and the finder's default machine. */
  machineIds: machineIdList.optional().default([]),
});
export type CreateUserBody = z.infer<typeof createUserBody>;

/** POST /api/users/invitations — an admin invites a person by e-mail; they set their own password (72 h link). */
export const inviteBody = z.strictObject({
  username,
  displayName,
  email: requiredEmail,
  roles: roleList,
  machineIds: machineIdList.optional().default([]),
});
export type InviteBody = z.infer<typeof inviteBody>;

/** PATCH /api/users/:id — change name, e-mail or roles. */
export const updateUserBody = z
  .strictObject({
    displayName: displayName.optional(),
    email: email.optional(),
    roles: roleList.optional(),
    machineIds: machineIdList.optional(),
  })
  .refine((b) => Object.keys(b).length > 0, 'Nothing to change.');
export type UpdateUserBody = z.infer<typeof updateUserBody>;

/** POST /api/users/:id/temporary-password — the person must change it at next sign-in. */
export const temporaryPasswordBody = z.strictObject({ password: newPassword });
export type TemporaryPasswordBody = z.infer<typeof temporaryPasswordBody>;

export const USER_SORT_FIELDS = ['username', 'displayName', 'createdAt', 'lastSignInAt'] as const;

/** GET /api/users — table query: paging, sort, filters. */
export const userListQuery = z.strictObject({
  page: z.coerce.number().int().min(0, 'Page must be 0 or more.').default(0),
  pageSize: z.coerce.number().int().min(1).max(100, 'Page size must be at most 100.').default(25),
  sort: z.enum(USER_SORT_FIELDS).default('username'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  q: z.string().trim().max(100, 'Search text must be at most 100 characters.').optional(),
  role: role.optional(),
  status: z.enum(['active', 'inactive', 'all']).default('all'),
});
export type UserListQuery = z.infer<typeof userListQuery>;
