import type { NextFunction, Request, Response } from 'express';
import { IsNull, type DataSource } from 'typeorm';
import { ApiToken, Membership, User } from '../db/entities';
import { UnauthenticatedError } from '../errors';
import { hashToken } from './api-tokens';
import { checkCsrf } from './csrf';
import './session-data';

/**
 * Finds out who calls: a workspace API token (`Authorization: Bearer …`, for CI) or the browser
 * session. The member and role are read from the database on every request, so a changed role
 * or a removed member takes effect at once. Cookie-authenticated changes must pass the CSRF check.
 */
export function authenticate(dataSource: DataSource) {
  return async (req: Request, res: Response, next: NextFunction): Promise<void> => {
    const header = req.get('authorization');
    if (header !== undefined) {
      await authenticateToken(dataSource, req, header);
      return next();
    }
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
    checkCsrf(req, res);
    next();
  };
}

async function authenticateToken(dataSource: DataSource, req: Request, header: string): Promise<void> {
  const match = /^Bearer\s+(\S+)$/i.exec(header);
  if (!match) throw new UnauthenticatedError('The Authorization header must be "Bearer <token>".');
  const token = await dataSource.getRepository(ApiToken).findOne({
    where: { tokenHash: hashToken(match[1]), revokedAt: IsNull() },
    relations: { workspace: true },
  });
  if (!token?.workspace) throw new UnauthenticatedError('This API token is unknown or was revoked. Ask a workspace owner for a new one.');
  const user = token.createdById ? await dataSource.getRepository(User).findOneBy({ id: token.createdById }) : null;
  req.viewer = { user, workspace: token.workspace, role: 'architect', tokenId: token.id };
  // Not awaited: a lost "last used" stamp is not worth failing a push over.
  // Awaited, so no write outlives its request (tokens are used by CI pushes, not page loads);
  // a failure to note the time does not refuse the request.
  await dataSource.getRepository(ApiToken).update(token.id, { lastUsedAt: new Date() }).catch(() => undefined);
}
