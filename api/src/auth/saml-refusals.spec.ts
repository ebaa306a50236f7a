import * as path from 'node:path';
import pino from 'pino';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { DEMO_PEOPLE } from '../demo/demo-people';
import { createSignedLoginResponse, renderUnsignedLoginResponse, type LoginResponseInput } from '../fakes/identity-provider/login-response';
import { createIdpEntity, createSpEntity } from '../fakes/identity-provider/saml-entities';
import { ensureSigningKeys } from '../fakes/identity-provider/signing-keys';
import { beginSignIn, editResponse, freshResponse, openSamlHarness, postToAcs, type SamlHarness } from './saml-test-harness';

const architect = DEMO_PEOPLE.find((p) => p.role === 'architect')!;
const ELSEWHERE = 'http://127.0.0.1:4399';

/** Builds the SAMLResponse to post, given a harness, the agent that started sign-in and its request ID. */
type Attack = (h: SamlHarness, agent: TestAgent, requestId: string) => Promise<string>;

const input = (h: SamlHarness, requestId: string, over: Partial<LoginResponseInput> = {}): LoginResponseInput => ({
  requestId,
  person: architect,
  workspaceSlug: h.workspace.slug,
  ...over,
});
const signed = async (h: SamlHarness, requestId: string, over: Partial<LoginResponseInput> = {}) =>
  (await createSignedLoginResponse(h.idp, h.sp, input(h, requestId, over))).context;
const oneByte = (xml: string, pattern: RegExp) =>
  xml.replace(pattern, (whole, value: string) => whole.replace(value, value.slice(0, -1) + (value.endsWith('x') ? 'y' : 'x')));

// Each attack gets a fresh, still-pending AuthnRequest, so only the defect under test can refuse it.
const attacks: [name: string, expected: RegExp, attack: Attack][] = [
  ['unsigned response', /could not be verified/, async (h, _a, id) =>
    Buffer.from(renderUnsignedLoginResponse(h.idp, h.sp, input(h, id)).context).toString('base64')],
  ['one byte changed in the NameID', /could not be verified/, async (h, agent) =>
    editResponse((await freshResponse(h, agent, architect.email)).samlResponse, (xml) => oneByte(xml, /<saml:NameID[^>]*>([^<]+)</))],
  ['one byte changed in the role attribute', /could not be verified/, async (h, agent) =>
    editResponse((await freshResponse(h, agent, architect.email)).samlResponse, (xml) =>
      oneByte(xml, /Name="role"[^>]*><saml:AttributeValue[^>]*>([^<]+)</))],
  ['expired response', /expired/, (h, _a, id) => signed(h, id, { now: new Date(Date.now() - 10 * 60_000) })],
  ['response not yet valid', /expired/, (h, _a, id) => signed(h, id, { now: new Date(Date.now() + 10 * 60_000) })],
  ['wrong audience', /another application/, async (h, _a, id) => {
    const sp = createSpEntity({ entityId: `${ELSEWHERE}/api/auth/saml/metadata`, acsUrl: h.config.saml.callbackUrl });
    return (await createSignedLoginResponse(h.idp, sp, input(h, id))).context;
  }],
  ['wrong recipient and destination', /another application/, async (h, _a, id) => {
    const sp = createSpEntity({ entityId: h.config.saml.spEntityId, acsUrl: `${ELSEWHERE}/api/auth/saml/acs` });
    return (await createSignedLoginResponse(h.idp, sp, input(h, id))).context;
  }],
  ['signature by another key', /could not be verified/, async (h, _a, id) => {
    const other = createIdpEntity(h.config, await ensureSigningKeys(path.join(h.tempDir, 'other-idp')));
    return (await createSignedLoginResponse(other, h.sp, input(h, id))).context;
  }],
  ['another issuer with the right key', /does not trust/, async (h, _a, id) => {
    const other = createIdpEntity(h.config, h.keys, `${ELSEWHERE}/metadata`);
    return (await createSignedLoginResponse(other, h.sp, input(h, id))).context;
  }],
  ['answer to a request Seamline never made', /current sign-in request/, (h) => signed(h, '_never-issued')],
  ['unknown role', /role “wizard”/, (h, _a, id) => signed(h, id, { person: { ...architect, role: 'wizard' } })],
  ['unknown workspace', /workspace “no-such-workspace”/, (h, _a, id) => signed(h, id, { workspaceSlug: 'no-such-workspace' })],
];

describe('SAML responses Seamline refuses', () => {
  let h: SamlHarness;
  const logLines: string[] = [];
  beforeAll(async () => {
    const logger = pino({ level: 'warn' }, { write: (line: string) => void logLines.push(line) });
    h = await openSamlHarness({ logger });
  });
  afterAll(() => h.close());

  async function expectRefused(agent: TestAgent, samlResponse: string, expected: RegExp): Promise<void> {
    const res = await postToAcs(agent, samlResponse).expect(303);
    const location = new URL(res.headers['location'] as string, 'http://app.invalid');
    expect(location.pathname).toBe('/sign-in');
    expect(location.searchParams.get('error')).toMatch(expected);
    await agent.get('/api/me').expect(401);
  }

  it.each(attacks)('refuses: %s', async (_name, expected, attack) => {
    const agent = request.agent(h.app);
    const { requestId } = await beginSignIn(h, agent);
    const before = logLines.length;
    await expectRefused(agent, await attack(h, agent, requestId), expected);
    const logged = logLines.slice(before).map((l) => JSON.parse(l) as { msg: string; reason?: string });
    expect(logged).toContainEqual(expect.objectContaining({ msg: 'SAML sign-in refused', reason: expect.any(String) }));
  });

  it('refuses a replayed response (same response posted twice)', async () => {
    const first = request.agent(h.app);
    const { samlResponse } = await freshResponse(h, first, architect.email);
    await postToAcs(first, samlResponse).expect(303).expect('Location', '/overview');
    const attacker = request.agent(h.app);
    await expectRefused(attacker, samlResponse, /current sign-in request/);
  });

  it('refuses a POST without SAMLResponse instead of starting a new login', async () => {
    const agent = request.agent(h.app);
    await expectRefused(agent, '', /missing/);
  });

  it('never answers 500 to garbage', async () => {
    const agent = request.agent(h.app);
    await expectRefused(agent, Buffer.from('<not-saml/>').toString('base64'), /could not be verified|sign-in request/);
    await expectRefused(agent, '%%%not base64%%%', /could not be verified|sign-in request/);
    await expectRefused(agent, Buffer.from('<samlp:Response xmlns:samlp="urn:oasis:names:tc:SAML:2.0:protocol" InResponseTo="x"><unclosed>').toString('base64'), /could not be verified|sign-in request/);
  });
});
