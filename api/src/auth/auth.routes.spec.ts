import { rm } from 'node:fs/promises';
import * as path from 'node:path';
import request from 'supertest';
import { DEMO_PEOPLE } from '../demo/demo-people';
import { beginSignIn, chooseAtIdp, freshResponse, openSamlHarness, postToAcs, type SamlHarness } from './saml-test-harness';

const architect = DEMO_PEOPLE.find((p) => p.role === 'architect')!;
const viewer = DEMO_PEOPLE.find((p) => p.role === 'viewer')!;

function sessionCookie(res: request.Response): string | undefined {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  return cookies.find((c) => c.startsWith('seamline.sid='))?.split(';')[0];
}

describe('SAML sign-in through the identity-provider fake', () => {
  let h: SamlHarness;
  beforeAll(async () => {
    h = await openSamlHarness();
  });
  afterAll(() => h.close());

  it('signs the architect in: login → IdP → ACS → 303 /overview → /api/me', async () => {
    const agent = request.agent(h.app);
    const { ssoPath } = await beginSignIn(h, agent);
    const chooser = await request(h.idpApp).get(ssoPath).expect(200);
    expect(chooser.text).toContain('Otterbay sign-in (identity-provider fake)');
    expect(chooser.text).toContain('invented');
    for (const p of DEMO_PEOPLE) expect(chooser.text).toContain(p.email);

    const { action, samlResponse, page } = await chooseAtIdp(h, ssoPath, architect.email);
    expect(action).toBe(h.config.saml.callbackUrl);
    expect(page).toMatch(/<script nonce="[^"]+">/);
    const xml = Buffer.from(samlResponse, 'base64').toString('utf8');
    expect(xml.match(/<ds:Signature[ >]/g)).toHaveLength(2); // response and assertion

    const acs = await postToAcs(agent, samlResponse).expect(303);
    expect(acs.headers['location']).toBe('/overview');
    const cookie = acs.headers['set-cookie']?.[0] ?? '';
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);

    const me = await agent.get('/api/me').expect(200);
    expect(me.body).toMatchObject({
      user: { email: architect.email, displayName: architect.displayName },
      workspace: { slug: h.workspace.slug },
      role: 'architect',
    });
  });

  it('stores the anti-forgery token with the session at sign-in, so later reads never write the session', async () => {
    // express-session writes a regenerated session again as the sign-in response ends, after the
    // redirect went out; a token added by the next request could be overwritten by that write.
    const agent = request.agent(h.app);
    const acs = await postToAcs(agent, (await freshResponse(h, agent, architect.email)).samlResponse).expect(303);
    const sid = decodeURIComponent(sessionCookie(acs)!.split('=')[1]).slice(2).split('.')[0];
    const stored = async () => (await h.dataSource.query('SELECT sess FROM http_session WHERE sid = $1', [sid]))[0].sess;
    const atSignIn = await stored();
    expect(atSignIn.csrfToken).toEqual(expect.any(String));

    const me = await agent.get('/api/me').expect(200);
    const xsrf = ([] as string[]).concat(me.headers['set-cookie'] ?? []).find((c) => c.startsWith('XSRF-TOKEN='));
    expect(xsrf?.split(';')[0]).toBe(`XSRF-TOKEN=${atSignIn.csrfToken}`);
    expect(await stored()).toEqual(atSignIn);
  });

  it('issues a new session ID on sign-in (rotation)', async () => {
    const agent = request.agent(h.app);
    // A first sign-in gives the browser a session cookie; signing in again must replace it.
    const first = await postToAcs(agent, (await freshResponse(h, agent, viewer.email)).samlResponse).expect(303);
    const before = sessionCookie(first);
    const second = await postToAcs(agent, (await freshResponse(h, agent, architect.email)).samlResponse).expect(303);
    const after = sessionCookie(second);
    expect(before).toBeDefined();
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
    // The old ID no longer opens anything.
    await request(h.app).get('/api/me').set('Cookie', before!).expect(401);
    const me = await request(h.app).get('/api/me').set('Cookie', after!).expect(200);
    expect(me.body.role).toBe('architect');
  });

  it('ends the session on logout', async () => {
    const agent = request.agent(h.app);
    const signedIn = await postToAcs(agent, (await freshResponse(h, agent, architect.email)).samlResponse).expect(303);
    const cookie = sessionCookie(signedIn)!;
    await agent.get('/api/me').expect(200);
    const out = await agent.post('/api/auth/logout').expect(204);
    expect(String(out.headers['set-cookie'])).toMatch(/seamline\.sid=;.*Expires=Thu, 01 Jan 1970/);
    await agent.get('/api/me').expect(401);
    // Replaying the old cookie does not bring the session back: it was deleted from the store.
    await request(h.app).get('/api/me').set('Cookie', cookie).expect(401);
  });

  it('publishes SP metadata naming the entity ID and the ACS', async () => {
    const res = await request(h.app).get('/api/auth/saml/metadata').expect(200);
    expect(res.headers['content-type']).toMatch(/xml/);
    expect(res.text).toContain(`entityID="${h.config.saml.spEntityId}"`);
    expect(res.text).toContain(`Location="${h.config.saml.callbackUrl}"`);
    expect(res.text).toContain('WantAssertionsSigned="true"');
  });
});

describe('SAML sign-in without the IdP certificate', () => {
  let h: SamlHarness;
  beforeAll(async () => {
    h = await openSamlHarness();
  });
  afterAll(() => h.close());

  it('refuses at the ACS, then answers login with a clear 503 JSON error', async () => {
    const agent = request.agent(h.app);
    const { samlResponse } = await freshResponse(h, agent, architect.email);
    // The certificate disappears between the redirect to the IdP and the answer.
    await rm(path.dirname(h.config.saml.idpCertFile), { recursive: true, force: true });
    const acs = await postToAcs(agent, samlResponse).expect(303);
    expect(new URL(acs.headers['location'] as string, 'http://app.invalid').searchParams.get('error')).toContain('certificate was not found');
    await agent.get('/api/me').expect(401);

    const res = await request(h.app).get('/api/auth/login').expect(503);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body.error.code).toBe('idp_unavailable');
    expect(res.body.error.message).toContain(h.config.saml.idpCertFile);
    expect(res.body.error.message).toContain('SEAMLINE_IDP_CERT_FILE');
    expect(JSON.stringify(res.body)).not.toMatch(/\bat .*\.ts:\d+/);
  });
});
