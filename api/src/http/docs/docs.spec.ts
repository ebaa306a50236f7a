import * as fs from 'node:fs';
import * as path from 'node:path';
import request from 'supertest';
import { POLICY, TOKEN_ACTIONS, type Action } from '../policy';
import { openTestApp, type TestApp } from '../../testing/test-app';
import { apiRoutesOf, toOpenApiPath } from './app-routes';
import { findProjectRoot, loadOpenApiDocument, openApiFile } from './openapi-document';
import { isPublic, operationsOf } from './openapi-operations';

const { document } = loadOpenApiDocument();
const operations = operationsOf(document);

describe('the API reference at /api/docs', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await openTestApp({ SEAMLINE_WEB_DIST: '/nonexistent/web' });
  });
  afterAll(() => t.close());

  it('should answer a page whose scripts, styles and icons all come from this server', async () => {
    const res = await request(t.app).get('/api/docs').expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    const urls = [...res.text.matchAll(/\b(?:src|href)="([^"]*)"/g)].map((m) => m[1]);
    expect(urls).toEqual(expect.arrayContaining(['/api/docs/swagger-ui.css', '/api/docs/swagger-ui-bundle.js', '/api/docs/initializer.js']));
    for (const url of urls) {
      expect(url).toMatch(/^\/api\/docs\/[\w.-]+$/);
      await request(t.app).get(url).expect(200);
    }
    // The app's CSP forbids inline scripts, so every script must be a file.
    expect([...res.text.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)].every(([, attrs, body]) => /\bsrc="/.test(attrs) && body.trim() === '')).toBe(true);
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['content-security-policy']).not.toMatch(/script-src[^;]*unsafe-inline/);
  });

  it('should answer the same page at /api/docs/ and serve the script and swagger-ui files with their types', async () => {
    await request(t.app).get('/api/docs/').expect(200).expect('Content-Type', /^text\/html/);
    const script = await request(t.app).get('/api/docs/initializer.js').expect(200).expect('Content-Type', /javascript/);
    expect(script.text).toContain("url: '/api/docs/openapi.json'");
    expect(script.text).toContain('validatorUrl: null');
    await request(t.app).get('/api/docs/swagger-ui-bundle.js').expect(200).expect('Content-Type', /javascript/);
    await request(t.app).get('/api/docs/swagger-ui.css').expect(200).expect('Content-Type', /^text\/css/);
  });

  it('should not serve the rest of the swagger-ui package, its demo page among them', async () => {
    for (const file of ['index.html', 'swagger-initializer.js', 'package.json', 'swagger-ui.js.map']) {
      const res = await request(t.app).get(`/api/docs/${file}`).expect(404);
      expect(res.body.error.code).toBe('not_found');
    }
  });

  it('should answer docs/openapi.yaml as JSON, without a session', async () => {
    const res = await request(t.app).get('/api/docs/openapi.json').expect(200).expect('Content-Type', /^application\/json/);
    expect(res.body.openapi).toMatch(/^3\.(0|1)\.\d+$/);
    expect(res.body.info).toMatchObject({ title: expect.any(String), version: expect.any(String) });
    expect(Object.keys(res.body.paths).length).toBeGreaterThan(30);
    expect(res.body).toEqual(document);
  });

  it('should document exactly the routes the app answers under /api', () => {
    const routes = apiRoutesOf(t.app);
    // The walk must see the routers, or the comparison below would prove nothing.
    expect(routes).toEqual(expect.arrayContaining(['GET /api/health', 'POST /api/push', 'GET /api/snapshots/{id}/events', 'GET /api/docs']));
    const documented = operations.map((op) => op.key).sort();
    expect({ undocumented: routes.filter((r) => !documented.includes(r)), documentedButMissing: documented.filter((d) => !routes.includes(d)) })
      .toEqual({ undocumented: [], documentedButMissing: [] });
  });
});

describe('docs/openapi.yaml', () => {
  it('should be found from the source folder and from a compiled copy of it', () => {
    const root = findProjectRoot();
    expect(openApiFile()).toBe(path.join(root, 'docs', 'openapi.yaml'));
    expect(findProjectRoot(path.join(root, 'dist', 'server', 'api', 'src', 'http', 'docs'))).toBe(root);
  });

  it('should resolve every $ref and name each operation once', () => {
    const refs = new Set<string>();
    const walk = (v: unknown): void => {
      if (Array.isArray(v)) v.forEach(walk);
      else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) (k === '$ref' ? refs.add(String(x)) : walk(x));
    };
    walk(document);
    const resolve = (ref: string) => ref.replace(/^#\//, '').split('/').reduce<unknown>((o, k) => (o as Record<string, unknown> | undefined)?.[k], document);
    expect([...refs].filter((r) => !r.startsWith('#/') || resolve(r) === undefined)).toEqual([]);
    const ids = operations.map((op) => op.operation.operationId);
    expect(ids.every((id) => typeof id === 'string')).toBe(true);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('should name, for each operation that needs a caller, the roles the policy gives its action', () => {
    const wrong = operations.filter((op) => !isPublic(op)).flatMap(({ key, operation: o }) => {
      const action = o['x-action'] as Action;
      if (!(action in POLICY)) return [`${key}: x-action ${action} is not in the policy`];
      const problems: string[] = [];
      if ([...(o['x-roles'] ?? [])].sort().join() !== [...POLICY[action]].sort().join()) problems.push(`${key}: x-roles ${o['x-roles']} but ${action} allows ${POLICY[action]}`);
      if (o['x-api-token'] && !TOKEN_ACTIONS.includes(action)) problems.push(`${key}: x-api-token but tokens may not ${action}`);
      return problems;
    });
    expect(wrong).toEqual([]);
    expect(operations.filter(isPublic).filter((op) => op.operation['x-action'] || op.operation['x-roles'])).toEqual([]);
  });

  it('should ask for the anti-forgery header with the session on every change, and offer the token only where x-api-token says', () => {
    const wrong = operations.filter((op) => !isPublic(op)).flatMap(({ key, method, operation: o }) => {
      const schemes = (o.security ?? []).map((s) => Object.keys(s).sort().join('+'));
      const session = method === 'get' ? 'sessionCookie' : 'sessionCookie+xsrfHeader';
      const expected = [session, ...(o['x-api-token'] ? ['apiToken'] : [])].sort();
      return schemes.sort().join() === expected.join() ? [] : [`${key}: security ${schemes} instead of ${expected}`];
    });
    expect(wrong).toEqual([]);
  });

  it('should list the events the snapshot stream sends', () => {
    const source = fs.readFileSync(path.join(__dirname, '../snapshots/snapshot-events.ts'), 'utf8');
    const sent = [...new Set([...source.matchAll(/event: (\w+)\\n/g)].map((m) => m[1]))].sort();
    expect(sent.length).toBeGreaterThan(0);
    const stream = operations.find((op) => op.key === 'GET /api/snapshots/{id}/events');
    expect(Object.keys(stream?.operation['x-events'] ?? {}).sort()).toEqual(sent);
  });

  it('should spell Express paths the way the document does', () => {
    expect(toOpenApiPath('/api/snapshots/:id/functions/:functionId')).toBe('/api/snapshots/{id}/functions/{functionId}');
    expect(toOpenApiPath('/api/codebases/')).toBe('/api/codebases');
  });
});
