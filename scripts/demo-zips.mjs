// Builds the zips of the invented Otterbay demo codebase (before/after), ready to upload:
//   node scripts/demo-zips.mjs [out-dir]      (default .data/demo)
// Uses the server's own zip builder (api/src/demo/demo-zip.ts), compiling the server first if needed.
import * as fs from 'node:fs';
import * as path from 'node:path';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { run } from './lib/run.mjs';
import { step } from './lib/log.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const outDir = path.resolve(process.argv[2] ?? path.join(root, '.data/demo'));
const builder = path.join(root, 'dist/server/api/src/demo/demo-zip.js');
if (!fs.existsSync(builder)) {
  step('compiling the server (for its demo zip builder)…');
  run(process.execPath, [path.join(root, 'node_modules/typescript/bin/tsc'), '-p', path.join(root, 'tsconfig.server.json')]);
}
const { buildDemoZip, DEMO_VERSIONS } = createRequire(import.meta.url)(builder);
fs.mkdirSync(outDir, { recursive: true });
for (const version of DEMO_VERSIONS) {
  const file = path.join(outDir, `otterbay-${version}.zip`);
  const { files, bytes } = await buildDemoZip(version, file);
  step(`${path.relative(process.cwd(), file)}: ${files} files, ${(bytes / 1024).toFixed(0)} KiB (invented demo code)`);
}
