import type { NextFunction, Request, Response } from 'express';
import type { DataSource } from 'typeorm';
import { Membership } from '../db/entities';
import { ForbiddenError, UnauthenticatedError } from '../errors';
import type { Role } from '../db/entities';
import './session-data';

/**
 * Loads the signed-in person and their membership on every request, so a changed role or a
 * removed member takes effect at once rather than at the next sign-in.
 */
export function requireSession(dataSource: DataSource) {
  return async (req: Request, _res: Response, next: NextFunction): Promise<void> => {
    const { userId, workspaceId } = req.session ?? {};
    if (!userId || !workspaceId) throw new UnauthenticatedError();
    const membership = await dataSource.getRepository(Membership).findOne({
      where: { userId, workspaceId },
      relations: { user: true, workspace: true },
    });
    if (!membership?.user || !membership.workspace) {
      throw new UnauthenticatedError('Your membership of this workspace has ended. Sign in again.');
    }
    req.viewer = { user: membership.user, workspace: membership.workspace, role: membership.role };
    next();
  };
}

/** Allows the request only for the listed roles (after `requireSession`). */
export function requireRole(...roles: Role[]) {
  return (req: Request, _res: Response, next: NextFunction): void => {
    if (!req.viewer) throw new UnauthenticatedError();
    if (!roles.includes(req.viewer.role)) {
      throw new ForbiddenError(`This needs the role ${roles.join(' or ')}; you are ${req.viewer.role}.`);
    }
    next();
  };
}
