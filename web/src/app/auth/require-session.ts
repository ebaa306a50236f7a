import { CanActivateFn } from '@angular/router';

import { ALL_ROLES } from '../api-types';
import { requireRole } from './require-role';

/** Guard: the route needs a session (any role); otherwise it goes to /sign-in. */
export const requireSession: CanActivateFn = requireRole(...ALL_ROLES);
