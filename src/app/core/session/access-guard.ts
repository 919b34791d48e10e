import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';
import { type Access, hasAccess } from '@shared/roles';
import { Session } from './session';

/** Where the route tables (app.routes.ts and the features' own) keep each route's access. */
export interface AccessData {
  access: Access;
}

/**
 * Checks the route's declared `data.access` against the session:
 * signed out → sign-in (with the way back), temporary password → account page,
 * wrong role → the not-allowed page.
 */
export const accessGuard: CanActivateFn = (route, state) => {
  const session = inject(Session);
  const router = inject(Router);
  const access = (route.data as Partial<AccessData>).access ?? 'signedIn';

  if (access === 'public') return true;
  if (!session.isSignedIn()) {
    return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
  }
  if (session.mustChangePassword() && !state.url.startsWith('/account')) {
    return router.createUrlTree(['/account']);
  }
  if (!hasAccess(session.roles(), access)) {
    return router.createUrlTree(['/not-allowed'], { queryParams: { from: state.url } });
  }
  return true;
};
