import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, throwError } from 'rxjs';
import { AuthStore } from './auth-store';

/**
 * A 401 from the API means the session ended (idle or absolute timeout, signed out elsewhere): go to sign-in and
 * come back to the same page. `/api/me` is exempt — it is how the store asks, and anonymous is an answer.
 * The CSRF header is added by Angular's own XSRF interceptor (configured in app.config.ts).
 */
export const authInterceptor: HttpInterceptorFn = (req, next) => {
  const auth = inject(AuthStore);
  return next(req).pipe(
    catchError((e: unknown) => {
      if (e instanceof HttpErrorResponse && e.status === 401 && req.url.startsWith('/api/') && !req.url.startsWith('/api/me')) {
        auth.sessionLost();
      }
      return throwError(() => e);
    }),
  );
};
