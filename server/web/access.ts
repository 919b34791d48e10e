import type { RequestHandler } from 'express';
import { hasAccess, ROLES, type Access } from '../../shared/roles';
import { AppError } from '../app-error';
import type { RouteDefinition } from './route-definition';

export function isValidAccess(access: unknown): access is Access {
  if (access === 'public' || access === 'signedIn') return true;
  return Array.isArray(access) && access.length > 0 && access.every((r) => (ROLES as readonly unknown[]).includes(r));
}

/** The per-route gate: anonymous → 401, password change pending → 403, role missing → 403. */
export function requireAccess(route: Pick<RouteDefinition, 'access' | 'whilePasswordChangeRequired'>): RequestHandler {
  return (req, _res, next) => {
    if (route.access === 'public') return next();
    const user = req.user;
    if (!user) {
      return next(new AppError(401, 'NOT_SIGNED_IN', [{ path: '', message: 'Please sign in first.' }]));
    }
    if (user.mustChangePassword && !route.whilePasswordChangeRequired) {
      return next(
        new AppError(403, 'PASSWORD_CHANGE_REQUIRED', [{ path: '', message: 'Your password was set by an admin. Choose a new password before you continue.' }]),
      );
    }
    if (!hasAccess(user.roles, route.access)) {
      return next(AppError.forbidden('Your roles do not allow this.'));
    }
    next();
  };
}
