import * as path from 'node:path';
import { run } from './run.mjs';
import { step } from './log.mjs';

/** Compiles the server parts (api + analyzer) with tsc and builds the Angular app. */
export function buildAll(root, { serverOut = 'dist/server', webOut = 'dist/web' } = {}) {
  const bin = (name) => path.join(root, 'node_modules', '.bin', name);
  let started = Date.now();
  step(`compiling the server (tsc → ${serverOut})…`);
  run(bin('tsc'), ['-p', 'tsconfig.server.json', '--outDir', serverOut], { cwd: root });
  step(`server compiled in ${secondsSince(started)} s; building the web app (→ ${webOut})…`);
  started = Date.now();
  run(bin('ng'), ['build', 'web', '--output-path', webOut], {
    cwd: root,
    env: { ...process.env, NG_CLI_ANALYTICS: 'false', NG_FORCE_TTY: 'false' },
  });
  step(`web app built in ${secondsSince(started)} s`);
}

function secondsSince(t) {
  return Math.round((Date.now() - t) / 1000);
}
