/** Kerfbook's five roles. A user may hold several. */
export const ROLES = ['author', 'approver', 'operator', 'auditor', 'admin'] as const;

export type Role = (typeof ROLES)[number];

/** Plain-words label and one-line description shown in the People screen. */
export const ROLE_INFO: Record<Role, { label: string; description: string }> = {
  author: { label: 'Author', description: 'Writes and edits draft recipes; manages materials, wheels and machines.' },
  approver: { label: 'Approver', description: 'Reviews recipes, returns them with comments or approves them with a signature.' },
  operator: { label: 'Operator', description: 'Finds approved recipes, prints bench sheets, logs cuts.' },
  auditor: { label: 'Auditor', description: 'Reads everything and the trail; changes nothing.' },
  admin: { label: 'Admin', description: 'Manages people, roles and lab settings; no approval power by itself.' },
};

/**
 * Who may call a route or open a screen: `public` (no sign-in), `signedIn` (any active user)
 * or a list of roles, any one of which is enough.
 */
export type Access = 'public' | 'signedIn' | readonly Role[];

export function hasAccess(userRoles: readonly Role[] | null | undefined, access: Access): boolean {
  if (access === 'public') return true;
  if (!userRoles) return false;
  if (access === 'signedIn') return true;
  return access.some((r) => userRoles.includes(r));
}
