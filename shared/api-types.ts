import type { NotificationKind } from './notification-kinds';
import type { Role } from './roles';

/** Unit display preference; stored values are always metric, imperial is shown beside them. */
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
  /** Machines the person runs (operators), ids ascending. */
  machineIds: number[];
  /** Invited by e-mail and has not set a password yet (the link may have expired). */
  invitationPending: boolean;
  /** ISO 8601 UTC timestamps. */
  createdAt: string;
  lastSignInAt: string | null;
}

/** GET /api/session and POST /api/session answer with this. */
export interface SessionDto {
  user: UserDto;
  /** Token to send in the `x-csrf-token` header on every state-changing request. */
  csrfToken: string;
  /** True when this server keeps a development outbox (GET /api/dev/outbox); false in production. */
  devOutbox: boolean;
  /**
   * True until the person completes a signing with username and password in this session;
   * until then a signature asks for both (21 CFR 11.200(a)(1)(i)).
   */
  signatureNeedsUsername: boolean;
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

/** One notification kind in GET/PATCH /api/session/notifications. */
export interface NotificationPreferenceDto {
  kind: NotificationKind;
  label: string;
  audience: string;
  /** False for the mails that cannot be turned off (acknowledgement requests). */
  optional: boolean;
  enabled: boolean;
}

/** GET and PATCH /api/session/notifications answer with this. */
export interface NotificationPreferencesDto {
  items: NotificationPreferenceDto[];
}

/** POST /api/password/link: what a valid single-use link is for. */
export interface LinkInfoDto {
  purpose: 'invitation' | 'password-reset';
  username: string;
  displayName: string;
  /** ISO 8601 UTC. */
  expiresAt: string;
}

/** POST /api/password/forgot and POST /api/users/:id/invitation answer with a message only. */
export interface MessageDto {
  message: string;
}

/** One row of the development outbox (GET /api/dev/outbox → { items }). */
export interface OutboxEntryDto {
  id: number;
  to: string;
  subject: string;
  kind: string;
  created: string;
  sent: string | null;
  attempts: number;
  lastError: string | null;
  sendAfter: string;
  /** The plain-text part, for reading the mail and following its links. */
  text: string;
}
