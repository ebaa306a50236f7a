import type { Request } from 'express';
import type { Viewer } from '../auth/session-data';
import type { User } from '../db/entities';
import { ForbiddenError, UnauthenticatedError } from '../errors';

/** The caller of an authenticated route. */
export function viewerOf(req: Request): Viewer {
  if (!req.viewer) throw new UnauthenticatedError();
  return req.viewer;
}

/** The caller when the route is for signed-in members only (not API tokens). */
export function memberOf(req: Request): Viewer & { user: User } {
  const viewer = viewerOf(req);
  if (viewer.tokenId || !viewer.user) throw new ForbiddenError('This needs a signed-in member, not an API token.');
  return viewer as Viewer & { user: User };
}
