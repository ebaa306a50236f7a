import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { catchError, map, of } from 'rxjs';

import { SessionStore } from './session-store';

/** Guard for /sign-in: people who already have a session go straight to the Overview. */
export const redirectSignedIn: CanActivateFn = () => {
  const session = inject(SessionStore);
  const router = inject(Router);
  return session.load().pipe(
    map((me) => (me ? router.parseUrl('/overview') : true)),
    // The server may be unreachable; the sign-in page is still the right place to be.
    catchError(() => of(true)),
  );
};
