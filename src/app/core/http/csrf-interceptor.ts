import { type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { CSRF_HEADER } from '@shared/api-types';
import { Session } from '../session/session';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** Adds the session's CSRF token to every state-changing request (DEVELOPERS.md, API conventions). */
export const csrfInterceptor: HttpInterceptorFn = (req, next) => {
  if (!STATE_CHANGING.has(req.method.toUpperCase())) return next(req);
  const token = inject(Session).csrfToken();
  if (!token) return next(req);
  return next(req.clone({ setHeaders: { [CSRF_HEADER]: token } }));
};
