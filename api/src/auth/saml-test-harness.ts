import { inlineJobs } from '../testing/inline-jobs';
import type { Express } from 'express';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { inflateRawSync } from 'node:zlib';
import type { Pool } from 'pg';
import type { IdentityProviderInstance, ServiceProviderInstance } from 'samlify';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import type { DataSource } from 'typeorm';
import { createApp } from '../app';
import type { Config } from '../config';
import type { Workspace } from '../db/entities';
import { createIdentityProviderApp } from '../fakes/identity-provider/identity-provider.app';
import { configuredSp, createIdpEntity } from '../fakes/identity-provider/saml-entities';
import { CERT_FILE, ensureSigningKeys, type SigningKeys } from '../fakes/identity-provider/signing-keys';
import { createLogger, type Logger } from '../logger';
import { createTestWorkspace, openTestDataSource, openTestSessionPool, testConfig } from '../testing/test-database';

/**
 * Test-only: the API app and the identity-provider fake side by side, in process, on a fresh
 * workspace and a fresh IdP key pair in a temp folder. Nothing listens; supertest drives both.
 */
export interface SamlHarness {
  config: Config;
  app: Express;
  idpApp: Express;
  /** The fake's own samlify entities, for hand-built responses. */
  idp: IdentityProviderInstance;
  sp: ServiceProviderInstance;
  keys: SigningKeys;
  dataSource: DataSource;
  workspace: Workspace;
  tempDir: string;
  close(): Promise<void>;
}

/** Opens a harness; `env` overrides configuration, `logger` receives both apps' logs. */
export async function openSamlHarness(options: { env?: Record<string, string>; logger?: Logger } = {}): Promise<SamlHarness> {
  const tempDir = await mkdtemp(path.join(tmpdir(), 'seamline-saml-'));
  const keys = await ensureSigningKeys(path.join(tempDir, 'idp'));
  const dataSource = await openTestDataSource();
  const sessionPool: Pool = openTestSessionPool();
  const { workspace } = await createTestWorkspace(dataSource, []);
  const config = testConfig({
    SEAMLINE_DEMO_WORKSPACE: workspace.slug,
    SEAMLINE_IDP_CERT_FILE: path.join(tempDir, 'idp', CERT_FILE),
    ...options.env,
  });
  const logger = options.logger ?? createLogger('test', process.env['SEAMLINE_TEST_LOG_LEVEL'] ?? 'silent');
  const app = createApp({ config, dataSource, sessionPool, logger, jobs: inlineJobs(dataSource, config) });
  const idpApp = createIdentityProviderApp(config, keys, logger);
  return {
    config, app, idpApp, keys, dataSource, workspace, tempDir,
    idp: createIdpEntity(config, keys),
    sp: configuredSp(config),
    close: async () => {
      await sessionPool.end();
      await dataSource.destroy();
      await rm(tempDir, { recursive: true, force: true });
    },
  };
}

/** GET /api/auth/login with `agent`; returns the IdP path (with query) and the AuthnRequest ID. */
export async function beginSignIn(h: SamlHarness, agent: TestAgent): Promise<{ ssoPath: string; requestId: string }> {
  const res = await agent.get('/api/auth/login').expect(302);
  const location = new URL(res.headers['location'] as string);
  if (`${location.origin}${location.pathname}` !== h.config.saml.idpSsoUrl) throw new Error(`login redirected to ${location.href}`);
  const xml = inflateRawSync(Buffer.from(location.searchParams.get('SAMLRequest') ?? '', 'base64')).toString('utf8');
  const requestId = /\sID="([^"]+)"/.exec(xml)?.[1];
  if (!requestId) throw new Error('AuthnRequest without ID');
  return { ssoPath: `${location.pathname}${location.search}`, requestId };
}

/** Plays the person at the IdP fake: opens the chooser, picks `email`, returns the form it posts to the ACS. */
export async function chooseAtIdp(h: SamlHarness, ssoPath: string, email: string): Promise<{ action: string; samlResponse: string; page: string }> {
  const chooser = await request(h.idpApp).get(ssoPath).expect(200);
  const requestId = hiddenValue(chooser.text, 'requestId');
  const answer = await request(h.idpApp).post('/sso/login').type('form').send({ requestId, email }).expect(200);
  const action = /<form method="post" action="([^"]+)"/.exec(answer.text)?.[1] ?? '';
  return { action, samlResponse: hiddenValue(answer.text, 'SAMLResponse'), page: answer.text };
}

/** A full round trip up to (not including) the ACS post: a fresh, valid SAMLResponse for `email`. */
export async function freshResponse(h: SamlHarness, agent: TestAgent, email: string): Promise<{ samlResponse: string; requestId: string }> {
  const { ssoPath, requestId } = await beginSignIn(h, agent);
  const { samlResponse } = await chooseAtIdp(h, ssoPath, email);
  return { samlResponse, requestId };
}

/** POSTs a SAMLResponse to the ACS as the browser would. */
export function postToAcs(agent: TestAgent, samlResponse: string) {
  return agent.post('/api/auth/saml/acs').type('form').send({ SAMLResponse: samlResponse });
}

/** Base64 of a response's XML after `edit`, for tampering tests. */
export function editResponse(samlResponse: string, edit: (xml: string) => string): string {
  const xml = Buffer.from(samlResponse, 'base64').toString('utf8');
  const edited = edit(xml);
  if (edited === xml) throw new Error('the edit changed nothing');
  return Buffer.from(edited, 'utf8').toString('base64');
}

function hiddenValue(html: string, name: string): string {
  const value = new RegExp(`name="${name}" value="([^"]*)"`).exec(html)?.[1];
  if (value === undefined) throw new Error(`no hidden field ${name} in:\n${html}`);
  return value.replace(/&#(\d+);/g, (_m, code: string) => String.fromCharCode(Number(code)));
}
