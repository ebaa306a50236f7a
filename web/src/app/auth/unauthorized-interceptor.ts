import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';

import { SessionStore } from './session-store';

/** The session probe; its 401 is an answer ("nobody"), handled by the guards. */
const SESSION_PROBE = '/api/me';

/**
 * When an API call answers 401 the session has ended (expired or signed out elsewhere):
 * forget it and go to /sign-in. The error still reaches the caller.
 */
export const unauthorizedInterceptor: HttpInterceptorFn = (request, next) => {
  const session = inject(SessionStore);
  const router = inject(Router);
  return next(request).pipe(
    catchError((error: unknown) => {
      const isApiCall = request.url.startsWith('/api/') && request.url !== SESSION_PROBE;
      if (isApiCall && error instanceof HttpErrorResponse && error.status === 401) {
        session.clear();
        void router.navigateByUrl('/sign-in');
      }
      return throwError(() => error);
    }),
  );
};
