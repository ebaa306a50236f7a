import * as fs from 'node:fs';
import request from 'supertest';
import { functionQuerySchema, listFunctions } from '../../services/function-queries';
import { SMALL_CODEBASE } from '../../testing/test-snapshot';
import { openTestApp, type TestApp } from '../../testing/test-app';
import { createTestWorkspace } from '../../testing/test-database';
import { memberSession } from '../../testing/test-session';
import { zipWithYazl } from '../../uploads/testing/yazl-zip';

/** The API from upload to carve plan, in process: the job runs through the real handler right after the upload. */
describe('an analysis through the API', () => {
  let t: TestApp;
  let architect: Awaited<ReturnType<typeof memberSession>>;
  let viewer: Awaited<ReturnType<typeof memberSession>>;
  let owner: Awaited<ReturnType<typeof memberSession>>;
  let codebaseId: string;
  let snapshotId: string;

  const smallZip = () => zipWithYazl(Object.fromEntries(Object.entries(SMALL_CODEBASE).map(([f, text]) => [`shop/${f}`, text])));

  beforeAll(async () => {
    t = await openTestApp();
    const { workspace, members } = await createTestWorkspace(t.dataSource);
    const session = (role: string) => memberSession(t.sessionPool, t.config, members.find((m) => m.role === role)!.user.id, workspace.id);
    [owner, architect, viewer] = await Promise.all([session('owner'), session('architect'), session('viewer')]);
    const res = await request(t.app).post('/api/codebases').set(architect.headers).send({ name: 'shop' }).expect(201);
    codebaseId = res.body.codebase.id;
  });
  afterAll(() => t.close());

  it('should queue an uploaded zip and make it ready', async () => {
    const res = await request(t.app).post(`/api/codebases/${codebaseId}/snapshots`).set(architect.headers)
      .field('commit', 'abc123').attach('file', await smallZip(), 'shop.zip').expect(202);
    snapshotId = res.body.snapshot.id;
    expect(res.body.snapshot).toMatchObject({ status: 'queued', commit: 'abc123', source: 'upload' });
    await t.jobs.settled();
    const ready = await request(t.app).get(`/api/snapshots/${snapshotId}`).set(viewer.headers).expect(200);
    expect(ready.body.snapshot).toMatchObject({ status: 'ready', progress: 100, root: 'shop', hasModuleMap: true });
    expect(ready.body.snapshot.totals.functions).toBe(5);
    expect(fs.readdirSync(t.config.inboxDir).filter((f) => f.startsWith(snapshotId))).toEqual([]);
  });

  it('should page, sort and filter functions in the database', async () => {
    const all = await request(t.app).get(`/api/snapshots/${snapshotId}/functions?sort=cyclomatic&order=desc&pageSize=2`).set(viewer.headers).expect(200);
    expect(all.body).toMatchObject({ total: 5, page: 1, pageSize: 2, limit: 10 });
    expect(all.body.items.map((f: { name: string }) => f.name)).toEqual(['grade', 'total']);
    // Walking the pages gives every function once, ties broken by id: in the column's direction
    // for columns never empty, ascending (and empty ones last) for the others.
    const walk = async (query: string) => {
      const ids: { id: string; cyclomatic: number }[] = [];
      for (let page = 1; page <= 3; page++) {
        const res = await request(t.app).get(`/api/snapshots/${snapshotId}/functions?${query}&pageSize=2&page=${page}`).set(viewer.headers).expect(200);
        ids.push(...res.body.items.map((f: { id: string; cyclomatic: number }) => ({ id: f.id, cyclomatic: f.cyclomatic })));
      }
      return ids;
    };
    const byCyclomatic = (sign: number) => (a: { id: string; cyclomatic: number }, b: { id: string; cyclomatic: number }) =>
      sign * (a.cyclomatic - b.cyclomatic) || sign * (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
    const descending = await walk('sort=cyclomatic&order=desc');
    expect(descending).toHaveLength(5);
    expect(descending).toEqual([...descending].sort(byCyclomatic(-1)));
    const ascending = await walk('sort=cyclomatic&order=asc');
    expect(ascending).toEqual([...descending].sort(byCyclomatic(1)));
    const noCoverage = await walk('sort=crap&order=desc');
    expect(noCoverage.map((f) => f.id)).toEqual(descending.map((f) => f.id).sort());
    const over = await request(t.app).get(`/api/snapshots/${snapshotId}/functions?overLimit=true`).set(viewer.headers).expect(200);
    expect(over.body.items.map((f: { name: string }) => f.name)).toEqual(['grade']);
    // Bands are ranges of V(G): every function is in exactly one, each row says which.
    const banded: Record<string, string[]> = {};
    for (const band of ['calm', 'busy', 'tangled', 'knotted']) {
      const res = await request(t.app).get(`/api/snapshots/${snapshotId}/functions?band=${band}&sort=name&order=asc`).set(viewer.headers).expect(200);
      expect(res.body.items.every((f: { band: string }) => f.band === band)).toBe(true);
      expect(res.body.total).toBe(res.body.items.length);
      banded[band] = res.body.items.map((f: { name: string }) => f.name);
    }
    expect(banded).toEqual({ calm: ['<top-level>', '<top-level>', 'price', 'total'], busy: ['grade'], tangled: [], knotted: [] });
    const text = await request(t.app).get(`/api/snapshots/${snapshotId}/functions?q=pric&module=folder:src/pricing`).set(viewer.headers).expect(200);
    // Text matches the qualified name or the file: price() and its file's top-level code.
    expect(text.body.items.map((f: { name: string }) => f.name)).toEqual(['price', '<top-level>']);
    const bad = await request(t.app).get(`/api/snapshots/${snapshotId}/functions?sort=colour`).set(viewer.headers).expect(400);
    expect(bad.body.error.message).toMatch(/sort/);
  });

  it('should give the same pages whether a page reads its ids first (deep pages) or not', async () => {
    const sorts = Object.keys(functionQuerySchema.shape.sort.removeDefault().enum);
    for (const sort of sorts) {
      for (const order of ['asc', 'desc']) {
        for (const filter of [{}, { band: 'calm' }, { q: 'price' }]) {
          const walk = async (deepPageOffset: number) => {
            const names: string[] = [];
            for (let page = 1; page <= 3; page++) {
              const query = functionQuerySchema.parse({ sort, order, pageSize: '2', page: String(page), ...filter });
              names.push(...(await listFunctions(t.dataSource, snapshotId, query, undefined, deepPageOffset)).items.map((f: { id: string }) => f.id));
            }
            return names;
          };
          expect({ sort, order, filter, ids: await walk(0) }).toEqual({ sort, order, filter, ids: await walk(1000) });
        }
      }
    }
  });

  it('should open one function with its graph, formula and basis paths', async () => {
    const list = await request(t.app).get(`/api/snapshots/${snapshotId}/functions?q=total`).set(viewer.headers).expect(200);
    const f = list.body.items[0];
    const res = await request(t.app).get(`/api/snapshots/${snapshotId}/functions/${f.id}`).set(viewer.headers).expect(200);
    expect(res.body.basisPaths).toHaveLength(f.cyclomatic);
    expect(res.body.formula.text).toContain(`= ${f.cyclomaticStrict}`);
    expect(res.body.graph.decisions).toHaveLength(f.decisions);
    // Uploaded code is kept with each function, so the Flow screen can show it.
    expect(res.body.source).toContain('function total(');
  });

  it('should serve the module graph, gravity and a carve plan from the clusters', async () => {
    const graph = await request(t.app).get(`/api/snapshots/${snapshotId}/module-graph?level=folder`).set(viewer.headers).expect(200);
    expect(graph.body.nodes.map((n: { id: string }) => n.id)).toEqual(['folder:src/orders', 'folder:src/pricing']);
    expect(graph.body.links.length).toBeGreaterThan(0);
    // Links are index pairs into nodes; the lean nodes leave the full figures to the module route.
    const [from, to, weight] = graph.body.links[0];
    expect([graph.body.nodes[from].id, graph.body.nodes[to].id].sort()).toEqual(['folder:src/orders', 'folder:src/pricing']);
    expect(weight).toBeGreaterThan(0);
    expect(graph.body.nodes[0].reasons).toBeUndefined();
    expect(graph.body.clusters[0].size).toBeGreaterThan(0);
    const one = await request(t.app).get(`/api/snapshots/${snapshotId}/modules/${encodeURIComponent('folder:src/orders')}`).set(viewer.headers).expect(200);
    expect(one.body.module).toMatchObject({ id: 'folder:src/orders', level: 'folder', gravityRank: 1 });
    expect(one.body.module.reasons.length).toBeGreaterThan(0);
    await request(t.app).get(`/api/snapshots/${snapshotId}/modules/${encodeURIComponent('folder:src/nowhere')}`).set(viewer.headers).expect(404);
    const bad = await request(t.app).get(`/api/snapshots/${snapshotId}/modules/orders`).set(viewer.headers).expect(400);
    expect(bad.body.error.message).toMatch(/module id/);
    const clusters = await request(t.app).get(`/api/snapshots/${snapshotId}/clusters?level=file`).set(viewer.headers).expect(200);
    expect(clusters.body.items.flatMap((c: { members: string[] }) => c.members).sort()).toEqual(['file:src/orders/order.ts', 'file:src/pricing/price.ts']);
    // Sent gzipped to clients that accept it (supertest asks and inflates), plain to others.
    expect(graph.headers['content-encoding']).toBe('gzip');
    expect(graph.headers['vary']).toMatch(/Accept-Encoding/i);
    const plain = await request(t.app).get(`/api/snapshots/${snapshotId}/module-graph?level=folder`).set(viewer.headers).set('Accept-Encoding', 'identity').expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body).toEqual(graph.body);
    const gravity = await request(t.app).get(`/api/snapshots/${snapshotId}/gravity?level=folder`).set(viewer.headers).expect(200);
    expect(gravity.body.modules[0]).toMatchObject({ id: 'folder:src/orders', gravityRank: 1 });
    expect(gravity.body.modules[0].reasons.length).toBeGreaterThan(0);
    const plan = await request(t.app).post('/api/carve-plans').set(architect.headers).send({ snapshotId, name: 'First cut', level: 'file', from: 'empty' }).expect(201);
    expect(plan.body.evaluation.unassigned).toHaveLength(2);
    const edited = await request(t.app).patch(`/api/carve-plans/${plan.body.plan.id}`).set(architect.headers)
      .send({ assignments: { 'file:src/orders/order.ts': 'orders', 'file:src/pricing/price.ts': 'pricing' } }).expect(200);
    expect(edited.body.evaluation.services.map((s: { service: string }) => s.service)).toEqual(['orders', 'pricing']);
    expect(edited.body.evaluation.cut.calls).toBeGreaterThan(0);
    await request(t.app).patch(`/api/carve-plans/${plan.body.plan.id}`).set(architect.headers).send({ assignments: { 'file:nope.ts': 'x' } }).expect(400);
    await request(t.app).patch(`/api/carve-plans/${plan.body.plan.id}`).set(viewer.headers).send({ name: 'x' }).expect(403);
  });

  it('should export the snapshot in every format', async () => {
    const json = await request(t.app).get(`/api/snapshots/${snapshotId}/export?format=json`).set(viewer.headers).expect(200);
    expect(JSON.parse(json.text).functions).toHaveLength(5);
    const csv = await request(t.app).get(`/api/snapshots/${snapshotId}/export?format=csv`).set(viewer.headers).expect(200);
    expect(csv.text.trim().split('\n')).toHaveLength(6);
    await request(t.app).get(`/api/snapshots/${snapshotId}/export?format=sarif`).set(viewer.headers).expect(200);
    const graphml = await request(t.app).get(`/api/snapshots/${snapshotId}/export?format=graphml&level=folder`).set(viewer.headers).responseType('blob').expect(200);
    expect(String(graphml.body)).toContain('<graphml');
    expect(graphml.headers['content-disposition']).toMatch(/^attachment; filename="?shop-.*-folder\.graphml"?$/);
  });

  it('should import coverage and show covered outcomes and CRAP', async () => {
    const lcov = 'SF:src/orders/order.ts\nBRDA:3,0,0,1\nBRDA:3,0,1,0\nend_of_record\n';
    const res = await request(t.app).post(`/api/snapshots/${snapshotId}/coverage?fileName=lcov.info`).set(architect.headers).type('text/plain').send(lcov).expect(201);
    expect(res.body.coverage).toMatchObject({ format: 'lcov', fileName: 'lcov.info' });
    const list = await request(t.app).get(`/api/snapshots/${snapshotId}/functions?q=total`).set(viewer.headers).expect(200);
    expect(list.body.items[0].crap).not.toBeNull();
    await request(t.app).post(`/api/snapshots/${snapshotId}/coverage`).set(architect.headers).type('text/plain').send('no report here').expect(400);
  });

  it('should push a snapshot with a token, and refuse the token elsewhere', async () => {
    const created = await request(t.app).post('/api/tokens').set(owner.headers).send({ name: 'ci' }).expect(201);
    const secret = created.body.secret as string;
    const exported = await request(t.app).get(`/api/snapshots/${snapshotId}/export?format=json`).set(viewer.headers).expect(200);
    const pushed = await request(t.app).post('/api/push?codebase=shop-ci&commit=def456').set('Authorization', `Bearer ${secret}`)
      .type('application/json').send(exported.text).expect(202);
    await t.jobs.settled();
    const status = await request(t.app).get(`/api/snapshots/${pushed.body.snapshot.id}`).set('Authorization', `Bearer ${secret}`).expect(200);
    expect(status.body.snapshot).toMatchObject({ status: 'ready', source: 'push', commit: 'def456' });
    await request(t.app).get('/api/codebases').set('Authorization', `Bearer ${secret}`).expect(403);
    await request(t.app).delete(`/api/tokens/${created.body.token.id}`).set(owner.headers).expect(204);
    await request(t.app).post('/api/push?codebase=shop-ci').set('Authorization', `Bearer ${secret}`).type('application/json').send('{}').expect(401);
  });

  it('should compare two snapshots of the codebase', async () => {
    const res = await request(t.app).post(`/api/codebases/${codebaseId}/snapshots`).set(architect.headers).attach('file', await smallZip(), 'shop.zip').expect(202);
    await t.jobs.settled();
    const shift = await request(t.app).get(`/api/shift?before=${snapshotId}&after=${res.body.snapshot.id}`).set(viewer.headers).expect(200);
    expect(shift.body.shift).toBeDefined();
  });

  it('should refuse changes without the anti-forgery token', async () => {
    const res = await request(t.app).post('/api/codebases').set('Cookie', architect.cookie).send({ name: 'forged' }).expect(403);
    expect(res.body.error.message).toMatch(/anti-forgery/);
  });
});
