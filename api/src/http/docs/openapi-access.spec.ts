import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { Role } from '../../db/entities';
import { openTestApp, type TestApp } from '../../testing/test-app';
import { createTestWorkspace } from '../../testing/test-database';
import { memberSession } from '../../testing/test-session';
import { loadOpenApiDocument } from './openapi-document';
import { isPublic, operationsOf, type DocumentedOperation } from './openapi-operations';

type Caller = Role | 'anonymous' | 'token';
const ROLES: Role[] = ['owner', 'architect', 'reviewer', 'viewer'];
const operations = operationsOf(loadOpenApiDocument().document);

/**
 * Calls every documented operation as each kind of caller and holds the answer to what the
 * document says: a public operation lets anyone in, the others refuse the roles missing from
 * x-roles and API tokens unless x-api-token. Ids are fresh UUIDs, so no call finds (or changes)
 * anything real; an allowed caller gets past the door and is turned away later, if at all.
 */
describe('each documented operation against the running app', () => {
  let t: TestApp;
  const headers = new Map<Caller, Record<string, string>>();

  beforeAll(async () => {
    t = await openTestApp({ SEAMLINE_WEB_DIST: '/nonexistent/web' });
    const { workspace, members } = await createTestWorkspace(t.dataSource, ROLES);
    for (const { user, role } of members) headers.set(role, (await memberSession(t.sessionPool, t.config, user.id, workspace.id)).headers);
    const token = await request(t.app).post('/api/tokens').set(headers.get('owner')!).send({ name: 'docs check' }).expect(201);
    headers.set('token', { Authorization: `Bearer ${token.body.secret}` });
    headers.set('anonymous', {});
  });
  afterAll(() => t.close());

  const call = (op: DocumentedOperation, who: Caller) => {
    const url = op.path.replace(/\{functionId\}/g, 'no-such-function').replace(/\{\w+\}/g, () => randomUUID());
    return request(t.app)[op.method as 'get'](url).set(headers.get(who)!).redirects(0);
  };

  for (const op of operations) {
    const callers: Caller[] = isPublic(op) ? ['anonymous'] : ['anonymous', ...ROLES, 'token'];
    it(`${op.key} answers as documented for ${callers.join(', ')}`, async () => {
      for (const who of callers) {
        const res = await call(op, who);
        expect(String(res.body?.error?.message ?? '')).not.toMatch(/^No API route/);
        const allowed = isPublic(op) || (who === 'token' ? op.operation['x-api-token'] === true : who !== 'anonymous' && op.operation['x-roles']!.includes(who));
        if (allowed) {
          expect({ who, status: res.status, refused: [401, 403].includes(res.status) }).toEqual({ who, status: res.status, refused: false });
        } else {
          expect({ who, status: res.status, code: res.body.error?.code }).toEqual(
            who === 'anonymous' ? { who, status: 401, code: 'unauthenticated' } : { who, status: 403, code: 'forbidden' },
          );
        }
      }
    });
  }
});
