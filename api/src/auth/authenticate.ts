import type { NextFunction, Request, Response } from 'express';
import { IsNull, type DataSource } from 'typeorm';
import { entityRows } from '../db/entity-rows';
import { ApiToken, Workspace, type Membership, User } from '../db/entities';
import { UnauthenticatedError } from '../errors';
import { hashToken } from './api-tokens';
import { checkCsrf } from './csrf';
import type { Viewer } from './session-data';

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
    const viewer = await memberViewer(dataSource, userId, workspaceId);
    if (!viewer) throw new UnauthenticatedError('Your membership of this workspace has ended. Sign in again.');
    req.viewer = viewer;
    checkCsrf(req, res);
    next();
  };
}

/** The member's user, workspace and role, in one plain query (every request asks; see EntityRows). */
async function memberViewer(dataSource: DataSource, userId: string, workspaceId: string): Promise<Viewer | null> {
  const users = entityRows(dataSource, User);
  const workspaces = entityRows(dataSource, Workspace);
  const [row] = await dataSource.query(
    `SELECT m.role, ${users.select('u', 'u_')}, ${workspaces.select('w', 'w_')}
       FROM membership m JOIN app_user u ON u.id = m.user_id JOIN workspace w ON w.id = m.workspace_id
      WHERE m.user_id = $1 AND m.workspace_id = $2`,
    [userId, workspaceId],
  );
  return row ? { user: users.from(row, 'u_'), workspace: workspaces.from(row, 'w_'), role: row.role as Membership['role'] } : null;
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
