/**
 * Zips of the invented Otterbay demo codebase (test/fixtures/otterbay/before and …/after), the
 * content a fresh workspace starts with. Each zip holds one top folder, `otterbay-<version>/`,
 * with the version's code and tests; the committed coverage report (coverage/) and any
 * node_modules stay out.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { ZipFile } from 'yazl';

export type DemoVersion = 'before' | 'after';

export const DEMO_VERSIONS: readonly DemoVersion[] = ['before', 'after'];

// A fixed time for every entry, so the same code always gives the same zip bytes.
const ENTRY_TIME = new Date('2025-01-01T00:00:00Z');

/**
 * The project root: the nearest folder above `start` whose package.json is named "seamline".
 * Works from the TypeScript source (api/src/demo) and from the compiled output
 * (dist/server/api/src/demo, dist/test-server/api/src/demo) alike.
 */
export function findProjectRoot(start: string): string {
  for (let dir = path.resolve(start); ; dir = path.dirname(dir)) {
    const manifest = path.join(dir, 'package.json');
    if (fs.existsSync(manifest) && manifestName(manifest) === 'seamline') return dir;
    if (path.dirname(dir) === dir) {
      throw new Error(`No folder above ${start} holds Seamline's package.json (name "seamline"); the demo codebase cannot be found.`);
    }
  }
}

function manifestName(manifest: string): unknown {
  try {
    return (JSON.parse(fs.readFileSync(manifest, 'utf8')) as { name?: unknown }).name;
  } catch {
    return undefined; // another project's unreadable manifest: keep walking up
  }
}

/** test/fixtures/otterbay in the project. */
export const DEMO_ROOT = path.join(findProjectRoot(__dirname), 'test', 'fixtures', 'otterbay');

/** The version's files as posix paths relative to its folder, sorted; coverage/ at its top and node_modules anywhere are left out. */
export function demoFiles(version: DemoVersion): string[] {
  const versionRoot = path.join(DEMO_ROOT, version);
  const files: string[] = [];
  const pending = [''];
  while (pending.length > 0) {
    const dir = pending.pop()!;
    for (const entry of fs.readdirSync(path.join(versionRoot, dir), { withFileTypes: true })) {
      const relative = dir === '' ? entry.name : `${dir}/${entry.name}`;
      if (entry.isDirectory()) {
        if (entry.name !== 'node_modules' && relative !== 'coverage') pending.push(relative);
      } else if (entry.isFile()) {
        files.push(relative);
      }
    }
  }
  return files.sort();
}

/**
 * Writes the zip of one demo version to `outFile`, streamed to disk. The zip appears under its
 * name only when complete: it is written beside it first and renamed, and removed on any error.
 */
export async function buildDemoZip(version: DemoVersion, outFile: string): Promise<{ files: number; bytes: number }> {
  if (!DEMO_VERSIONS.includes(version)) {
    throw new Error(`Unknown demo version "${String(version)}": use ${DEMO_VERSIONS.map((v) => `"${v}"`).join(' or ')}.`);
  }
  const target = path.resolve(outFile);
  if (target === DEMO_ROOT || target.startsWith(DEMO_ROOT + path.sep)) {
    throw new Error(`Write the demo zip outside the demo codebase (${DEMO_ROOT}), not to ${target}: it would end up in the next zip.`);
  }
  const files = demoFiles(version);
  const versionRoot = path.join(DEMO_ROOT, version);
  const partial = `${target}.${process.pid}.partial`;
  try {
    fs.mkdirSync(path.dirname(target), { recursive: true });
    await new Promise<void>((resolve, reject) => {
      const zip = new ZipFile();
      // yazl reports a file it cannot read on the zip itself, not on its output stream.
      zip.on('error', (error: Error) => {
        (zip.outputStream as NodeJS.ReadableStream & { destroy(error?: Error): void }).destroy(error);
        reject(error);
      });
      for (const file of files) {
        zip.addFile(path.join(versionRoot, ...file.split('/')), `otterbay-${version}/${file}`, { mtime: ENTRY_TIME, mode: 0o100644 });
      }
      pipeline(zip.outputStream, fs.createWriteStream(partial, { flags: 'wx' })).then(resolve, reject);
      zip.end();
    });
    fs.renameSync(partial, target);
  } catch (error) {
    removeQuietly(partial);
    throw new Error(`Could not write the ${version} demo zip to ${target}: ${(error as Error).message}`);
  }
  return { files: files.length, bytes: fs.statSync(target).size };
}

/** Cleans up after a failed write; the write's own error is the one worth reporting. */
function removeQuietly(file: string): void {
  try {
    fs.rmSync(file, { force: true });
  } catch {
    // nothing was there to remove (e.g. its folder is a file)
  }
}
