import request from 'supertest';
import type { Role } from '../db/entities';
import { openTestApp, type TestApp } from '../testing/test-app';
import { createTestWorkspace } from '../testing/test-database';
import { sessionCookieFor } from '../testing/test-session';

type Access = Role | 'anonymous';
const EVERY_ROLE: Role[] = ['owner', 'architect', 'reviewer', 'viewer'];

/** Every API route with who may call it; a new route gets a row here. */
const ROUTES: { method: 'get' | 'post'; path: string; allowed: Access[] }[] = [
  { method: 'get', path: '/api/health', allowed: ['anonymous', ...EVERY_ROLE] },
  { method: 'get', path: '/api/me', allowed: EVERY_ROLE },
  { method: 'get', path: '/api/codebases', allowed: EVERY_ROLE },
  { method: 'get', path: '/api/outbox', allowed: ['owner'] },
];

describe('who may call which API route', () => {
  let t: TestApp;
  const cookies = new Map<Access, string | undefined>();

  beforeAll(async () => {
    t = await openTestApp();
    const { workspace, members } = await createTestWorkspace(t.dataSource, EVERY_ROLE);
    cookies.set('anonymous', undefined);
    for (const { user, role } of members) cookies.set(role, await sessionCookieFor(t.sessionPool, t.config, user.id, workspace.id));
  });
  afterAll(() => t.close());

  for (const route of ROUTES) {
    for (const who of ['anonymous', ...EVERY_ROLE] as Access[]) {
      const allowed = route.allowed.includes(who);
      it(`${route.method.toUpperCase()} ${route.path} as ${who} → ${allowed ? 'allowed' : 'refused'}`, async () => {
        const req = request(t.app)[route.method](route.path);
        const cookie = cookies.get(who);
        if (cookie) req.set('Cookie', cookie);
        const res = await req;
        if (allowed) {
          expect(res.status).toBeLessThan(400);
        } else {
          expect(res.status).toBe(who === 'anonymous' ? 401 : 403);
          expect(res.body.error.code).toBe(who === 'anonymous' ? 'unauthenticated' : 'forbidden');
        }
      });
    }
  }
});
