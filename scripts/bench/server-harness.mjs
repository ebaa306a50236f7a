// What the server benchmarks share: the server compiled once to dist/bench-server, a private
// PostgreSQL cluster under .data/bench on a free loopback port, the API and worker processes
// started as `npm start` starts them, and a clean stop of all of it — also on an error or a
// signal, so no process or cluster outlives a benchmark.
import * as fs from 'node:fs';
import { createRequire } from 'node:module';
import * as path from 'node:path';
import { fileURLToPath } from 'node:url';
import { randomBytes } from 'node:crypto';
import { LocalPostgres } from '../lib/postgres.mjs';
import { freePort, ProcessGroup, waitForHttp } from '../lib/processes.mjs';
import { run } from '../lib/run.mjs';
import { ensureSystemPackages } from '../lib/system-packages.mjs';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const SERVER_DIST = path.join(root, 'dist/bench-server');
const BENCH_DIR = path.join(root, '.data/bench');
const require = createRequire(import.meta.url);

/** Compiles the API, worker and analyzer to dist/bench-server (what the parts load and run). */
export function buildBenchServer() {
  progress('compiling the server (tsc → dist/bench-server)…');
  run(path.join(root, 'node_modules/.bin/tsc'), ['-p', 'tsconfig.server.json', '--outDir', SERVER_DIST], { cwd: root });
}

/** The web app built for the browser benchmark (the API serves dist/bench-web/browser). */
export const WEB_DIST = path.join(root, 'dist/bench-web');

/** Builds the Angular app as `npm start` does, into dist/bench-web. */
export function buildBenchWeb() {
  progress('building the web app (ng build → dist/bench-web)…');
  const configuration = process.env.SEAMLINE_BENCH_WEB_CONFIG ?? 'production';
  run(path.join(root, 'node_modules/.bin/ng'), ['build', 'web', '--configuration', configuration, '--output-path', WEB_DIST], {
    cwd: root,
    env: { ...process.env, NG_CLI_ANALYTICS: 'false', NG_FORCE_TTY: 'false' },
  });
}

/** A module of the compiled server, e.g. serverModule('api/src/analysis/store-snapshot.js'). */
export function serverModule(relative) {
  const file = path.join(SERVER_DIST, relative);
  if (!fs.existsSync(file)) throw new Error(`${path.relative(root, file)} is missing: run \`SEAMLINE_BENCH_PART=<part> npm run bench\`, which compiles the server first.`);
  return require(file);
}

/** Progress goes to stderr, so stdout carries only the part's report. */
export function progress(message) {
  process.stderr.write(`\x1b[36m[bench]\x1b[0m ${message}\n`);
}

/** Seconds to run each load, SEAMLINE_BENCH_SECONDS (30 unless set; shorter for a quick try). */
export const LOAD_SECONDS = Number(process.env.SEAMLINE_BENCH_SECONDS ?? 30);

/**
 * One benchmark's servers. `start()` brings up the cluster; `database(name)` gives a fresh,
 * migrated database; `startApi` / `startWorker` run the compiled processes on it; `stop()` ends
 * every process, closes connections and stops the cluster (it is idempotent).
 */
export class BenchStack {
  #group = new ProcessGroup();
  #dataSources = [];
  #pools = [];
  #postgres = null;
  #stopping = null;

  constructor(name) {
    this.name = name;
    this.dataDir = path.join(BENCH_DIR, name);
    this.sessionSecret = randomBytes(32).toString('base64url');
  }

  async start() {
    ensureSystemPackages(['postgresql']);
    fs.rmSync(this.dataDir, { recursive: true, force: true });
    fs.mkdirSync(path.join(this.dataDir, 'logs'), { recursive: true });
    this.#postgres = new LocalPostgres({ baseDir: BENCH_DIR, port: await freePort() });
    // A cluster left running by a benchmark that was killed listens on another port: stop it first.
    this.#postgres.stop();
    this.#postgres.start();
  }

  /** A freshly created database with every migration applied, and a connected DataSource on it. */
  async database(name) {
    this.#postgres.recreateDatabase(name);
    const url = this.#postgres.url(name);
    const { createDataSource } = serverModule('api/src/db/data-source.js');
    const dataSource = await createDataSource(url).initialize();
    this.#dataSources.push(dataSource);
    await dataSource.runMigrations({ transaction: 'each' });
    return { url, dataSource };
  }

  /** A pg pool on a database (closed by stop()). */
  pool(url, max = 2) {
    const { Pool } = require('pg');
    const pool = new Pool({ connectionString: url, max });
    this.#pools.push(pool);
    return pool;
  }

  /** The environment the API and workers get, as scripts/test.mjs sets it for its stack. */
  env(url, apiPort, extra = {}) {
    return {
      SEAMLINE_ENV: 'test',
      SEAMLINE_DATABASE_URL: url,
      SEAMLINE_SESSION_SECRET: this.sessionSecret,
      SEAMLINE_DATA_DIR: this.dataDir,
      SEAMLINE_API_PORT: String(apiPort),
      // Per-request log lines would be piped through this process, which also drives the load.
      SEAMLINE_LOG_LEVEL: 'warn',
      ...extra,
    };
  }

  /** Starts the API on a free port; resolves with its base URL and process once /api/health answers. */
  async startApi(url, extra = {}) {
    const port = await freePort();
    const child = this.#group.start('api', path.join(SERVER_DIST, 'api/src/main.js'), this.env(url, port, extra), { logFile: path.join(this.dataDir, 'logs', 'api.log') });
    const base = `http://127.0.0.1:${port}`;
    await waitForHttp(`${base}/api/health`, 60_000);
    return { base, child };
  }

  /** Starts one worker process (one job at a time unless told otherwise). */
  startWorker(url, index = 0, extra = {}) {
    return this.#group.start(`worker-${index}`, path.join(SERVER_DIST, 'api/src/worker/main.js'),
      this.env(url, 1, { SEAMLINE_WORKER_CONCURRENCY: '1', ...extra }), { logFile: path.join(this.dataDir, 'logs', `worker-${index}.log`) });
  }

  /** Stops the given children only (e.g. one run's workers), SIGTERM then SIGKILL. */
  async stopChildren(children) {
    await Promise.all(children.map((child) => new Promise((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve();
      child.stopping = true;
      const timer = setTimeout(() => child.kill('SIGKILL'), 12_000);
      child.once('exit', () => {
        clearTimeout(timer);
        resolve();
      });
      child.kill('SIGTERM');
    })));
  }

  /**
   * CPU time (user + system, ms) of the cluster so far: the postmaster's own and that of the
   * children it has reaped (backends and parallel workers that ended), plus its live children's.
   */
  postgresCpuMs() {
    const postmaster = Number(fs.readFileSync(path.join(this.#postgres.clusterDir, 'postmaster.pid'), 'utf8').split('\n')[0]);
    const [own, reaped] = processAndChildrenCpuMs(postmaster);
    let total = own + reaped;
    for (const entry of fs.readdirSync('/proc')) {
      if (!/^\d+$/.test(entry)) continue;
      try {
        const stat = fs.readFileSync(`/proc/${entry}/stat`, 'utf8');
        if (Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]) === postmaster) total += processCpuMs(Number(entry));
      } catch {
        // The process ended between listing and reading: its time is in the postmaster's reaped total.
      }
    }
    return total;
  }

  /** Whether every process started so far is still running. */
  allAlive() {
    return this.#group.allAlive();
  }

  stop() {
    this.#stopping ??= (async () => {
      await this.#group.stopAll();
      for (const pool of this.#pools) await pool.end().catch(() => undefined);
      for (const ds of this.#dataSources) if (ds.isInitialized) await ds.destroy().catch(() => undefined);
      try {
        this.#postgres?.stop();
      } catch (err) {
        console.error(err.message);
      }
    })();
    return this.#stopping;
  }
}

/**
 * Runs `body(stack)` and always stops the stack afterwards — on success, on a thrown error and
 * on SIGINT/SIGTERM. Prints the report `body` returns (markdown) on stdout; exits non-zero on failure.
 */
export async function runPart(name, body) {
  const stack = new BenchStack(name);
  const onSignal = (signal) => {
    progress(`${signal}: stopping the benchmark's processes and PostgreSQL…`);
    stack.stop().finally(() => process.exit(130));
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  process.on('unhandledRejection', (err) => {
    console.error(`\x1b[31m[bench]\x1b[0m ${name} failed: ${err?.stack ?? err}`);
    stack.stop().finally(() => process.exit(1));
  });
  let report;
  let failure = null;
  try {
    await stack.start();
    report = await body(stack);
  } catch (err) {
    failure = err;
  }
  await stack.stop();
  if (failure) {
    console.error(`\x1b[31m[bench]\x1b[0m ${name} failed: ${failure.stack ?? failure}`);
    process.exit(1);
  }
  fs.mkdirSync(path.join(BENCH_DIR, 'results'), { recursive: true });
  fs.writeFileSync(path.join(BENCH_DIR, 'results', `${name}.json`), JSON.stringify(report.figures, null, 2));
  console.log(report.text);
  process.exit(0);
}

/** A workspace with one owner, and that owner's session cookie and anti-forgery header. */
export async function ownerSession(stack, dataSource, url) {
  const { createTestWorkspace } = serverModule('api/src/testing/test-database.js');
  const { memberSession } = serverModule('api/src/testing/test-session.js');
  const { workspace, members } = await createTestWorkspace(dataSource, ['owner']);
  const session = await memberSession(stack.pool(url), { sessionSecret: stack.sessionSecret }, members[0].user.id, workspace.id);
  return { workspace, user: members[0].user, headers: session.headers };
}

/** A codebase in the workspace with one queued snapshot row (what an upload creates before its job runs). */
export async function queuedSnapshot(dataSource, workspaceId, name) {
  const { createQueuedSnapshot } = serverModule('api/src/testing/test-snapshot.js');
  return createQueuedSnapshot(dataSource, workspaceId, name);
}

/** Writes the demo's `before` version as a zip (the upload the analyses in these benchmarks use). */
export async function demoZip(stack) {
  const { buildDemoZip } = serverModule('api/src/demo/demo-zip.js');
  const file = path.join(stack.dataDir, 'otterbay-before.zip');
  await buildDemoZip('before', file);
  return fs.readFileSync(file);
}

/** Uploads a zip as a new snapshot of the codebase; resolves with the queued snapshot's id. */
export async function uploadZip(base, headers, codebaseId, zip) {
  const form = new FormData();
  form.append('file', new Blob([zip], { type: 'application/zip' }), 'otterbay-before.zip');
  const res = await fetch(`${base}/api/codebases/${codebaseId}/snapshots`, { method: 'POST', headers, body: form });
  const body = await res.json();
  if (res.status !== 202) throw new Error(`upload answered ${res.status}: ${JSON.stringify(body)}`);
  return body.snapshot.id;
}

/** Waits for a snapshot to be ready or failed (at most 5 minutes); resolves with its row. */
export async function untilFinished(dataSource, snapshotId) {
  const deadline = Date.now() + 5 * 60_000;
  for (;;) {
    const [row] = await dataSource.query(
      `SELECT status, error, extract(epoch FROM finished_at - started_at) * 1000 AS "runMs" FROM snapshot WHERE id = $1`, [snapshotId]);
    if (row.status === 'ready' || row.status === 'failed') return { id: snapshotId, status: row.status, error: row.error, runMs: Number(row.runMs) };
    if (Date.now() > deadline) throw new Error(`the demo analysis ${snapshotId} did not finish within 5 minutes (status ${row.status})`);
    await sleep(250);
  }
}

/** Creates a codebase through the API; resolves with its id. */
export async function createCodebase(base, headers, name) {
  const res = await fetch(`${base}/api/codebases`, { method: 'POST', headers: { ...headers, 'Content-Type': 'application/json' }, body: JSON.stringify({ name }) });
  const body = await res.json();
  if (res.status !== 201) throw new Error(`creating a codebase answered ${res.status}: ${JSON.stringify(body)}`);
  return body.codebase.id;
}

/** The whole machine's CPU time so far (/proc/stat, in ms of all cores): busy and total. */
export function machineCpu() {
  const fields = fs.readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).slice(1).map(Number);
  const tick = 1000 / 100; // USER_HZ is 100 on Linux
  const idle = fields[3] + fields[4];
  const total = fields.reduce((a, b) => a + b, 0);
  return { busyMs: (total - idle) * tick, totalMs: total * tick };
}

/** A process's own CPU time and that of its children it has waited for (ms). */
function processAndChildrenCpuMs(pid) {
  const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return [(Number(fields[11]) + Number(fields[12])) * 10, (Number(fields[13]) + Number(fields[14])) * 10];
}

/** CPU time (user + system, ms) a running process has used, its threads included. */
export function processCpuMs(pid) {
  const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return (Number(fields[11]) + Number(fields[12])) * 10;
}

export const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
export const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));
