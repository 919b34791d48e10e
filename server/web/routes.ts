/**
 * Every API route, one line each: method, path, who may call it, handler. The router and
 * the role-walk test are both built from this table. Within a path, specific routes come
 * before parameterised ones.
 */
import * as health from './handlers/health';
import * as session from './handlers/session';
import * as users from './handlers/users';
import type { RouteDefinition } from './route-definition';

export const routes: readonly RouteDefinition[] = [
  { method: 'get', path: '/api/health', access: 'public', handler: health.check },

  // Session: the routes someone with a temporary password can still use.
  { method: 'get', path: '/api/session/csrf', access: 'public', handler: session.issueCsrfToken, whilePasswordChangeRequired: true },
  { method: 'get', path: '/api/session', access: 'signedIn', handler: session.current, whilePasswordChangeRequired: true },
  { method: 'post', path: '/api/session', access: 'public', handler: session.signIn, whilePasswordChangeRequired: true },
  { method: 'delete', path: '/api/session', access: 'signedIn', handler: session.signOut, whilePasswordChangeRequired: true },
  { method: 'post', path: '/api/session/password', access: 'signedIn', handler: session.changePassword, whilePasswordChangeRequired: true },
  { method: 'patch', path: '/api/session/preferences', access: 'signedIn', handler: session.updatePreferences },

  // People (admin).
  { method: 'get', path: '/api/users', access: ['admin'], handler: users.list },
  { method: 'post', path: '/api/users', access: ['admin'], handler: users.create },
  { method: 'get', path: '/api/users/:id', access: ['admin'], handler: users.getOne },
  { method: 'patch', path: '/api/users/:id', access: ['admin'], handler: users.update },
  { method: 'post', path: '/api/users/:id/deactivate', access: ['admin'], handler: users.deactivate },
  { method: 'post', path: '/api/users/:id/reactivate', access: ['admin'], handler: users.reactivate },
  { method: 'post', path: '/api/users/:id/temporary-password', access: ['admin'], handler: users.setTemporaryPassword },
];
