import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { catchError, map, of } from 'rxjs';

import { apiErrorMessage } from '../api-error-message';
import type { Role } from '../api-types';
import { SessionStore } from './session-store';

/** Where people land when a screen is not open to their role (open to every role). */
const HOME = '/overview';

/**
 * Guard factory: the route needs a session whose role is one of `roles`.
 * Without a session it goes to /sign-in; with another role it goes to the Overview.
 */
export function requireRole(...roles: Role[]): CanActivateFn {
  return () => {
    const session = inject(SessionStore);
    const router = inject(Router);
    return session.ensureLoaded().pipe(
      map((me) => {
        if (!me) {
          return router.createUrlTree(['/sign-in']);
        }
        return roles.includes(me.role) ? true : router.parseUrl(HOME);
      }),
      catchError((error: unknown) =>
        of(router.createUrlTree(['/sign-in'], { queryParams: { error: apiErrorMessage(error) } })),
      ),
    );
  };
}
