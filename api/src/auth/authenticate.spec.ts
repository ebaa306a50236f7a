import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { ApiToken, Snapshot } from '../db/entities';
import { openTestApp, type TestApp } from '../testing/test-app';
import { createTestWorkspace } from '../testing/test-database';
import { memberSession } from '../testing/test-session';
import { createQueuedSnapshot } from '../testing/test-snapshot';
import { hashToken, newTokenSecret } from './api-tokens';

describe('who is calling: API tokens and sessions', () => {
  let t: TestApp;
  let workspaceId: string;
  let architect: Awaited<ReturnType<typeof memberSession>>;

  beforeAll(async () => {
    t = await openTestApp();
    const { workspace, members } = await createTestWorkspace(t.dataSource, ['architect']);
    workspaceId = workspace.id;
    architect = await memberSession(t.sessionPool, t.config, members[0]!.user.id, workspace.id);
  });
  afterAll(() => t.close());

  async function newToken(inWorkspace = workspaceId, revoked = false) {
    const secret = newTokenSecret();
    const row = await t.dataSource.getRepository(ApiToken).save({
      workspaceId: inWorkspace, name: 'ci', tokenHash: hashToken(secret), prefix: secret.slice(0, 10), revokedAt: revoked ? new Date() : null,
    });
    return { id: row.id, secret };
  }

  it('should refuse an Authorization header that is not a Bearer token, naming the expected form', async () => {
    const { secret } = await newToken();
    for (const header of [`Basic ${Buffer.from('a:b').toString('base64')}`, 'Bearer', `Bearer ${secret} extra`, '']) {
      const res = await request(t.app).get(`/api/snapshots/${randomUUID()}`).set('Authorization', header);
      expect({ header, status: res.status, body: res.body }).toEqual({
        header, status: 401, body: { error: { code: 'unauthenticated', message: 'The Authorization header must be "Bearer <token>".' } },
      });
    }
  });

  it('should refuse an unknown or revoked token with 401, and a good one with any case of "bearer"', async () => {
    const revoked = await newToken(workspaceId, true);
    const unknown = await request(t.app).post('/api/push?codebase=x').set('Authorization', `Bearer ${newTokenSecret()}`).type('application/json').send('{}').expect(401);
    expect(unknown.body.error.message).toMatch(/unknown or was revoked/);
    await request(t.app).post('/api/push?codebase=x').set('Authorization', `Bearer ${revoked.secret}`).type('application/json').send('{}').expect(401);
    const good = await newToken();
    const { snapshot } = await createQueuedSnapshot(t.dataSource, workspaceId);
    await request(t.app).get(`/api/snapshots/${snapshot.id}`).set('Authorization', `bearer ${good.secret}`).expect(200);
  });

  it('should not fall back to the session cookie when the Authorization header is bad', async () => {
    const res = await request(t.app).get('/api/me').set(architect.headers).set('Authorization', `Bearer ${newTokenSecret()}`).expect(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('should stamp when a token was last used', async () => {
    const { id, secret } = await newToken();
    const { snapshot } = await createQueuedSnapshot(t.dataSource, workspaceId);
    const before = Date.now();
    await request(t.app).get(`/api/snapshots/${snapshot.id}`).set('Authorization', `Bearer ${secret}`).expect(200);
    // The stamp is written without holding up the answer; give it a moment.
    let lastUsedAt: Date | null = null;
    for (let i = 0; i < 50 && !lastUsedAt; i++) {
      lastUsedAt = (await t.dataSource.getRepository(ApiToken).findOneByOrFail({ id })).lastUsedAt;
      if (!lastUsedAt) await new Promise((resolve) => setTimeout(resolve, 20));
    }
    expect(lastUsedAt!.getTime()).toBeGreaterThanOrEqual(before - 1000);
  });

  it('should keep a member and a token inside their own workspace', async () => {
    const other = await createTestWorkspace(t.dataSource, []);
    const { snapshot } = await createQueuedSnapshot(t.dataSource, other.workspace.id);
    const { secret } = await newToken();
    const asMember = await request(t.app).get(`/api/snapshots/${snapshot.id}`).set(architect.headers).expect(404);
    expect(asMember.body.error.code).toBe('not_found');
    await request(t.app).get(`/api/snapshots/${snapshot.id}`).set('Authorization', `Bearer ${secret}`).expect(404);
    await request(t.app).delete(`/api/snapshots/${snapshot.id}`).set(architect.headers).expect(404);
    expect(await t.dataSource.getRepository(Snapshot).findOneBy({ id: snapshot.id })).not.toBeNull();
  });
});
