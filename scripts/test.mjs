#!/usr/bin/env node
// `npm test`: the same bootstrap as `npm start`, against its own PostgreSQL cluster and free
// ports (so it runs beside `npm start`), then every test in one jest run. Extra arguments go to
// jest, e.g. `npm test -- --selectProjects api`.
import * as fs from 'node:fs';
import * as path from 'node:path';
import { randomBytes } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { buildAll } from './lib/build.mjs';
import { step } from './lib/log.mjs';
import { ensureNodeDependencies } from './lib/node-deps.mjs';
import { LocalPostgres } from './lib/postgres.mjs';
import { freePort, ProcessGroup, waitForHttp, waitForPort } from './lib/processes.mjs';
import { run, runAsync } from './lib/run.mjs';
import { ensureSystemPackages } from './lib/system-packages.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
process.chdir(root);
const testDir = path.join(root, '.data/test');
const serverDist = path.join(root, 'dist/test-server');
const group = new ProcessGroup();
let postgres = null;

async function main() {
  const started = Date.now();
  ensureSystemPackages(['postgresql', 'chromium']);
  ensureNodeDependencies(root);

  postgres = new LocalPostgres({ baseDir: testDir, port: await freePort() });
  postgres.start();
  postgres.recreateDatabase('seamline_test');
  postgres.recreateDatabase('seamline_e2e');

  buildAll(root, { serverOut: 'dist/test-server', webOut: 'dist/test-web' });
  // The server build type-checks the api, analyzer and cross-part tests; jest runs the web
  // app's tests without types, so they are checked here.
  step('type-checking the web app\'s tests…');
  run(path.join(root, 'node_modules/.bin/tsc'), ['-p', 'web/tsconfig.spec.json', '--noEmit'], { cwd: root });

  // The end-to-end stack: every process, as `npm start` runs it, on free loopback ports.
  const e2eData = path.join(testDir, 'e2e');
  fs.rmSync(e2eData, { recursive: true, force: true });
  fs.mkdirSync(path.join(e2eData, 'logs'), { recursive: true });
  const ports = { api: await freePort(), idp: await freePort(), smtp: await freePort() };
  const env = {
    SEAMLINE_ENV: 'test',
    SEAMLINE_DATABASE_URL: postgres.url('seamline_e2e'),
    SEAMLINE_SESSION_SECRET: randomBytes(32).toString('base64url'),
    SEAMLINE_DATA_DIR: e2eData,
    SEAMLINE_WEB_DIST: path.join(root, 'dist/test-web/browser'),
    SEAMLINE_API_PORT: String(ports.api),
    SEAMLINE_IDP_PORT: String(ports.idp),
    SEAMLINE_SMTP_PORT: String(ports.smtp),
    // Tests wait for analyses with deadlines while jest's own workers keep both cores busy: the
    // workers they start run at the API's priority (the default, 10, is for shared servers).
    SEAMLINE_WORKER_NICE: '0',
  };
  step('migrating and seeding the end-to-end database…');
  run(process.execPath, [path.join(serverDist, 'api/src/db/migrate.js')], { env: { ...process.env, ...env, SEAMLINE_LOG_LEVEL: 'warn' } });
  for (const [name, file] of [
    ['idp', 'api/src/fakes/identity-provider/main.js'],
    ['mail', 'api/src/fakes/mail/main.js'],
    ['worker', 'api/src/worker/main.js'],
    ['api', 'api/src/main.js'],
  ]) {
    group.start(name, path.join(serverDist, file), env, { logFile: path.join(e2eData, 'logs', `${name}.log`) });
  }
  await Promise.all([
    waitForHttp(`http://127.0.0.1:${ports.idp}/metadata`),
    waitForPort(ports.smtp),
    waitForHttp(`http://127.0.0.1:${ports.api}/api/health`),
  ]);
  // The screens' end-to-end tests explore the invented demo, analysed as npm start does it.
  const seeded = await runAsync(process.execPath, [path.join(serverDist, 'api/src/demo/seed-main.js')], { env: { ...process.env, ...env, SEAMLINE_LOG_LEVEL: 'warn' } });
  if (seeded !== 0) throw new Error('the invented demo could not be analysed for the end-to-end tests (see the worker log)');
  step(`stack ready in ${Math.round((Date.now() - started) / 1000)} s (logs in ${path.relative(root, e2eData)}/logs); running jest…`);

  const results = path.join(testDir, 'jest-results.json');
  fs.rmSync(results, { force: true });
  const code = await runAsync(process.execPath, [path.join(root, 'node_modules/jest/bin/jest.js'), '--ci', '--maxWorkers=2',
    '--json', `--outputFile=${results}`, ...process.argv.slice(2)], {
    env: {
      ...process.env,
      SEAMLINE_TEST_DATABASE_URL: postgres.url('seamline_test'),
      SEAMLINE_TEST_DATA_DIR: path.join(testDir, 'api'),
      SEAMLINE_E2E_DATABASE_URL: env.SEAMLINE_DATABASE_URL,
      SEAMLINE_E2E_URL: `http://127.0.0.1:${ports.api}`,
      SEAMLINE_E2E_IDP_URL: `http://127.0.0.1:${ports.idp}`,
      SEAMLINE_E2E_SMTP_PORT: String(ports.smtp),
      SEAMLINE_E2E_DATA_DIR: e2eData,
      SEAMLINE_E2E_SCREENSHOTS: path.join(root, 'test-results/screenshots'),
      SEAMLINE_WORKER_NICE: env.SEAMLINE_WORKER_NICE,
    },
  });
  return { code, results, seconds: Math.round((Date.now() - started) / 1000) };
}

async function cleanUp() {
  await group.stopAll();
  try {
    postgres?.stop();
  } catch (err) {
    console.error(err.message);
  }
}

function summarise({ code, results, seconds }) {
  if (!fs.existsSync(results)) return code || 1;
  const r = JSON.parse(fs.readFileSync(results, 'utf8'));
  const failedSuites = r.numFailedTestSuites ?? 0;
  console.log(`\nnpm test finished in ${seconds} s (${r.numTotalTestSuites} suites${failedSuites ? `, ${failedSuites} failed` : ''})`);
  // The plain closing line CI reads.
  console.log(`${r.numPassedTests} passed, ${r.numFailedTests} failed${r.numPendingTests ? `, ${r.numPendingTests} skipped` : ''}`);
  return code !== 0 || r.numFailedTests > 0 || failedSuites > 0 || r.numTotalTests === 0 ? 1 : 0;
}

let outcome;
try {
  outcome = await main();
} catch (err) {
  console.error(`\x1b[31m[seamline]\x1b[0m ${err.message}`);
  outcome = { code: 1, results: '', seconds: 0 };
}
await cleanUp();
process.exit(summarise(outcome));
