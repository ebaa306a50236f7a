import * as fs from 'node:fs';
import { run } from './run.mjs';
import { step } from './log.mjs';

/** Debian packages the project needs, with a file that proves each is present. */
const PACKAGES = {
  postgresql: () => findPostgresBin() !== null,
  chromium: () => fs.existsSync('/usr/bin/chromium'),
};

/** The bin folder of the newest installed PostgreSQL server, or null. */
export function findPostgresBin() {
  const root = '/usr/lib/postgresql';
  if (!fs.existsSync(root)) return null;
  const versions = fs
    .readdirSync(root)
    .filter((v) => fs.existsSync(`${root}/${v}/bin/initdb`))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? `${root}/${versions[0]}/bin` : null;
}

/** Installs the missing packages with apt (one update, one install). Needs root. */
export function ensureSystemPackages(names) {
  const missing = names.filter((n) => !PACKAGES[n]());
  if (missing.length === 0) return;
  if (process.getuid?.() !== 0) {
    throw new Error(`Missing Debian packages: ${missing.join(', ')}. Install them with: sudo apt-get install -y ${missing.join(' ')}`);
  }
  step(`installing ${missing.join(', ')} from Debian's packages (first run only)…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  run('apt-get', ['update', '-qq'], { env });
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...missing], { env });
}
