// Storing an analysed snapshot (issue target: 200,000 functions and 20,000 modules in under
// 15 s). Times storeSnapshot — the one transaction a worker runs when an analysis ends — on a
// generated snapshot of that size, and, as the in-run baseline, on the same shape at a tenth of
// the size: a ratio near 10 means the cost grows linearly with the rows. Rounds alternate
// between the two sizes; the analysis tables are emptied and a CHECKPOINT is taken before each.
// Run through `SEAMLINE_BENCH_PART=store npm run bench` (which compiles the server first).
import { createRequire } from 'node:module';
import * as os from 'node:os';
import { PerformanceObserver } from 'node:perf_hooks';
import { machineCpu, median, progress, queuedSnapshot, runPart, serverModule } from './server-harness.mjs';

const require = createRequire(import.meta.url);
const { generateSnapshot, moduleCount, SIZES } = require('./synthetic-snapshot.cjs');
const ROUNDS = Math.max(1, Math.min(3, Number(process.env.SEAMLINE_BENCH_ROUNDS ?? 3)));
// Garbage collection in this process while a store runs (the rest of its CPU time is building parameters).
let gcMs = 0;
new PerformanceObserver((list) => {
  for (const entry of list.getEntries()) gcMs += entry.duration;
}).observe({ entryTypes: ['gc'] });
const TABLES = ['function_metric', 'function_detail', 'module_metric', 'module_edge', 'call_edge', 'import_edge', 'cluster'];

/** Rows storeSnapshot writes for a snapshot: two per function (metrics, detail) and one per everything else. */
function rowCount(s) {
  return 2 * s.functions.length + s.modules.length + s.moduleEdges.length + s.calls.length + s.imports.length + s.clusters.length;
}

await runPart('store', async (stack) => {
  const { dataSource } = await stack.database('seamline_bench_store');
  const { storeSnapshot } = serverModule('api/src/analysis/store-snapshot.js');
  const { parseSnapshot } = serverModule('analyzer/src/snapshot/parseSnapshot.js');
  const { createTestWorkspace } = serverModule('api/src/testing/test-database.js');
  const { workspace } = await createTestWorkspace(dataSource, ['owner']);

  progress('generating the snapshots…');
  const tenth = generateSnapshot(SIZES.storeTenth);
  // The generator's output must be a snapshot the product accepts: check the smaller one against the schema.
  parseSnapshot(JSON.stringify(tenth), 'synthetic snapshot (tenth)');
  const full = generateSnapshot(SIZES.store);
  const sizes = { tenth, full };

  const times = { tenth: [], full: [] };
  const client = { tenth: [], full: [] };
  const loadBefore = os.loadavg()[0];
  const storage = {};
  for (let round = 1; round <= ROUNDS; round++) {
    for (const [name, snapshot] of Object.entries(sizes)) {
      await dataSource.query(`TRUNCATE ${TABLES.join(', ')}`);
      const { snapshot: row } = await queuedSnapshot(dataSource, workspace.id, `${name}-${round}`);
      await dataSource.query('CHECKPOINT');
      gcMs = 0;
      const cpu = process.cpuUsage();
      const machine = machineCpu();
      const started = process.hrtime.bigint();
      const stored = await storeSnapshot(dataSource, row.id, snapshot);
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      const used = process.cpuUsage(cpu);
      const machineAfter = machineCpu();
      const machineBusy = (machineAfter.busyMs - machine.busyMs) / (machineAfter.totalMs - machine.totalMs);
      if (!stored) throw new Error('storeSnapshot reported nothing to do on a queued snapshot');
      times[name].push(ms);
      client[name].push({ cpuMs: (used.user + used.system) / 1000, gcMs, machineBusy });
      progress(`round ${round}: ${name} (${snapshot.functions.length.toLocaleString('en')} functions) stored in ${(ms / 1000).toFixed(2)} s`);
      if (name === 'full' && round === ROUNDS) {
        for (const table of TABLES) {
          const [{ rows, bytes }] = await dataSource.query(`SELECT count(*)::int AS rows, pg_total_relation_size($1::regclass)::bigint AS bytes FROM ${table}`, [table]);
          storage[table] = { rows, mb: Number(bytes) / 2 ** 20 };
        }
      }
    }
  }
  await dataSource.query(`TRUNCATE ${TABLES.join(', ')}`);

  const fullMs = median(times.full);
  const fullClient = client.full[times.full.indexOf(fullMs)];
  const tenthMs = median(times.tenth);
  const fullRows = rowCount(full);
  const tenthRows = rowCount(tenth);
  const figures = {
    rounds: ROUNDS,
    full: { functions: full.functions.length, modules: full.modules.length, rows: fullRows, medianMs: fullMs, ms: times.full },
    tenth: { functions: tenth.functions.length, modules: tenth.modules.length, rows: tenthRows, medianMs: tenthMs, ms: times.tenth },
    ratio: fullMs / tenthMs,
    client,
    loadAverage: { before: loadBefore, after: os.loadavg()[0] },
    storage,
    maxRssMb: process.resourceUsage().maxRSS / 1024,
  };
  const n = (x) => Math.round(x).toLocaleString('en');
  const lines = [
    `Storing a snapshot (storeSnapshot, one transaction), medians of ${ROUNDS} alternating rounds:`,
    '| snapshot | functions | modules | rows written | time (s) | rows/s |',
    '| --- | ---: | ---: | ---: | ---: | ---: |',
    `| baseline: a tenth of the size | ${n(tenth.functions.length)} | ${n(moduleCount(SIZES.storeTenth))} | ${n(tenthRows)} | ${(tenthMs / 1000).toFixed(2)} | ${n(tenthRows / (tenthMs / 1000))} |`,
    `| target size | ${n(full.functions.length)} | ${n(moduleCount(SIZES.store))} | ${n(fullRows)} | ${(fullMs / 1000).toFixed(2)} | ${n(fullRows / (fullMs / 1000))} |`,
    '',
    `ratio target / tenth: ${figures.ratio.toFixed(2)} (10 = linear); recorded target under 15 s: ${fullMs < 15_000 ? 'met' : 'not met'}; bench process peak ${n(figures.maxRssMb)} MB`,
    `of the target size's ${(fullMs / 1000).toFixed(1)} s, this process (building the parameters, JSON of the graphs) used ${(fullClient.cpuMs / 1000).toFixed(1)} s of CPU, ${(fullClient.gcMs / 1000).toFixed(1)} s of it collecting garbage; the rest is waiting on PostgreSQL`,
    `both cores were ${Math.round(100 * fullClient.machineBusy)} % busy during that store (this process, PostgreSQL and any other work on the machine); 1-minute load average ${figures.loadAverage.before.toFixed(1)} before the part, ${figures.loadAverage.after.toFixed(1)} after`,
    `stored size: ${Object.entries(storage).map(([t, s]) => `${t} ${n(s.rows)} rows ${n(s.mb)} MB`).join(', ')}`,
  ];
  return { figures, text: lines.join('\n') };
});
