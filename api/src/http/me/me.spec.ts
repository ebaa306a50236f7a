import request from 'supertest';
import { Membership } from '../../db/entities';
import { openTestApp, type TestApp } from '../../testing/test-app';
import { createTestWorkspace } from '../../testing/test-database';
import { sessionCookieFor } from '../../testing/test-session';

describe('GET /api/me', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await openTestApp();
  });
  afterAll(() => t.close());

  it('should say who is signed in, where, and with which role', async () => {
    const { workspace, members } = await createTestWorkspace(t.dataSource, ['reviewer']);
    const { user } = members[0];
    const cookie = await sessionCookieFor(t.sessionPool, t.config, user.id, workspace.id);
    const res = await request(t.app).get('/api/me').set('Cookie', cookie).expect(200);
    expect(res.body).toEqual({
      user: { id: user.id, email: user.email, displayName: user.displayName },
      workspace: { id: workspace.id, slug: workspace.slug, name: workspace.name },
      role: 'reviewer',
    });
  });

  it('should take a changed role into account at once and end access when the membership ends', async () => {
    const { workspace, members } = await createTestWorkspace(t.dataSource, ['viewer']);
    const cookie = await sessionCookieFor(t.sessionPool, t.config, members[0].user.id, workspace.id);
    const memberships = t.dataSource.getRepository(Membership);
    await memberships.update({ userId: members[0].user.id }, { role: 'architect' });
    expect((await request(t.app).get('/api/me').set('Cookie', cookie).expect(200)).body.role).toBe('architect');
    await memberships.delete({ userId: members[0].user.id });
    const res = await request(t.app).get('/api/me').set('Cookie', cookie).expect(401);
    expect(res.body.error.message).toMatch(/membership/);
  });

  it('should refuse a forged session cookie', async () => {
    await request(t.app).get('/api/me').set('Cookie', 'seamline.sid=s%3Aforged.abc').expect(401);
  });
});
