import type { Role } from '@shared/roles';

/** Someone who only runs the saws: their work starts at the Finder, not at lists they have no part in. */
export function isOnlyOperator(roles: readonly Role[]): boolean {
  return roles.length > 0 && roles.every((r) => r === 'operator');
}

/** Where a person lands after sign-in when no page was asked for. */
export function homePage(roles: readonly Role[]): string {
  return isOnlyOperator(roles) ? '/finder' : '/today';
}
