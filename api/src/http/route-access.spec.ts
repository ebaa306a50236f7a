import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import { hashToken, newTokenSecret } from '../auth/api-tokens';
import { ApiToken, CarvePlanRow, Codebase, Membership, User, type Role } from '../db/entities';
import { openTestApp, type TestApp } from '../testing/test-app';
import { createTestWorkspace } from '../testing/test-database';
import { memberSession } from '../testing/test-session';
import { SMALL_CODEBASE, createQueuedSnapshot } from '../testing/test-snapshot';
import { zipWithYazl } from '../uploads/testing/yazl-zip';

type Caller = 'anonymous' | Role | 'token';
const CALLERS: Caller[] = ['anonymous', 'owner', 'architect', 'reviewer', 'viewer', 'token'];
const ROLES: Role[] = ['owner', 'architect', 'reviewer', 'viewer'];

/** Public, and its answer depends on the machine (302 to the identity provider, or 503 without its certificate): only "not refused" is checked. */
const REACHED = 'reached';
type Expected = number | typeof REACHED;

/**
 * What every API route answers to every caller, written out by hand (never read from the policy
 * table). 401 and 403 are refusals; any other number is the status the call must succeed with.
 * Owners manage members, tokens and settings; architects upload, push, plan and write; reviewers
 * and viewers read; an API token may only push and read a snapshot's status.
 */
const MATRIX: Record<string, Expected[]> = {
  //                                                 anonymous  owner  architect  reviewer  viewer  token
  'GET /api/health':                                 [200,      200,   200,       200,      200,    200],
  'GET /api/auth/login':                             [REACHED,  REACHED, REACHED, REACHED,  REACHED, REACHED],
  'POST /api/auth/saml/acs':                         [303,      303,   303,       303,      303,    303],
  'POST /api/auth/logout':                           [204,      204,   204,       204,      204,    204],
  'GET /api/auth/saml/metadata':                     [200,      200,   200,       200,      200,    200],
  'GET /api/docs':                                   [200,      200,   200,       200,      200,    200],
  'GET /api/docs/openapi.json':                      [200,      200,   200,       200,      200,    200],
  'GET /api/docs/initializer.js':                    [200,      200,   200,       200,      200,    200],
  'GET /api/me':                                     [401,      200,   200,       200,      200,    403],
  'GET /api/workspace':                              [401,      200,   200,       200,      200,    403],
  'PATCH /api/workspace/settings':                   [401,      200,   403,       403,      403,    403],
  'GET /api/workspace/members':                      [401,      200,   200,       200,      200,    403],
  'POST /api/workspace/members':                     [401,      201,   403,       403,      403,    403],
  'PATCH /api/workspace/members/:userId':            [401,      200,   403,       403,      403,    403],
  'DELETE /api/workspace/members/:userId':           [401,      204,   403,       403,      403,    403],
  'GET /api/tokens':                                 [401,      200,   403,       403,      403,    403],
  'POST /api/tokens':                                [401,      201,   403,       403,      403,    403],
  'DELETE /api/tokens/:id':                          [401,      204,   403,       403,      403,    403],
  'GET /api/audit-events':                           [401,      200,   403,       403,      403,    403],
  'GET /api/codebases':                              [401,      200,   200,       200,      200,    403],
  'POST /api/codebases':                             [401,      201,   201,       403,      403,    403],
  'GET /api/codebases/:id':                          [401,      200,   200,       200,      200,    403],
  'DELETE /api/codebases/:id':                       [401,      204,   204,       403,      403,    403],
  'GET /api/codebases/:id/snapshots':                [401,      200,   200,       200,      200,    403],
  'POST /api/codebases/:id/snapshots':               [401,      202,   202,       403,      403,    403],
  'POST /api/push':                                  [401,      202,   202,       403,      403,    202],
  'GET /api/snapshots/:id':                          [401,      200,   200,       200,      200,    200],
  'DELETE /api/snapshots/:id':                       [401,      204,   204,       403,      403,    403],
  'GET /api/snapshots/:id/events':                   [401,      200,   200,       200,      200,    200],
  'GET /api/snapshots/:id/functions':                [401,      200,   200,       200,      200,    403],
  'GET /api/snapshots/:id/functions/:functionId':    [401,      200,   200,       200,      200,    403],
  'GET /api/snapshots/:id/modules':                  [401,      200,   200,       200,      200,    403],
  'GET /api/snapshots/:id/modules/:moduleId':        [401,      200,   200,       200,      200,    403],
  'GET /api/snapshots/:id/clusters':                 [401,      200,   200,       200,      200,    403],
  'GET /api/snapshots/:id/module-graph':             [401,      200,   200,       200,      200,    403],
  'GET /api/snapshots/:id/gravity':                  [401,      200,   200,       200,      200,    403],
  'POST /api/snapshots/:id/coverage':                [401,      201,   201,       403,      403,    403],
  'GET /api/snapshots/:id/export':                   [401,      200,   200,       200,      200,    403],
  'GET /api/carve-plans':                            [401,      200,   200,       200,      200,    403],
  'POST /api/carve-plans':                           [401,      201,   201,       403,      403,    403],
  'GET /api/carve-plans/:id':                        [401,      200,   200,       200,      200,    403],
  'PATCH /api/carve-plans/:id':                      [401,      200,   200,       403,      403,    403],
  'POST /api/carve-plans/:id/duplicate':             [401,      201,   201,       403,      403,    403],
  'DELETE /api/carve-plans/:id':                     [401,      204,   204,       403,      403,    403],
  'GET /api/shift':                                  [401,      200,   200,       200,      200,    403],
  'GET /api/outbox':                                 [401,      200,   403,       403,      403,    403],
  // Not a route: an unknown path tells a stranger nothing, and a member only that it does not exist.
  'GET /api/no-such-route':                          [401,      404,   404,       404,      404,    404],
};
const NOT_A_ROUTE = 'GET /api/no-such-route';

/** What the shared calls act on; made once, so allowed calls reach their handler and succeed. */
interface Fixtures {
  workspaceId: string;
  codebaseId: string;
  snapshotId: string;
  laterSnapshotId: string;
  functionId: string;
  planId: string;
  tinyZip: Buffer;
}

/** How to make one call succeed when it is allowed. */
interface Call {
  url: string;
  send?: (req: request.Test) => request.Test;
  /** The call ends the session it comes with, so it gets a session of its own. */
  endsSession?: boolean;
}

/** Calls that need ids, a body, or an object of their own to destroy (made anew for each caller). */
const CALLS: Record<string, (f: Fixtures, t: TestApp) => Call | Promise<Call>> = {
  'POST /api/auth/logout': () => ({ url: '/api/auth/logout', endsSession: true }),
  'PATCH /api/workspace/settings': () => ({ url: '/api/workspace/settings', send: (r) => r.send({ limit: 10 }) }),
  'POST /api/workspace/members': () => ({
    url: '/api/workspace/members',
    send: (r) => r.send({ email: `joining-${randomUUID()}@test.example`, displayName: 'Joining member', role: 'viewer' }),
  }),
  'PATCH /api/workspace/members/:userId': async (f, t) => ({
    url: `/api/workspace/members/${await throwawayMember(t, f)}`, send: (r) => r.send({ role: 'reviewer' }),
  }),
  'DELETE /api/workspace/members/:userId': async (f, t) => ({ url: `/api/workspace/members/${await throwawayMember(t, f)}` }),
  'POST /api/tokens': () => ({ url: '/api/tokens', send: (r) => r.send({ name: 'ci' }) }),
  'DELETE /api/tokens/:id': async (f, t) => ({ url: `/api/tokens/${(await saveToken(t, f.workspaceId, 'throwaway')).id}` }),
  'POST /api/codebases': () => ({ url: '/api/codebases', send: (r) => r.send({ name: `new-${randomUUID()}` }) }),
  'GET /api/codebases/:id': (f) => ({ url: `/api/codebases/${f.codebaseId}` }),
  'DELETE /api/codebases/:id': async (f, t) => {
    const codebase = await t.dataSource.getRepository(Codebase).save({ workspaceId: f.workspaceId, name: `throwaway-${randomUUID()}` });
    return { url: `/api/codebases/${codebase.id}` };
  },
  'GET /api/codebases/:id/snapshots': (f) => ({ url: `/api/codebases/${f.codebaseId}/snapshots` }),
  'POST /api/codebases/:id/snapshots': (f) => ({
    url: `/api/codebases/${f.codebaseId}/snapshots`, send: (r) => r.attach('file', f.tinyZip, 'tiny.zip'),
  }),
  // `{}` is enough to be queued; the worker refuses it later, which is not this test's business.
  'POST /api/push': () => ({ url: `/api/push?codebase=pushed-${randomUUID()}`, send: (r) => r.type('application/json').send('{}') }),
  'GET /api/snapshots/:id': (f) => ({ url: `/api/snapshots/${f.snapshotId}` }),
  'DELETE /api/snapshots/:id': async (f, t) => ({ url: `/api/snapshots/${(await createQueuedSnapshot(t.dataSource, f.workspaceId)).snapshot.id}` }),
  'GET /api/snapshots/:id/events': (f) => ({ url: `/api/snapshots/${f.snapshotId}/events` }),
  'GET /api/snapshots/:id/functions': (f) => ({ url: `/api/snapshots/${f.snapshotId}/functions` }),
  'GET /api/snapshots/:id/functions/:functionId': (f) => ({ url: `/api/snapshots/${f.snapshotId}/functions/${f.functionId}` }),
  'GET /api/snapshots/:id/modules': (f) => ({ url: `/api/snapshots/${f.snapshotId}/modules` }),
  'GET /api/snapshots/:id/modules/:moduleId': (f) => ({ url: `/api/snapshots/${f.snapshotId}/modules/${encodeURIComponent('file:src/orders/order.ts')}` }),
  'GET /api/snapshots/:id/clusters': (f) => ({ url: `/api/snapshots/${f.snapshotId}/clusters?level=file` }),
  'GET /api/snapshots/:id/module-graph': (f) => ({ url: `/api/snapshots/${f.snapshotId}/module-graph` }),
  'GET /api/snapshots/:id/gravity': (f) => ({ url: `/api/snapshots/${f.snapshotId}/gravity` }),
  'POST /api/snapshots/:id/coverage': (f) => ({
    url: `/api/snapshots/${f.snapshotId}/coverage?fileName=lcov.info`,
    send: (r) => r.type('text/plain').send('SF:src/orders/order.ts\nBRDA:3,0,0,1\nBRDA:3,0,1,0\nend_of_record\n'),
  }),
  'GET /api/snapshots/:id/export': (f) => ({ url: `/api/snapshots/${f.snapshotId}/export?format=json` }),
  'POST /api/carve-plans': (f) => ({ url: '/api/carve-plans', send: (r) => r.send({ snapshotId: f.snapshotId, name: 'New cut', from: 'empty' }) }),
  'GET /api/carve-plans/:id': (f) => ({ url: `/api/carve-plans/${f.planId}` }),
  'PATCH /api/carve-plans/:id': (f) => ({ url: `/api/carve-plans/${f.planId}`, send: (r) => r.send({ name: 'Renamed cut' }) }),
  'POST /api/carve-plans/:id/duplicate': (f) => ({ url: `/api/carve-plans/${f.planId}/duplicate`, send: (r) => r.send({}) }),
  'DELETE /api/carve-plans/:id': async (f, t) => {
    const plan = await t.dataSource.getRepository(CarvePlanRow).save({ workspaceId: f.workspaceId, snapshotId: f.snapshotId, name: 'Throwaway cut', level: 'folder', origin: 'empty' });
    return { url: `/api/carve-plans/${plan.id}` };
  },
  'GET /api/shift': (f) => ({ url: `/api/shift?before=${f.snapshotId}&after=${f.laterSnapshotId}` }),
};

async function throwawayMember(t: TestApp, f: Fixtures): Promise<string> {
  const user = await t.dataSource.getRepository(User).save({ email: `throwaway-${randomUUID()}@test.example`, displayName: 'Throwaway member' });
  await t.dataSource.getRepository(Membership).save({ workspaceId: f.workspaceId, userId: user.id, role: 'viewer' });
  return user.id;
}

async function saveToken(t: TestApp, workspaceId: string, name: string): Promise<{ id: string; secret: string }> {
  const secret = newTokenSecret();
  const token = await t.dataSource.getRepository(ApiToken).save({ workspaceId, name, tokenHash: hashToken(secret), prefix: secret.slice(0, 10) });
  return { id: token.id, secret };
}

/** `METHOD /path` of every route the app serves under /api, read from Express's own router tree. */
function servedApiRoutes(app: Express): string[] {
  interface Layer { rawPath?: string; route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } }
  const join = (prefix: string, p = '/') => (p === '/' ? prefix : `${prefix}${p}`);
  const found: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) found.push(`${method.toUpperCase()} ${join(prefix, layer.route.path)}`);
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, join(prefix, layer.rawPath));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return found.filter((r) => / \/api(\/|$)/.test(r));
}

describe('who may call which API route', () => {
  let t: TestApp;
  let f: Fixtures;
  const userIds = new Map<Role, string>();
  const sessions = new Map<Role, Awaited<ReturnType<typeof memberSession>>>();
  let tokenSecret: string;

  beforeAll(async () => {
    t = await openTestApp();
    const { workspace, members } = await createTestWorkspace(t.dataSource, ROLES);
    for (const { user, role } of members) {
      userIds.set(role, user.id);
      sessions.set(role, await memberSession(t.sessionPool, t.config, user.id, workspace.id));
    }
    tokenSecret = (await saveToken(t, workspace.id, 'ci')).secret;

    // Two ready snapshots of one codebase (for shift): one analysis, then its export pushed back, which needs no second scan.
    const architect = sessions.get('architect')!.headers;
    const codebase = await t.dataSource.getRepository(Codebase).save({ workspaceId: workspace.id, name: 'shop' });
    const smallZip = await zipWithYazl(Object.fromEntries(Object.entries(SMALL_CODEBASE).map(([file, text]) => [`shop/${file}`, text])));
    const first = await request(t.app).post(`/api/codebases/${codebase.id}/snapshots`).set(architect).attach('file', smallZip, 'shop.zip').expect(202);
    await t.jobs.settled();
    const snapshotId = first.body.snapshot.id as string;
    const exported = await request(t.app).get(`/api/snapshots/${snapshotId}/export?format=json`).set(architect).expect(200);
    const second = await request(t.app).post('/api/push?codebase=shop').set(architect).type('application/json').send(exported.text).expect(202);
    await t.jobs.settled();
    await request(t.app).get(`/api/snapshots/${second.body.snapshot.id}`).set(architect).expect(200).expect((res) => expect(res.body.snapshot.status).toBe('ready'));
    const functions = await request(t.app).get(`/api/snapshots/${snapshotId}/functions`).set(architect).expect(200);
    const plan = await request(t.app).post('/api/carve-plans').set(architect).send({ snapshotId, name: 'Shared cut' }).expect(201);
    f = {
      workspaceId: workspace.id,
      codebaseId: codebase.id,
      snapshotId,
      laterSnapshotId: second.body.snapshot.id,
      functionId: functions.body.items[0].id,
      planId: plan.body.plan.id,
      tinyZip: await zipWithYazl({ 'tiny/src/a.ts': 'export const a = 1;\n' }),
    };
  });
  afterAll(() => t.close());

  it('should have a row for every route the app serves under /api', () => {
    const listed = Object.keys(MATRIX).filter((r) => r !== NOT_A_ROUTE);
    expect(servedApiRoutes(t.app).sort()).toEqual(listed.sort());
    expect(Object.entries(MATRIX).filter(([, answers]) => answers.length !== CALLERS.length)).toEqual([]);
  });

  async function callAs(who: Caller, route: string): Promise<request.Response> {
    const [method, path] = route.split(' ') as [string, string];
    const call = await (CALLS[route]?.(f, t) ?? { url: path });
    const req = request(t.app)[method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](call.url);
    if (who === 'token') req.set('Authorization', `Bearer ${tokenSecret}`);
    else if (who !== 'anonymous') {
      const session = call.endsSession ? await memberSession(t.sessionPool, t.config, userIds.get(who)!, f.workspaceId) : sessions.get(who)!;
      req.set(session.headers);
    }
    return call.send ? call.send(req) : req;
  }

  for (const [route, answers] of Object.entries(MATRIX)) {
    CALLERS.forEach((who, column) => {
      const expected = answers[column];
      it(`${route} as ${who} → ${expected}`, async () => {
        const res = await callAs(who, route);
        const got = { status: res.status, error: res.body?.error?.code };
        if (expected === REACHED) {
          expect([401, 403]).not.toContain(res.status);
        } else if (expected === 401) {
          expect(got).toEqual({ status: 401, error: 'unauthenticated' });
        } else if (expected === 403) {
          expect(got).toEqual({ status: 403, error: 'forbidden' });
        } else if (expected >= 400) {
          expect(res.status).toBe(expected);
        } else {
          // The error's message shows in the diff when an allowed call fails for another reason.
          expect({ status: res.status, error: res.body?.error }).toEqual({ status: expected, error: undefined });
        }
      });
    });
  }
});
