#!/usr/bin/env node
// `npm start`: installs what is missing, starts PostgreSQL, builds, migrates, seeds the invented
// demo workspace and runs every Seamline process on loopback. Ctrl-C stops all of it.
import { createRequire } from 'node:module';
import * as path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildAll } from './lib/build.mjs';
import { fail, step } from './lib/log.mjs';
import { ensureNodeDependencies } from './lib/node-deps.mjs';
import { LocalPostgres } from './lib/postgres.mjs';
import { assertPortFree, formatLine, ProcessGroup, waitForHttp, waitForPort } from './lib/processes.mjs';
import { capture, runAsync } from './lib/run.mjs';
import { ensureSecret } from './lib/secrets.mjs';
import { ensureSystemPackages } from './lib/system-packages.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
process.chdir(root);

const port = (name, fallback) => Number(process.env[name] ?? fallback);
const ports = {
  api: port('SEAMLINE_API_PORT', 4300),
  idp: port('SEAMLINE_IDP_PORT', 4310),
  smtp: port('SEAMLINE_SMTP_PORT', 4325),
  pg: port('SEAMLINE_PG_PORT', 54329),
};
const dataDir = path.join(root, '.data');
const serverDist = path.join(root, 'dist/server');
const group = new ProcessGroup();
let postgres = null;
let stopping = false;

async function stopEverything(code) {
  if (stopping) return;
  stopping = true;
  step('stopping…');
  await group.stopAll();
  try {
    postgres?.stop();
  } catch (err) {
    console.error(err.message);
  }
  step('stopped; nothing is left running.');
  process.exit(code);
}
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(signal, () => stopEverything(0));
// A closed terminal must not cut the shutdown short: writes to it fail quietly.
for (const stream of [process.stdout, process.stderr]) stream.on('error', () => {});

async function main() {
  const started = Date.now();
  ensureSystemPackages(['postgresql']);
  ensureNodeDependencies(root);
  await assertPortFree(ports.api, 'API');
  await assertPortFree(ports.idp, 'identity-provider fake');
  await assertPortFree(ports.smtp, 'mail fake');

  postgres = new LocalPostgres({ baseDir: dataDir, port: ports.pg });
  postgres.start();
  postgres.ensureDatabases(['seamline']);

  buildAll(root);

  const env = {
    SEAMLINE_ENV: 'development',
    SEAMLINE_DATABASE_URL: postgres.url('seamline'),
    SEAMLINE_SESSION_SECRET: ensureSecret(dataDir, 'session-secret'),
    SEAMLINE_DATA_DIR: dataDir,
    SEAMLINE_WEB_DIST: path.join(root, 'dist/web/browser'),
    SEAMLINE_API_PORT: String(ports.api),
    SEAMLINE_IDP_PORT: String(ports.idp),
    SEAMLINE_SMTP_PORT: String(ports.smtp),
  };
  step('applying migrations and seeding the invented demo workspace…');
  const migrated = capture(process.execPath, [path.join(serverDist, 'api/src/db/migrate.js')], { env: { ...process.env, ...env } });
  for (const line of migrated.split('\n').filter(Boolean)) step(formatLine(line));

  group.start('idp', path.join(serverDist, 'api/src/fakes/identity-provider/main.js'), env);
  group.start('mail', path.join(serverDist, 'api/src/fakes/mail/main.js'), env);
  group.start('worker', path.join(serverDist, 'api/src/worker/main.js'), env);
  group.start('api', path.join(serverDist, 'api/src/main.js'), env);
  await Promise.all([
    waitForHttp(`http://127.0.0.1:${ports.idp}/metadata`),
    waitForPort(ports.smtp),
    waitForHttp(`http://127.0.0.1:${ports.api}/api/health`),
  ]);
  if (!group.allAlive()) throw new Error('a Seamline process stopped during start-up (see its output above)');
  // Through the same upload → queue → worker pipeline users get; a no-op once the demo has snapshots.
  step('making sure the invented demo codebase is analysed (two snapshots, coverage, a carve plan)…');
  const seeded = await runAsync(process.execPath, [path.join(serverDist, 'api/src/demo/seed-main.js')], { env: { ...process.env, ...env, SEAMLINE_LOG_LEVEL: 'warn' } });
  if (seeded !== 0) step('the demo analyses did not finish (see above); the app runs, the Overview may be empty');

  printBanner(Math.round((Date.now() - started) / 1000));
}

function printBanner(seconds) {
  const line = '─'.repeat(72);
  const { DEMO_PEOPLE } = createRequire(import.meta.url)(path.join(serverDist, 'api/src/demo/demo-people.js'));
  const people = DEMO_PEOPLE.map((p) => `    ${p.displayName.padEnd(16)} ${p.email.padEnd(34)} ${p.role}`).join('\n');
  console.log(`
${line}
  Seamline is running (started in ${seconds} s). Open:  http://127.0.0.1:${ports.api}/

  Sign in with SSO, then pick a person on the identity-provider fake
  (http://127.0.0.1:${ports.idp}/). Demo people — invented, Otterbay Parcel Co.:
${people}

  Mail fake: SMTP on 127.0.0.1:${ports.smtp}; messages in .data/mail and at /api/outbox (owner).
  PostgreSQL: 127.0.0.1:${ports.pg}, data in .data/pg.          Ctrl-C stops everything.
${line}`);
}

main().catch(async (err) => {
  console.error(`\x1b[31m[seamline]\x1b[0m ${err.message}`);
  await stopEverything(1);
  fail('start failed');
});
