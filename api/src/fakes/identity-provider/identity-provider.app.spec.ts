import { SAML } from '@node-saml/passport-saml';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import request from 'supertest';
import { loadConfig, type Config } from '../../config';
import { DEMO_PEOPLE } from '../../demo/demo-people';
import { createIdentityProviderApp } from './identity-provider.app';
import { ensureSigningKeys, type SigningKeys } from './signing-keys';

const architect = DEMO_PEOPLE.find((p) => p.role === 'architect')!;

/** An AuthnRequest as node-saml (the API's library) would send it, with overridable SP settings. */
async function ssoPath(config: Config, sp: { issuer?: string; callbackUrl?: string } = {}): Promise<string> {
  const saml = new SAML({
    entryPoint: config.saml.idpSsoUrl,
    issuer: sp.issuer ?? config.saml.spEntityId,
    callbackUrl: sp.callbackUrl ?? config.saml.callbackUrl,
    idpCert: 'unused',
    identifierFormat: 'urn:oasis:names:tc:SAML:1.1:nameid-format:emailAddress',
    disableRequestedAuthnContext: true,
  });
  const url = new URL(await saml.getAuthorizeUrlAsync('', undefined, {}));
  return `${url.pathname}${url.search}`;
}

describe('identity-provider fake', () => {
  let dir: string;
  let config: Config;
  let keys: SigningKeys;
  let app: ReturnType<typeof createIdentityProviderApp>;

  beforeAll(async () => {
    dir = await mkdtemp(path.join(tmpdir(), 'seamline-idp-'));
    keys = await ensureSigningKeys(dir);
    config = loadConfig({ SEAMLINE_ENV: 'test', SEAMLINE_SESSION_SECRET: 'x'.repeat(32), SEAMLINE_DEMO_WORKSPACE: 'otterbay-test' });
    app = createIdentityProviderApp(config, keys);
  });
  afterAll(() => rm(dir, { recursive: true, force: true }));

  it('publishes metadata with its entity ID, SSO endpoint and signing certificate', async () => {
    const res = await request(app).get('/metadata').expect(200);
    expect(res.text).toContain(`entityID="${config.saml.idpEntityId}"`);
    expect(res.text).toContain(`Location="${config.saml.idpSsoUrl}"`);
    const certBody = keys.cert.replace(/-----[^-]+-----|\s/g, '');
    expect(res.text.replace(/\s/g, '')).toContain(certBody);
  });

  it('shows a self-contained chooser of the invented people for a valid request', async () => {
    const res = await request(app).get(await ssoPath(config)).expect(200);
    expect(res.text).toContain('<title>Otterbay sign-in (identity-provider fake)</title>');
    expect(res.text).toMatch(/local identity-provider fake.*invented/s);
    for (const p of DEMO_PEOPLE) {
      for (const text of [p.displayName, p.title, p.role, p.email]) expect(res.text).toContain(text);
    }
    expect(res.headers['content-security-policy']).toContain("default-src 'none'");
    expect(res.text).not.toMatch(/<link|<script|src=|https?:\/\/(?!127\.0\.0\.1)/);
  });

  it('answers with a signed response carrying the person and the request, posted to the ACS', async () => {
    const chooser = await request(app).get(await ssoPath(config)).expect(200);
    const requestId = /name="requestId" value="([^"]+)"/.exec(chooser.text)![1]!;
    const res = await request(app).post('/sso/login').type('form').send({ requestId, email: architect.email }).expect(200);
    const nonce = /<script nonce="([^"]+)">/.exec(res.text)![1];
    expect(res.headers['content-security-policy']).toContain(`script-src 'nonce-${nonce}'`);
    expect(res.headers['content-security-policy']).toContain(`form-action 'self' ${new URL(config.saml.callbackUrl).origin}`);
    expect(res.text).toContain(`action="${config.saml.callbackUrl}"`);
    expect(res.text).toContain('<button class="continue" type="submit">Continue</button>');
    const xml = Buffer.from(/name="SAMLResponse" value="([^"]+)"/.exec(res.text)![1]!, 'base64').toString('utf8');
    expect(xml).toContain(`Destination="${config.saml.callbackUrl}"`);
    expect(xml).toContain(`Recipient="${config.saml.callbackUrl}"`);
    expect(xml).toContain(`<saml:Audience>${config.saml.spEntityId}</saml:Audience>`);
    expect(xml.match(new RegExp(`InResponseTo="${requestId}"`, 'g'))).toHaveLength(2);
    expect(xml).toMatch(new RegExp(`<saml:NameID Format="urn:oasis:names:tc:SAML:1.1:nameid-format:emailAddress">${architect.email}</saml:NameID>`));
    for (const [name, value] of [['email', architect.email], ['displayName', architect.displayName], ['role', 'architect'], ['workspace', 'otterbay-test']]) {
      expect(xml).toMatch(new RegExp(`Name="${name}"[^>]*><saml:AttributeValue[^>]*>${value}</saml:AttributeValue>`));
    }
    const issued = Date.parse(/IssueInstant="([^"]+)"/.exec(xml)![1]!);
    const until = Date.parse(/Conditions NotBefore="[^"]+" NotOnOrAfter="([^"]+)"/.exec(xml)![1]!);
    expect(until - issued).toBe(2 * 60_000);
    expect(xml.match(/<ds:Signature[ >]/g)).toHaveLength(2);

    // A request is answered once only.
    await request(app).post('/sso/login').type('form').send({ requestId, email: architect.email }).expect(400);
  });

  it.each([
    ['no SAMLRequest at all', async () => '/sso', /SAMLRequest parameter is missing/],
    ['a malformed SAMLRequest', async () => '/sso?SAMLRequest=bm90IGRlZmxhdGVk', /could not be read/],
    ['an unknown issuer', (c: Config) => ssoPath(c, { issuer: 'http://127.0.0.1:4399/sp' }), /does not know/],
    ['a foreign ACS URL', (c: Config) => ssoPath(c, { callbackUrl: 'http://127.0.0.1:4399/acs' }), /assertion consumer service/],
  ] as const)('refuses %s with a readable 400 page', async (_name, target, message) => {
    const res = await request(app).get(await target(config)).expect(400);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('Sign-in refused');
    expect(res.text).toMatch(message);
    expect(res.text).not.toMatch(/\bat .*\.(ts|js):\d+/);
  });

  it('refuses an unknown person or an unknown request', async () => {
    const chooser = await request(app).get(await ssoPath(config)).expect(200);
    const requestId = /name="requestId" value="([^"]+)"/.exec(chooser.text)![1]!;
    const stranger = await request(app).post('/sso/login').type('form').send({ requestId, email: 'mallory@otterbay.example' }).expect(400);
    expect(stranger.text).toContain('Choose one of the people');
    const unknown = await request(app).post('/sso/login').type('form').send({ requestId: '_nope', email: architect.email }).expect(400);
    expect(unknown.text).toContain('Start the sign-in again');
  });

  it('points visitors of / to the app', async () => {
    const res = await request(app).get('/').expect(200);
    expect(res.text).toContain(`href="${config.publicUrl}"`);
  });
});
