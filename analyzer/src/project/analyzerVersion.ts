import * as fs from 'node:fs';
import * as path from 'node:path';

let cached: string | undefined;

/** The version of the root package, read once from its package.json. */
export function analyzerVersion(): string {
  if (cached) return cached;
  for (let dir = __dirname; dir !== path.dirname(dir); dir = path.dirname(dir)) {
    const candidate = path.join(dir, 'package.json');
    if (fs.existsSync(candidate)) {
      const pkg = JSON.parse(fs.readFileSync(candidate, 'utf8')) as { name?: string; version?: string };
      if (pkg.name === 'seamline' && pkg.version) return (cached = pkg.version);
    }
  }
  return (cached = '0.0.0');
}
