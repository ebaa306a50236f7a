// Read latency under load (issue targets: the functions page — 50 rows, sorted, filtered — p95
// under 150 ms; the module graph of 5,000 modules p95 under 300 ms; 20 concurrent readers for
// 30 s on loopback while one analysis of the demo runs). Starts the compiled API and one worker
// on a fresh database, stores a generated snapshot with 5,000 folder modules and 50,000
// functions, and loads each endpoint with 20 connections for SEAMLINE_BENCH_SECONDS (30): first
// idle, then while the demo's `before` version is analysed again and again (one at a time, each
// uploaded as a zip through the API as soon as the previous one is done).
// Run through `SEAMLINE_BENCH_PART=api-load npm run bench` (which compiles the server first).
import { createRequire } from 'node:module';
import * as os from 'node:os';
import {
  createCodebase, demoZip, LOAD_SECONDS, machineCpu, ownerSession, processCpuMs, progress, queuedSnapshot, runPart, serverModule, sleep, untilFinished, uploadZip,
} from './server-harness.mjs';
import { loadPaths } from './server-load.mjs';

const require = createRequire(import.meta.url);
const { generateSnapshot, SIZES } = require('./synthetic-snapshot.cjs');
const TARGETS = { functions: 150, moduleGraph: 300 };
const CONNECTIONS = 20;

/** Functions-page requests: mostly the busy band sorted by V(G), mixed with other filters and sorts. */
function functionPaths(snapshotId, totals) {
  const pages = (n) => Math.max(1, Math.ceil(n / 50));
  const paths = [];
  const q = (query) => paths.push(`/api/snapshots/${snapshotId}/functions?${query}&pageSize=50`);
  for (let i = 0; i < 40; i++) q(`sort=cyclomatic&order=desc&band=busy&page=${1 + (i % pages(totals.busy))}`);
  for (let i = 0; i < 15; i++) q(`sort=cyclomatic&order=desc&band=tangled&page=${1 + (i % pages(totals.tangled))}`);
  for (let i = 0; i < 15; i++) q(`sort=loc&order=desc&overLimit=true&page=${1 + (i % pages(totals.overLimit))}`);
  for (let i = 0; i < 10; i++) q(`sort=name&order=asc&module=${encodeURIComponent(`folder:packages/p${(i * 7) % 50}/src/area${(i * 13) % 100}`)}&page=1`);
  for (let i = 0; i < 10; i++) q(`sort=essential&order=desc&q=${['route', 'Invoice', 'plan', 'Depot', 'check'][i % 5]}&page=${1 + (i % 3)}`);
  for (let i = 0; i < 10; i++) q(`sort=cyclomatic&order=desc&page=${1 + i * 9}`);
  return paths;
}

/** Keeps exactly one demo analysis running until `stop()`: uploads the next as soon as one ends. */
function analysesInTurn({ base, headers, codebaseId, zip, dataSource }) {
  const finished = [];
  let stopping = false;
  let current = null;
  let failure = null;
  const done = (async () => {
    while (!stopping) {
      current = await uploadZip(base, headers, codebaseId, zip);
      finished.push(await untilFinished(dataSource, current));
    }
  })().catch((err) => {
    failure = err;
  });
  return {
    finished,
    /** Resolves once the first analysis is running. */
    started: (async () => {
      for (;;) {
        if (failure) throw failure;
        if (current) {
          const [row] = await dataSource.query('SELECT status FROM snapshot WHERE id = $1', [current]);
          if (row.status !== 'queued') return;
        }
        await sleep(200);
      }
    })(),
    async stop() {
      stopping = true;
      await done;
      if (failure) throw failure;
    },
  };
}

async function expectOk(base, headers, path, check) {
  const res = await fetch(`${base}${path}`, { headers });
  const text = await res.text();
  if (res.status !== 200) throw new Error(`GET ${path} answered ${res.status}: ${text.slice(0, 300)}`);
  check(JSON.parse(text));
  return text.length;
}

await runPart('api-load', async (stack) => {
  const { url, dataSource } = await stack.database('seamline_bench_api');
  const { storeSnapshot } = serverModule('api/src/analysis/store-snapshot.js');
  const session = await ownerSession(stack, dataSource, url);

  progress('generating and storing the snapshot the readers read…');
  let snapshot = generateSnapshot(SIZES.apiLoad);
  const bands = { busy: 0, tangled: 0, overLimit: 0 };
  for (const f of snapshot.functions) {
    if (f.cyclomatic > 10 && f.cyclomatic <= 20) bands.busy++;
    if (f.cyclomatic > 20 && f.cyclomatic <= 50) bands.tangled++;
    if (f.cyclomatic > 10) bands.overLimit++;
  }
  const { snapshot: row } = await queuedSnapshot(dataSource, session.workspace.id, 'synthetic-monorepo');
  await storeSnapshot(dataSource, row.id, snapshot);
  const shape = {
    functions: snapshot.functions.length,
    folders: snapshot.modules.filter((m) => m.level === 'folder').length,
    folderEdges: snapshot.moduleEdges.filter((e) => e.level === 'folder').length,
  };
  snapshot = null; // the readers' process should not carry it
  // What autovacuum does shortly after a real store (since PostgreSQL 13 inserts alone trigger
  // it): statistics, and the visibility map that lets a page's ids come from an index alone.
  await dataSource.query('VACUUM (ANALYZE)');

  const { base, child: api } = await stack.startApi(url);
  const worker = stack.startWorker(url, 0);
  // As a browser asks: the module graph is then sent gzipped (autocannon counts, never inflates).
  const headers = { Cookie: session.headers.Cookie, 'Accept-Encoding': 'gzip, deflate, br' };
  const functionsPaths = functionPaths(row.id, bands);
  const graphPath = `/api/snapshots/${row.id}/module-graph?level=folder`;
  const graphBytes = await expectOk(base, headers, graphPath, (body) => {
    if (body.nodes.length !== shape.folders) throw new Error(`module graph has ${body.nodes.length} nodes, expected ${shape.folders}`);
  });
  await expectOk(base, headers, functionsPaths[0], (body) => {
    if (body.items.length !== 50 || body.total !== bands.busy) throw new Error(`functions page: ${body.items.length} rows of ${body.total}, expected 50 of ${bands.busy}`);
  });

  // One analysis before any load: the demo's time on a quiet server, and a warmed-up worker.
  const zip = await demoZip(stack);
  const codebaseId = await createCodebase(base, session.headers, 'otterbay');
  progress('one demo analysis on the idle server…');
  const quiet = await untilFinished(dataSource, await uploadZip(base, session.headers, codebaseId, zip));
  if (quiet.status !== 'ready') throw new Error(`the demo analysis failed: ${quiet.error}`);

  const runs = {};
  const load = async (name, paths) => {
    progress(`${name}: ${CONNECTIONS} connections for ${LOAD_SECONDS} s…`);
    const machineBefore = machineCpu();
    const before = { api: processCpuMs(api.pid), worker: processCpuMs(worker.pid), postgres: stack.postgresCpuMs(), load: process.cpuUsage() };
    runs[name] = await loadPaths({ base, headers, paths, seconds: LOAD_SECONDS, connections: CONNECTIONS });
    const machineAfter = machineCpu();
    const total = machineAfter.totalMs - machineBefore.totalMs;
    const load = process.cpuUsage(before.load);
    runs[name].apiCpuShare = (processCpuMs(api.pid) - before.api) / total;
    runs[name].postgresCpuShare = (stack.postgresCpuMs() - before.postgres) / total;
    runs[name].workerCpuShare = (processCpuMs(worker.pid) - before.worker) / total;
    runs[name].loadCpuShare = (load.user + load.system) / 1000 / total;
    runs[name].machineBusy = (machineAfter.busyMs - machineBefore.busyMs) / (machineAfter.totalMs - machineBefore.totalMs);
    if (!stack.allAlive()) throw new Error(`a server process died during ${name} (logs in ${stack.dataDir}/logs)`);
  };
  const loadBefore = os.loadavg()[0];
  await load('functions, idle', functionsPaths);
  await load('module graph, idle', [graphPath]);
  const analyses = analysesInTurn({ base, headers: session.headers, codebaseId, zip, dataSource });
  await analyses.started;
  await load('functions, one analysis running', functionsPaths);
  await load('module graph, one analysis running', [graphPath]);
  progress('waiting for the last analysis to end…');
  await analyses.stop();
  const failed = analyses.finished.filter((a) => a.status !== 'ready');
  if (failed.length > 0) throw new Error(`${failed.length} demo analyses failed under load: ${failed[0].error}`);

  const figures = {
    seconds: LOAD_SECONDS, connections: CONNECTIONS, shape, bands, graphKb: graphBytes / 1024, runs,
    analyses: { quietMs: quiet.runMs, underLoadMs: analyses.finished.map((a) => a.runMs) },
    loadAverage: { before: loadBefore, after: os.loadavg()[0] },
  };
  const f = (x) => Math.round(x).toLocaleString('en');
  const pct = (x) => `${Math.round(100 * x)} %`;
  const target = (name) => (name.startsWith('functions') ? TARGETS.functions : TARGETS.moduleGraph);
  const lines = [
    `Reads under load: ${CONNECTIONS} connections for ${LOAD_SECONDS} s per row, loopback; a stored snapshot of ${f(shape.functions)} functions and ${f(shape.folders)} folder modules (${f(shape.folderEdges)} folder edges; the module graph answer is ${f(figures.graphKb)} kB of JSON, ${f(runs['module graph, idle'].meanKb)} kB as sent, gzipped, with its headers):`,
    '| endpoint, server state | requests | requests/s | p50 (ms) | p95 (ms) | p99 (ms) | max (ms) | errors | p95 target | met | machine busy | API | PostgreSQL | load generator | worker |',
    '| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- | ---: | ---: | ---: | ---: | ---: |',
    ...Object.entries(runs).map(([name, r]) => `| ${name} | ${f(r.requests)} | ${r.perSecond.toFixed(1)} | ${f(r.p50)} | ${f(r.p95)} | ${f(r.p99)} | ${f(r.max)} | ${r.errors} | < ${target(name)} ms | ${r.p95 < target(name) ? 'yes' : 'no'} | ${pct(r.machineBusy)} | ${pct(r.apiCpuShare)} | ${pct(r.postgresCpuShare)} | ${pct(r.loadCpuShare)} | ${pct(r.workerCpuShare)} |`),
    '',
    `demo analysis (otterbay before, ${f(figures.analyses.underLoadMs.length)} run under load): ${(quiet.runMs / 1000).toFixed(1)} s alone, ${figures.analyses.underLoadMs.map((ms) => (ms / 1000).toFixed(1)).join(' s, ')} s under the readers`,
    `machine busy: share of both cores' time used by any process during the row; API, PostgreSQL (the cluster's processes, ended ones included), load generator (autocannon, in this process) and worker: each one's share of both cores' time (other work on the machine is the rest). 1-minute load average ${loadBefore.toFixed(1)} before the load runs, ${figures.loadAverage.after.toFixed(1)} after`,
  ];
  return { figures, text: lines.join('\n') };
});
