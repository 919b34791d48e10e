import { HttpContext, HttpContextToken } from '@angular/common/http';

/**
 * HTTP statuses the caller shows itself (for example a form that puts 400 field errors
 * beside its fields). For those the interceptor neither shows a snack bar nor navigates;
 * it still converts the error into an ApiError.
 */
export const CALLER_HANDLES = new HttpContextToken<readonly number[]>(() => []);

/** Request context saying the caller handles these statuses itself. */
export function callerHandles(...statuses: number[]): HttpContext {
  return new HttpContext().set(CALLER_HANDLES, statuses);
}
