import request from 'supertest';
import { Codebase, Snapshot } from '../../db/entities';
import { openTestApp, type TestApp } from '../../testing/test-app';
import { createTestWorkspace } from '../../testing/test-database';
import { sessionCookieFor } from '../../testing/test-session';

describe('GET /api/codebases', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await openTestApp();
  });
  afterAll(() => t.close());

  async function memberCookie(role: 'owner' | 'viewer' = 'viewer') {
    const { workspace, members } = await createTestWorkspace(t.dataSource, [role]);
    return { workspace, cookie: await sessionCookieFor(t.sessionPool, t.config, members[0].user.id, workspace.id) };
  }

  it('should refuse a request without a session with the shared error shape', async () => {
    const res = await request(t.app).get('/api/codebases').expect(401);
    expect(res.body).toEqual({ error: { code: 'unauthenticated', message: 'Sign in to continue.' } });
  });

  it('should answer an empty list for a workspace with no codebases (no invented rows)', async () => {
    const { cookie } = await memberCookie();
    const res = await request(t.app).get('/api/codebases').set('Cookie', cookie).expect(200);
    expect(res.body).toEqual({ items: [] });
  });

  it("should list only the member's workspace, codebases by name and snapshots newest first", async () => {
    const { workspace, cookie } = await memberCookie();
    const other = await createTestWorkspace(t.dataSource, ['owner']);
    const repo = t.dataSource.getRepository(Codebase);
    const routing = await repo.save({ workspaceId: workspace.id, name: 'routing' });
    await repo.save({ workspaceId: workspace.id, name: 'billing' });
    await repo.save({ workspaceId: other.workspace.id, name: 'not-mine' });
    const snapshots = t.dataSource.getRepository(Snapshot);
    await snapshots.save({ codebaseId: routing.id, status: 'ready', progress: 100, commit: 'a1', createdAt: new Date('2026-11-01T10:00:00Z'),
      totals: { functions: 12, cyclomatic: 30, decisions: 18 } });
    await snapshots.save({ codebaseId: routing.id, status: 'failed', error: 'The zip holds no TypeScript or JavaScript files.', createdAt: new Date('2026-11-02T10:00:00Z') });

    const res = await request(t.app).get('/api/codebases').set('Cookie', cookie).expect(200);
    expect(res.body.items.map((c: { name: string }) => c.name)).toEqual(['billing', 'routing']);
    const [failed, ready] = res.body.items[1].snapshots;
    expect(failed).toMatchObject({ status: 'failed', error: 'The zip holds no TypeScript or JavaScript files.', totals: null });
    expect(ready).toMatchObject({ status: 'ready', commit: 'a1', totals: { functions: 12, cyclomatic: 30, decisions: 18 } });
    expect(ready.createdAt).toBe('2026-11-01T10:00:00.000Z');
  });
});
