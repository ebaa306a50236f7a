import { once } from 'node:events';
import * as http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { DEMO_PEOPLE } from '../demo/demo-people';
import { ApiToken, Codebase } from '../db/entities';
import { openTestApp, type TestApp } from '../testing/test-app';
import { createTestWorkspace } from '../testing/test-database';
import { memberSession } from '../testing/test-session';
import { hashToken, newTokenSecret } from './api-tokens';
import { freshResponse, openSamlHarness, postToAcs, type SamlHarness } from './saml-test-harness';

const ANTI_FORGERY = /anti-forgery token \(X-XSRF-TOKEN\)/;

/** The XSRF-TOKEN cookie a response set, with its attributes, or undefined. */
function xsrfCookie(res: request.Response): { value: string; attributes: string[] } | undefined {
  const line = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('XSRF-TOKEN='));
  if (!line) return undefined;
  const [pair, ...attributes] = line.split(';').map((part) => part.trim());
  return { value: decodeURIComponent(pair!.slice('XSRF-TOKEN='.length)), attributes: attributes.map((a) => a.toLowerCase()) };
}

/** A POST through node:http on a loopback port, so header bytes go out exactly as given. */
async function rawPost(t: TestApp, path: string, headers: Record<string, string>, body: string): Promise<{ status: number; body: { error?: { code: string } } }> {
  const server = t.app.listen(0, '127.0.0.1');
  await once(server, 'listening');
  try {
    const { port } = server.address() as AddressInfo;
    const req = http.request({ host: '127.0.0.1', port, path, method: 'POST', headers });
    // A Buffer, not a string: Node would otherwise encode the header together with a string body as UTF-8.
    req.end(Buffer.from(body));
    const [res] = (await once(req, 'response')) as [http.IncomingMessage];
    let text = '';
    for await (const chunk of res) text += String(chunk);
    return { status: res.statusCode ?? 0, body: JSON.parse(text) as { error?: { code: string } } };
  } finally {
    server.close();
  }
}

describe('the anti-forgery guard on cookie sessions', () => {
  let t: TestApp;
  let workspaceId: string;
  let architect: Awaited<ReturnType<typeof memberSession>>;
  let owner: Awaited<ReturnType<typeof memberSession>>;

  beforeAll(async () => {
    t = await openTestApp();
    const { workspace, members } = await createTestWorkspace(t.dataSource, ['owner', 'architect']);
    workspaceId = workspace.id;
    [owner, architect] = await Promise.all(members.map(({ user }) => memberSession(t.sessionPool, t.config, user.id, workspace.id)));
  });
  afterAll(() => t.close());

  const codebaseNamed = (name: string) => t.dataSource.getRepository(Codebase).findOneBy({ workspaceId, name });

  it('should refuse a change that carries the session cookie but no X-XSRF-TOKEN, and change nothing', async () => {
    const res = await request(t.app).post('/api/codebases').set('Cookie', architect.cookie).send({ name: 'forged-no-header' }).expect(403);
    expect(res.body.error).toEqual({ code: 'forbidden', message: expect.stringMatching(ANTI_FORGERY) });
    expect(await codebaseNamed('forged-no-header')).toBeNull();
  });

  it('should refuse a wrong token, whether of the same length, another length, or another session\'s', async () => {
    const sameLength = architect.csrf.replace(/^./, (c) => (c === 'a' ? 'b' : 'a'));
    for (const sent of [sameLength, `${architect.csrf}x`, architect.csrf.slice(1), owner.csrf, '']) {
      const res = await request(t.app).post('/api/codebases').set('Cookie', architect.cookie).set('X-XSRF-TOKEN', sent).send({ name: 'forged-wrong' });
      expect({ sent, status: res.status, message: res.body.error?.message }).toEqual({ sent, status: 403, message: expect.stringMatching(ANTI_FORGERY) });
    }
    expect(await codebaseNamed('forged-wrong')).toBeNull();
  });

  it('should refuse a token of the right length whose bytes are not ASCII with 403, not a server error', async () => {
    // One Latin-1 byte (0xE9) in place of the first character: as many characters as the real token, one byte more in UTF-8.
    // Sent with node:http, which writes header strings as Latin-1 (supertest would send UTF-8).
    const sent = `\u00e9${architect.csrf.slice(1)}`;
    const answer = await rawPost(t, '/api/codebases', { Cookie: architect.cookie, 'X-XSRF-TOKEN': sent, 'Content-Type': 'application/json' }, JSON.stringify({ name: 'forged-latin1' }));
    expect({ status: answer.status, code: answer.body.error?.code }).toEqual({ status: 403, code: 'forbidden' });
    expect(await codebaseNamed('forged-latin1')).toBeNull();
  });

  it('should not take the XSRF-TOKEN cookie itself as proof (a forged request sends cookies, not headers)', async () => {
    const res = await request(t.app).post('/api/codebases').set('Cookie', `${architect.cookie}; XSRF-TOKEN=${architect.csrf}`).send({ name: 'forged-cookie' }).expect(403);
    expect(res.body.error.message).toMatch(ANTI_FORGERY);
  });

  it('should guard PATCH and DELETE as well as POST', async () => {
    const codebase = await t.dataSource.getRepository(Codebase).save({ workspaceId, name: 'kept' });
    const del = await request(t.app).delete(`/api/codebases/${codebase.id}`).set('Cookie', architect.cookie).expect(403);
    expect(del.body.error.message).toMatch(ANTI_FORGERY);
    expect(await codebaseNamed('kept')).not.toBeNull();
    const patch = await request(t.app).patch('/api/workspace/settings').set('Cookie', owner.cookie).send({ limit: 3 }).expect(403);
    expect(patch.body.error.message).toMatch(ANTI_FORGERY);
  });

  it('should let the change through with the session\'s token', async () => {
    await request(t.app).post('/api/codebases').set(architect.headers).send({ name: 'honest' }).expect(201);
    expect(await codebaseNamed('honest')).not.toBeNull();
  });

  it('should answer a GET without the header and hand the token to same-origin script in a cookie', async () => {
    const res = await request(t.app).get('/api/me').set('Cookie', architect.cookie).expect(200);
    const cookie = xsrfCookie(res);
    expect(cookie?.value).toBe(architect.csrf);
    expect(cookie?.attributes).toContain('samesite=strict');
    expect(cookie?.attributes).toContain('path=/');
    expect(cookie?.attributes).not.toContain('httponly');
    // The same token on every answer of the session, so an open tab keeps working.
    expect(xsrfCookie(await request(t.app).get('/api/codebases').set('Cookie', architect.cookie).expect(200))?.value).toBe(architect.csrf);
  });

  it('should not set the cookie for a caller without a session', async () => {
    const res = await request(t.app).get('/api/me').expect(401);
    expect(xsrfCookie(res)).toBeUndefined();
  });

  it('should need no anti-forgery header for an API token (a browser never sends one by itself)', async () => {
    const secret = newTokenSecret();
    await t.dataSource.getRepository(ApiToken).save({ workspaceId, name: 'ci', tokenHash: hashToken(secret), prefix: secret.slice(0, 10) });
    const res = await request(t.app).post('/api/push?codebase=from-ci').set('Authorization', `Bearer ${secret}`).type('application/json').send('{}').expect(202);
    expect(res.body.snapshot.status).toBe('queued');
    expect(xsrfCookie(res)).toBeUndefined();
  });
});

describe('the anti-forgery guard and SAML sign-in', () => {
  let h: SamlHarness;
  const architect = DEMO_PEOPLE.find((p) => p.role === 'architect')!;

  beforeAll(async () => {
    h = await openSamlHarness();
  });
  afterAll(() => h.close());

  it('should let the identity provider\'s POST to the ACS through, then guard the new session', async () => {
    const agent = request.agent(h.app);
    // The agent holds a session cookie from login and posts to the ACS without any anti-forgery header, as a browser does.
    const { samlResponse } = await freshResponse(h, agent, architect.email);
    const acs = await postToAcs(agent, samlResponse).expect(303);
    expect(acs.headers['location']).toBe('/overview');

    const forged = await agent.post('/api/codebases').send({ name: 'after-sign-in' }).expect(403);
    expect(forged.body.error.message).toMatch(ANTI_FORGERY);
    const me = await agent.get('/api/me').expect(200);
    const token = xsrfCookie(me)?.value;
    expect(token).toMatch(/^[A-Za-z0-9_-]{20,}$/);
    await agent.post('/api/codebases').set('X-XSRF-TOKEN', token!).send({ name: 'after-sign-in' }).expect(201);
  });

  it('should answer a malformed ACS post with the sign-in page, not an anti-forgery refusal', async () => {
    const res = await request(h.app).post('/api/auth/saml/acs').type('form').send({ SAMLResponse: '' }).expect(303);
    expect(res.headers['location']).toMatch(/^\/sign-in\?error=/);
  });
});
