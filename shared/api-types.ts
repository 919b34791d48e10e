import type { Role } from './roles';

/** Unit display preference; stored values are always metric (design 5.10). */
export type UnitPreference = 'metric' | 'metric+imperial';

/** A person as the People screen and the session see them. Never carries the password hash. */
export interface UserDto {
  id: number;
  username: string;
  displayName: string;
  email: string;
  roles: Role[];
  active: boolean;
  /** True when an admin set a temporary password that must be changed at the next sign-in. */
  mustChangePassword: boolean;
  units: UnitPreference;
  /** ISO 8601 UTC timestamps. */
  createdAt: string;
  lastSignInAt: string | null;
}

/** GET /api/session and POST /api/session answer with this. */
export interface SessionDto {
  user: UserDto;
  /** Token to send in the `x-csrf-token` header on every state-changing request. */
  csrfToken: string;
}

/** GET /api/session/csrf — a token for the anonymous session (needed to sign in). */
export interface CsrfDto {
  csrfToken: string;
}

/** One page of a server-side paginated table. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** The name of the header that carries the CSRF token. */
export const CSRF_HEADER = 'x-csrf-token';
