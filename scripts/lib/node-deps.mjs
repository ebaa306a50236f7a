import { createHash } from 'node:crypto';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { run } from './run.mjs';
import { step } from './log.mjs';

/** Runs `npm ci` when node_modules is absent or was installed from another package-lock.json. */
export function ensureNodeDependencies(root) {
  const lock = path.join(root, 'package-lock.json');
  const marker = path.join(root, 'node_modules', '.seamline-lock-hash');
  const hash = createHash('sha256').update(fs.readFileSync(lock)).digest('hex');
  if (fs.existsSync(marker) && fs.readFileSync(marker, 'utf8') === hash) return;
  step('installing npm dependencies (npm ci)…');
  const started = Date.now();
  run('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=error'], { cwd: root });
  fs.writeFileSync(marker, hash);
  step(`npm ci took ${Math.round((Date.now() - started) / 1000)} s`);
}
