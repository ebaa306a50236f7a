#!/usr/bin/env node
// `npm run bench`: speed and memory as ratios against baselines measured in the same run.
// Each task runs in its own process (time from inside the process, after start-up; peak RSS
// from the process itself, worker threads included); medians over several alternating rounds.
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const ROUNDS = Number(process.env.SEAMLINE_BENCH_ROUNDS ?? 5);

function task(script, ...args) {
  return taskWith({}, script, ...args);
}

function taskWith(env, script, ...args) {
  const started = process.hrtime.bigint();
  const r = spawnSync(process.execPath, [path.join(root, 'scripts/bench', script), ...args], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 24, env: { ...process.env, ...env } });
  const wallMs = Number(process.hrtime.bigint() - started) / 1e6;
  if (r.status !== 0) throw new Error(`${script} ${args.join(' ')} failed:\n${r.stderr}`);
  return { ...JSON.parse(r.stdout.trim().split('\n').pop()), wallMs };
}

const f = (x) => x.toFixed(0);
const r = (x) => x.toFixed(2);
const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

function measure(tasks, rounds) {
  const runs = Object.fromEntries(Object.keys(tasks).map((k) => [k, []]));
  for (let i = 0; i < rounds; i++) for (const [name, run] of Object.entries(tasks)) runs[name].push(run());
  return Object.fromEntries(Object.entries(runs).map(([k, rs]) => [k, { ms: median(rs.map((r) => r.ms)), wall: median(rs.map((r) => r.wallMs)), mb: median(rs.map((r) => r.maxRssKb)) / 1024, last: rs[rs.length - 1] }]));
}

// SEAMLINE_BENCH_PART=scan, =map, =store, =api-load, =workers, =atlas runs one part only; =server
// the store, api-load and workers parts.
const PART = process.env.SEAMLINE_BENCH_PART ?? 'all';
const SERVER_PARTS = { store: 'server-store.mjs', 'api-load': 'server-api-load.mjs', workers: 'server-workers.mjs' };
const STACK_PARTS = { ...SERVER_PARTS, atlas: 'atlas-browser.mjs' };
const runs = (part) => PART === 'all' || PART === part || (PART === 'server' && part in SERVER_PARTS);
if (!['all', 'scan', 'map', 'server', ...Object.keys(STACK_PARTS)].includes(PART)) throw new Error(`Unknown SEAMLINE_BENCH_PART ${PART}`);

if (runs('scan') || runs('map')) {
  const build = spawnSync(path.join(root, 'node_modules/.bin/tsc'), ['-p', 'tsconfig.analyzer.json'], { cwd: root, stdio: 'inherit' });
  if (build.status !== 0) process.exit(1);
}
console.log(`Seamline benchmarks — ${new Date().toISOString().slice(0, 10)}, ${os.cpus().length} × ${os.cpus()[0].model}, ${Math.round(os.totalmem() / 2 ** 30)} GiB, node ${process.version}, ${ROUNDS} rounds (medians)\n`);
if (runs('scan')) {
// The scan keeps the compiler's bytecode between runs, as users' repeated scans do; its cache
// lives in a folder of this run's own, filled by one unrecorded scan. `scanCold` turns it off:
// the figure for a first scan ever.
const cacheDir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-bench-code-cache-'));
process.on('exit', () => fs.rmSync(cacheDir, { recursive: true, force: true }));
const cached = { SEAMLINE_CODE_CACHE: cacheDir };
taskWith(cached, 'scan.cjs');
const rx = measure({
  parse: () => task('parse.cjs'),
  scan: () => taskWith(cached, 'scan.cjs'),
  scanCold: () => taskWith({ SEAMLINE_CODE_CACHE: 'off' }, 'scan.cjs'),
  eslint: () => task('eslint.cjs'),
}, ROUNDS);
console.log(`rxjs@7.8.2 src: ${rx.scan.last.files} files, ${rx.scan.last.functions} functions`);
console.log('| task | median time after start-up (ms) | median whole process (ms) | peak memory (MB) |');
console.log('| --- | ---: | ---: | ---: |');
console.log(`| bare parse (typescript ${(await import('typescript')).default.version}, 1 process) | ${f(rx.parse.ms)} | ${f(rx.parse.wall)} | ${f(rx.parse.mb)} |`);
console.log(`| seamline scan --no-calls (graphs, ev(G), JSON written; ${os.availableParallelism()} cores available) | ${f(rx.scan.ms)} | ${f(rx.scan.wall)} | ${f(rx.scan.mb)} |`);
console.log(`| the same scan without its code cache (a first scan ever) | ${f(rx.scanCold.ms)} | ${f(rx.scanCold.wall)} | ${f(rx.scanCold.mb)} |`);
console.log(`| ESLint complexity rule alone (1 process) | ${f(rx.eslint.ms)} | ${f(rx.eslint.wall)} | ${f(rx.eslint.mb)} |`);
console.log('');
const ratios = [
  ['scan time / parse time (after start-up)', rx.scan.ms / rx.parse.ms, '≤ 1.5', rx.scan.ms / rx.parse.ms <= 1.5],
  ['scan time / parse time (whole process)', rx.scan.wall / rx.parse.wall, '≤ 1.5', rx.scan.wall / rx.parse.wall <= 1.5],
  ['ESLint time / scan time (after start-up)', rx.eslint.ms / rx.scan.ms, '≥ 3', rx.eslint.ms / rx.scan.ms >= 3],
  ['ESLint time / scan time (whole process)', rx.eslint.wall / rx.scan.wall, '≥ 3', rx.eslint.wall / rx.scan.wall >= 3],
  ['scan memory / parse memory', rx.scan.mb / rx.parse.mb, '≤ 2', rx.scan.mb / rx.parse.mb <= 2],
];
console.log('| ratio | measured | target | met |');
console.log('| --- | ---: | ---: | --- |');
for (const [name, value, target, met] of ratios) console.log(`| ${name} | ${r(value)} | ${target} | ${met ? 'yes' : 'no'} |`);
console.log(`\nWithout the code cache: scan / parse ${r(rx.scanCold.ms / rx.parse.ms)} after start-up, ${r(rx.scanCold.wall / rx.parse.wall)} whole process; ESLint / scan ${r(rx.eslint.ms / rx.scanCold.ms)} and ${r(rx.eslint.wall / rx.scanCold.wall)}.`);

const large = measure({ parse: () => task('parse.cjs', 'large'), scan: () => taskWith(cached, 'scan.cjs', 'large') }, Math.max(1, Math.min(3, ROUNDS)));
console.log(`\ntypescript/lib/typescript.js (one file; no ratio asked):`);
console.log('| task | median time after start-up (ms) | median whole process (ms) | peak memory (MB) |');
console.log('| --- | ---: | ---: | ---: |');
console.log(`| bare parse | ${f(large.parse.ms)} | ${f(large.parse.wall)} | ${f(large.parse.mb)} |`);
console.log(`| seamline scan --no-calls (${large.scan.last.functions} functions) | ${f(large.scan.ms)} | ${f(large.scan.wall)} | ${f(large.scan.mb)} |`);

}

// Issue 4: the call graph against its floor, on rxjs and on the JavaScript typeorm ships.
if (runs('map')) {
const callRounds = Math.max(1, Math.min(5, ROUNDS));
console.log('\nCall graph against creating the program and checker and resolving every call signature (same files, same options):');
console.log('| corpus | floor (ms) | call graph (ms) | ratio | target | met | call graph peak memory (MB) |');
console.log('| --- | ---: | ---: | ---: | ---: | --- | ---: |');
for (const [corpus, rounds] of [['rxjs', callRounds], ['typeorm', Math.max(1, Math.min(3, ROUNDS))]]) {
  const m = measure({ checker: () => task('calls.cjs', corpus, 'checker'), calls: () => task('calls.cjs', corpus, 'calls') }, rounds);
  const ratio = m.calls.ms / m.checker.ms;
  console.log(`| ${corpus} (${m.calls.last.files} files, ${m.calls.last.edges} edges) | ${f(m.checker.ms)} | ${f(m.calls.ms)} | ${r(ratio)} | ≤ 1.3 | ${ratio <= 1.3 ? 'yes' : 'no'} | ${f(m.calls.mb)} |`);
}

// Issue 4: Louvain plus gravity on a generated 100,000-module graph, and carve-plan evaluation.
function lastJson(script, ...args) {
  const run = spawnSync(process.execPath, [path.join(root, 'scripts/bench', script), ...args], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 26 });
  if (run.status !== 0) throw new Error(`${script} failed:\n${run.stderr}`);
  return JSON.parse(run.stdout.trim().split('\n').pop());
}
const lv = lastJson('louvain.cjs', '100000', '3');
console.log(`\nClusters and gravity on a generated ${lv.modules.toLocaleString('en')}-module graph (average degree ${lv.averageDegree.toFixed(1)}, weighted), medians of ${lv.rounds}:`);
console.log('| task | ms |');
console.log('| --- | ---: |');
console.log(`| graphology: building the graph | ${f(lv.buildMs)} |`);
console.log(`| graphology: Louvain alone (the baseline) | ${f(lv.louvainMs)} |`);
console.log(`| Seamline: a level indexed, clustered and ranked as mapCodebase does (merging edges and building the graph included) | ${f(lv.oursMs)} |`);
console.log(`ratio to Louvain alone ${r(lv.ratio)}, to build + Louvain ${r(lv.ratioWithBuild)}; recorded target under 3,000 ms: ${lv.oursMs < 3000 ? 'met' : 'not met'}; peak ${f(lv.maxRssKb / 1024)} MB`);
const cv = lastJson('carve.cjs');
console.log(`\nCarve-plan evaluation on 5,000 modules: prepare ${f(cv.prepareMs)} ms once; evaluate median ${f(cv.ms)} ms over ${cv.edits} edits (first ${f(cv.coldEvaluateMs)} ms); target under 100 ms: ${cv.under100ms ? 'met' : 'not met'}`);
}

// The server: storing a snapshot, reads under load, analysis throughput per worker count; and
// the Atlas in a browser against that server. Each part starts its own PostgreSQL cluster and
// processes and stops them, whatever happens.
const serverParts = Object.keys(STACK_PARTS).filter(runs);
if (serverParts.length > 0) {
  const { buildBenchServer, buildBenchWeb } = await import('./bench/server-harness.mjs');
  buildBenchServer();
  if (serverParts.includes('atlas')) buildBenchWeb();
  for (const part of serverParts) {
    console.log(`\n${part}:`);
    const run = spawnSync(process.execPath, [path.join(root, 'scripts/bench', STACK_PARTS[part])], { cwd: root, stdio: 'inherit' });
    if (run.status !== 0) throw new Error(`the ${part} benchmark failed (exit ${run.status ?? run.signal})`);
  }
}
