import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { AuthStore } from '../auth/auth-store';
import { Notifier } from '../feedback/notifier';
import { readApiError } from './api-error';
import { INLINE_ERRORS } from './inline-errors';

// A 401 from these is an answer, not an expired session: the probe says "not signed in",
// sign-in says "wrong password".
const SESSION_PROBES = ['/api/auth/me', '/api/auth/login'];

/**
 * Expired session → back to sign-in with the current page as `next`.
 * Other failures → a snackbar, unless the caller shows the error inline.
 */
export const errorInterceptor: HttpInterceptorFn = (request, next) => {
  const router = inject(Router);
  const auth = inject(AuthStore);
  const notifier = inject(Notifier);
  return next(request).pipe(
    catchError((failure: unknown) => {
      if (failure instanceof HttpErrorResponse) {
        const path = request.url.split('?')[0];
        if (failure.status === 401 && !SESSION_PROBES.includes(path)) {
          auth.clear();
          const current = router.url;
          if (!current.startsWith('/sign-in')) {
            void router.navigate(['/sign-in'], { queryParams: { next: current, notice: 'expired' } });
          }
        } else if (!request.context.get(INLINE_ERRORS)) {
          notifier.error(readApiError(failure).message);
        }
      }
      return throwError(() => failure);
    }),
  );
};
