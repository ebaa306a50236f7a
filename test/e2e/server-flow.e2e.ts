/**
 * The Server issue's "done means", through the API alone against the running stack `npm test`
 * starts (real PostgreSQL, the API process, the worker process, the identity-provider fake):
 * sign in, upload the invented demo, watch progress to ready, page functions, open a function's
 * graph, read the module graph and gravity, make and evaluate a carve plan, compare the demo's
 * two versions, push a snapshot with a token, and see bad uploads refused with nothing kept.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import request from 'supertest';
import { buildDemoZip } from '../../api/src/demo/demo-zip';
import { zipWithYazl } from '../../api/src/uploads/testing/yazl-zip';
import { zipBytes, S_IFLNK } from '../../api/src/uploads/testing/zip-bytes';
import { signInOverHttp, type ApiSession } from './support/api-sign-in';

const api = process.env['SEAMLINE_E2E_URL']!;
const dataDir = process.env['SEAMLINE_E2E_DATA_DIR']!;

/** Reads the snapshot's server-sent events until it is ready or failed; returns every event seen. */
async function watchUntilDone(session: ApiSession, snapshotId: string, timeoutMs = 90_000): Promise<{ status: string; progress: number; phase: string | null; error: string | null }[]> {
  const res = await fetch(`${api}/api/snapshots/${snapshotId}/events`, { headers: { Cookie: session.cookie }, signal: AbortSignal.timeout(timeoutMs) });
  expect(res.headers.get('content-type')).toMatch(/text\/event-stream/);
  const events: { status: string; progress: number; phase: string | null; error: string | null }[] = [];
  const decoder = new TextDecoder();
  let buffer = '';
  const reader = res.body!.getReader();
  for (let read = await reader.read(); !read.done; read = await reader.read()) {
    buffer += decoder.decode(read.value, { stream: true });
    let end;
    while ((end = buffer.indexOf('\n\n')) >= 0) {
      const block = buffer.slice(0, end);
      buffer = buffer.slice(end + 2);
      const data = block.split('\n').find((l) => l.startsWith('data: '));
      if (block.includes('event: snapshot') && data) events.push(JSON.parse(data.slice(6)));
    }
  }
  return events;
}

describe('the server, through its API alone', () => {
  let architect: ApiSession;
  let owner: ApiSession;
  let codebaseId: string;
  let beforeId: string;
  let afterId: string;
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-e2e-'));

  beforeAll(async () => {
    architect = await signInOverHttp(api, 'tomas.reyes@otterbay.example');
    owner = await signInOverHttp(api, 'nadia.okafor@otterbay.example');
    const res = await request(api).post('/api/codebases').set(architect.headers).send({ name: `dispatch-e2e-${Date.now()}` }).expect(201);
    codebaseId = res.body.codebase.id;
  });
  afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

  async function uploadDemo(version: 'before' | 'after'): Promise<string> {
    const zip = path.join(tmp, `${version}.zip`);
    await buildDemoZip(version, zip);
    const res = await request(api).post(`/api/codebases/${codebaseId}/snapshots`).set(architect.headers)
      .field('commit', version === 'before' ? 'v314' : 'v400').attach('file', zip).expect(202);
    return res.body.snapshot.id;
  }

  it('should analyse an uploaded zip, with progress streamed until it is ready', async () => {
    beforeId = await uploadDemo('before');
    const events = await watchUntilDone(architect, beforeId);
    expect(events.at(-1)).toMatchObject({ status: 'ready', progress: 100 });
    expect(events.some((e) => e.status === 'running' && e.progress > 0 && e.progress < 100)).toBe(true);
  });

  it('should page through functions, sorted and filtered on the server', async () => {
    const first = await request(api).get(`/api/snapshots/${beforeId}/functions?pageSize=20&sort=cyclomatic&order=desc`).set(architect.headers).expect(200);
    const second = await request(api).get(`/api/snapshots/${beforeId}/functions?pageSize=20&page=2&sort=cyclomatic&order=desc`).set(architect.headers).expect(200);
    expect(first.body.total).toBeGreaterThan(40);
    expect(first.body.items).toHaveLength(20);
    expect(first.body.items.at(-1).cyclomatic).toBeGreaterThanOrEqual(second.body.items[0].cyclomatic);
    expect(first.body.items[0].folder).toBe('folder:src/dispatch-core');
    const over = await request(api).get(`/api/snapshots/${beforeId}/functions?overLimit=true`).set(architect.headers).expect(200);
    expect(over.body.items.every((f: { cyclomatic: number }) => f.cyclomatic > 10)).toBe(true);
  });

  it('should open one function with its control-flow graph and basis paths', async () => {
    const list = await request(api).get(`/api/snapshots/${beforeId}/functions?q=planDispatch`).set(architect.headers).expect(200);
    const fn = list.body.items[0];
    const res = await request(api).get(`/api/snapshots/${beforeId}/functions/${fn.id}`).set(architect.headers).expect(200);
    expect(res.body.graph.edges.length).toBe(fn.edges);
    expect(res.body.basisPaths).toHaveLength(fn.cyclomaticStrict);
    expect(fn.cyclomatic).toBeGreaterThan(25);
  });

  it('should rank the dispatch core first in gravity and serve the module graph', async () => {
    const gravity = await request(api).get(`/api/snapshots/${beforeId}/gravity?level=folder`).set(architect.headers).expect(200);
    expect(gravity.body.modules[0].id).toBe('folder:src/dispatch-core');
    const graph = await request(api).get(`/api/snapshots/${beforeId}/module-graph?level=folder`).set(architect.headers).expect(200);
    expect(graph.body.nodes.length).toBeGreaterThanOrEqual(7);
    expect(graph.body.clusters.length).toBeGreaterThan(1);
  });

  it('should create a carve plan from the clusters and evaluate an edit of it', async () => {
    const plan = await request(api).post('/api/carve-plans').set(architect.headers).send({ snapshotId: beforeId, name: 'e2e plan', level: 'folder', from: 'clusters' }).expect(201);
    expect(plan.body.evaluation.services.length).toBeGreaterThan(1);
    const edited = await request(api).patch(`/api/carve-plans/${plan.body.plan.id}`).set(architect.headers)
      .send({ assignments: { 'folder:src/billing': 'billing', 'folder:src/notifications': 'notifications' } }).expect(200);
    expect(edited.body.evaluation.services.map((s: { service: string }) => s.service)).toEqual(expect.arrayContaining(['billing', 'notifications']));
    expect(edited.body.evaluation.cut.calls).toBeGreaterThan(0);
  });

  it('should compare the demo\'s two versions: the core\'s ΣV goes down', async () => {
    afterId = await uploadDemo('after');
    expect((await watchUntilDone(architect, afterId)).at(-1)?.status).toBe('ready');
    const res = await request(api).get(`/api/shift?before=${beforeId}&after=${afterId}`).set(architect.headers).expect(200);
    expect(res.body.shift).toBeDefined();
    const core = async (id: string) => (await request(api).get(`/api/snapshots/${id}/modules?level=folder`).set(architect.headers).expect(200)).body.items
      .filter((m: { path: string }) => /dispatch-core/.test(m.path)).reduce((n: number, m: { cyclomatic: number }) => Math.max(n, m.cyclomatic), 0);
    expect(await core(afterId)).toBeLessThan(await core(beforeId));
  });

  it('should take a pushed snapshot from CI with a workspace token', async () => {
    const token = await request(api).post('/api/tokens').set(owner.headers).send({ name: 'e2e ci' }).expect(201);
    const exported = await request(api).get(`/api/snapshots/${beforeId}/export?format=json`).set(architect.headers).expect(200);
    const pushed = await request(api).post(`/api/push?codebase=dispatch-ci-${Date.now()}&commit=abc123&branch=main`)
      .set('Authorization', `Bearer ${token.body.secret}`).type('application/json').send(exported.text).expect(202);
    const id = pushed.body.snapshot.id;
    const deadline = Date.now() + 60_000;
    let status = '';
    while (Date.now() < deadline && status !== 'ready' && status !== 'failed') {
      status = (await request(api).get(`/api/snapshots/${id}`).set('Authorization', `Bearer ${token.body.secret}`).expect(200)).body.snapshot.status;
      if (status !== 'ready') await new Promise((r) => setTimeout(r, 300));
    }
    expect(status).toBe('ready');
    await request(api).get(`/api/codebases`).set('Authorization', `Bearer ${token.body.secret}`).expect(403);
  });

  it('should refuse each bad upload with a message and keep nothing of it', async () => {
    const countSnapshots = async () => (await request(api).get(`/api/codebases/${codebaseId}/snapshots`).set(architect.headers).expect(200)).body.items.length;
    const inbox = () => (fs.existsSync(path.join(dataDir, 'inbox')) ? fs.readdirSync(path.join(dataDir, 'inbox'), { recursive: true }) : []).filter((f) => String(f).includes('.'));
    const snapshotsBefore = await countSnapshots();
    const inboxBefore = inbox().length;
    const upload = (body: Buffer, name = 'code.zip') => request(api).post(`/api/codebases/${codebaseId}/snapshots`).set(architect.headers).attach('file', body, name);
    const cases: [string, () => Promise<request.Response>, number, RegExp][] = [
      ['not a zip', () => upload(Buffer.from('just some text, not an archive')), 422, /zip/i],
      ['an empty file', () => upload(Buffer.alloc(0)), 400, /empty/i],
      ['an entry outside the root', async () => upload(zipBytes([{ name: '../escape.ts', data: Buffer.from('export const x = 1;') }])), 422, /escape\.ts/],
      ['an absolute path', async () => upload(zipBytes([{ name: '/etc/passwd.ts', data: Buffer.from('x') }])), 422, /passwd/],
      ['a link', async () => upload(zipBytes([{ name: 'src/link.ts', data: Buffer.from('/etc/passwd'), unixMode: S_IFLNK | 0o777 }])), 422, /link/i],
      ['no file part', () => request(api).post(`/api/codebases/${codebaseId}/snapshots`).set(architect.headers).field('commit', 'abc'), 400, /file/i],
      ['a zip with no files', async () => upload(await zipWithYazl({}, ['empty/'])), 422, /no files|empty/i],
    ];
    for (const [what, send, status, message] of cases) {
      const res = await send();
      expect({ what, status: res.status }).toEqual({ what, status });
      expect({ what, message: res.body.error?.message }).toEqual({ what, message: expect.stringMatching(message) });
    }
    expect(await countSnapshots()).toBe(snapshotsBefore);
    expect(inbox().length).toBe(inboxBefore);
  });
});
