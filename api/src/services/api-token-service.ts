import { IsNull, type DataSource } from 'typeorm';
import { hashToken, newTokenSecret } from '../auth/api-tokens';
import type { Viewer } from '../auth/session-data';
import { ApiToken } from '../db/entities';
import { NotFoundError } from '../errors';
import { audit } from './audit';

export interface TokenView {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  createdBy: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

export async function listTokens(dataSource: DataSource, workspaceId: string): Promise<TokenView[]> {
  const tokens = await dataSource.getRepository(ApiToken).find({ where: { workspaceId }, relations: { createdBy: true }, order: { createdAt: 'DESC' } });
  return tokens.map(toView);
}

/** Creates a token; the secret is in this answer only and is never stored. */
export async function createToken(dataSource: DataSource, viewer: Viewer, name: string): Promise<{ token: TokenView; secret: string }> {
  const secret = newTokenSecret();
  return dataSource.transaction(async (m) => {
    const saved = await m.getRepository(ApiToken).save({
      workspaceId: viewer.workspace.id, name: name.trim(), tokenHash: hashToken(secret), prefix: secret.slice(0, 10), createdById: viewer.user?.id ?? null,
    });
    await audit(m, viewer, 'token.create', { type: 'api_token', id: saved.id }, { name: saved.name });
    return { token: toView({ ...saved, createdBy: viewer.user }), secret };
  });
}

export async function revokeToken(dataSource: DataSource, viewer: Viewer, id: string): Promise<void> {
  await dataSource.transaction(async (m) => {
    const token = await m.getRepository(ApiToken).findOneBy({ id, workspaceId: viewer.workspace.id, revokedAt: IsNull() });
    if (!token) throw new NotFoundError('No such active token in this workspace.');
    await m.getRepository(ApiToken).update(id, { revokedAt: new Date() });
    await audit(m, viewer, 'token.revoke', { type: 'api_token', id }, { name: token.name });
  });
}

function toView(t: ApiToken): TokenView {
  return {
    id: t.id, name: t.name, prefix: t.prefix, createdAt: t.createdAt.toISOString(), createdBy: t.createdBy?.displayName ?? null,
    lastUsedAt: t.lastUsedAt?.toISOString() ?? null, revokedAt: t.revokedAt?.toISOString() ?? null,
  };
}
