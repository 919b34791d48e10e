import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { Notifier } from '../notifier/notifier';
import { Session } from '../session/session';
import { ApiError } from './api-error';
import { CALLER_HANDLES } from './caller-handles';

/**
 * Turns every failed API call into an ApiError and deals with what only the app as a whole
 * can: an ended session (back to sign-in, keeping where the user was), a password that must
 * be changed first, and a readable message for everything no caller handles.
 */
export const errorInterceptor: HttpInterceptorFn = (req, next) => {
  const session = inject(Session);
  const router = inject(Router);
  const notifier = inject(Notifier);
  const handled = req.context.get(CALLER_HANDLES);

  return next(req).pipe(
    catchError((e: unknown) => {
      if (!(e instanceof HttpErrorResponse)) return throwError(() => e);
      const error = ApiError.fromResponse(e);
      if (handled.includes(error.status)) return throwError(() => error);

      if (error.status === 401 && error.code === 'NOT_SIGNED_IN') {
        session.clear();
        const here = router.url;
        const returnUrl = here && here !== '/' && !here.startsWith('/sign-in') ? here : undefined;
        void router.navigate(['/sign-in'], { queryParams: returnUrl ? { returnUrl } : {} });
      } else if (error.code === 'PASSWORD_CHANGE_REQUIRED') {
        void router.navigateByUrl('/account');
      } else {
        void notifier.show(error.message);
      }
      return throwError(() => error);
    }),
  );
};
