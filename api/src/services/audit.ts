import type { EntityManager } from 'typeorm';
import type { Viewer } from '../auth/session-data';
import { AuditEvent } from '../db/entities';

/** Records who did what to which object (inside the caller's transaction when given one). */
export async function audit(
  manager: EntityManager,
  viewer: Viewer,
  action: string,
  target: { type: string; id?: string | null },
  details: Record<string, unknown> = {},
): Promise<void> {
  await manager.getRepository(AuditEvent).insert({
    workspaceId: viewer.workspace.id,
    actorUserId: viewer.tokenId ? null : (viewer.user?.id ?? null),
    actorTokenId: viewer.tokenId ?? null,
    action,
    targetType: target.type,
    targetId: target.id ?? null,
    details: details as never,
  });
}

/** The newest audit events of a workspace, with who did them. */
export async function listAuditEvents(manager: EntityManager, workspaceId: string, limit: number, before?: Date) {
  const qb = manager.getRepository(AuditEvent).createQueryBuilder('e')
    .leftJoinAndSelect('e.actorUser', 'u')
    .leftJoinAndSelect('e.actorToken', 't')
    .where('e.workspace_id = :workspaceId', { workspaceId })
    .orderBy('e.created_at', 'DESC')
    .limit(limit);
  if (before) qb.andWhere('e.created_at < :before', { before });
  const events = await qb.getMany();
  return events.map((e) => ({
    id: e.id,
    action: e.action,
    target: { type: e.targetType, id: e.targetId },
    details: e.details,
    actor: e.actorToken ? { kind: 'token', id: e.actorToken.id, name: e.actorToken.name } : e.actorUser ? { kind: 'member', id: e.actorUser.id, name: e.actorUser.displayName } : null,
    createdAt: e.createdAt.toISOString(),
  }));
}
