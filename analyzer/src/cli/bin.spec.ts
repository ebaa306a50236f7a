// analyzer/bin/seamline.js as users run it: compiled with the project's tsconfig.analyzer.json
// into a scratch copy of the repository layout (so the repository's own dist/ is left alone).
import { execFileSync, spawnSync } from 'node:child_process';
import { promises as fsp, readdirSync, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { syntheticFunction, syntheticSnapshot } from '../snapshot/fixtures/syntheticSnapshot';

const REPO = path.join(__dirname, '../../..');
const BIN = path.join(REPO, 'analyzer/bin/seamline.js');

let scratch: string;
beforeAll(async () => {
  scratch = await fsp.mkdtemp(path.join(os.tmpdir(), 'seamline-bin-'));
});
afterAll(async () => {
  await fsp.rm(scratch, { recursive: true, force: true });
});

async function layout(name: string): Promise<string> {
  const root = path.join(scratch, name);
  await fsp.mkdir(path.join(root, 'analyzer/bin'), { recursive: true });
  await fsp.copyFile(BIN, path.join(root, 'analyzer/bin/seamline.js'));
  return root;
}

// The compiler's code cache goes to the scratch folder, never to the user's own cache.
const codeCache = () => path.join(scratch, 'code-cache');
function node(script: string, args: string[], cwd: string) {
  return spawnSync(process.execPath, [script, ...args], { cwd, encoding: 'utf8', timeout: 20000, env: { ...process.env, SEAMLINE_CODE_CACHE: codeCache() } });
}

describe('analyzer/bin/seamline.js', () => {
  it('should say how to build the CLI when it is not built, and exit 2', async () => {
    const root = await layout('unbuilt');
    const result = node(path.join(root, 'analyzer/bin/seamline.js'), ['--version'], root);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toBe("Seamline's CLI is not built yet: run `npm run build:analyzer`\n");
  });

  it('should start with a node shebang', () => {
    expect(readFileSync(BIN, 'utf8').startsWith('#!/usr/bin/env node\n')).toBe(true);
  });

  it('should run the compiled CLI: --version, check with its exit codes, and a threaded scan', async () => {
    const root = await layout('built');
    const outDir = path.join(root, 'dist/analyzer');
    // noEmitOnError off: this test is about the bin and the layout; `npm run typecheck` judges types.
    try {
      execFileSync(process.execPath, [require.resolve('typescript/bin/tsc'), '-p', path.join(REPO, 'tsconfig.analyzer.json'), '--outDir', outDir, '--noEmitOnError', 'false'], { cwd: REPO, stdio: 'pipe' });
    } catch {
      // Type errors elsewhere in the analyzer still emit JavaScript; the assertions below judge the result.
    }
    await fsp.copyFile(path.join(REPO, 'package.json'), path.join(root, 'package.json'));
    await fsp.symlink(path.join(REPO, 'node_modules'), path.join(root, 'node_modules'), 'dir');
    const bin = path.join(root, 'analyzer/bin/seamline.js');

    const pkg = JSON.parse(readFileSync(path.join(REPO, 'package.json'), 'utf8')) as { version: string };
    const version = node(bin, ['--version'], root);
    expect(version.stderr).toBe('');
    expect(version.stdout).toBe(`${pkg.version}\n`);
    expect(version.status).toBe(0);

    await fsp.writeFile(path.join(root, 'snap.json'), JSON.stringify(syntheticSnapshot([syntheticFunction({ cyclomatic: 11 })])));
    const check = node(bin, ['check', 'snap.json'], root);
    expect(check.status).toBe(1);
    expect(check.stdout).toMatch(/^src\/app\.ts:1 {2}fn1 {2}V\(G\)=11\n/);
    expect(node(bin, ['check', 'snap.json', '--limit', '11'], root).status).toBe(0);
    const usage = node(bin, ['check', 'snap.json', '--limit', 'x'], root);
    expect(usage.status).toBe(2);
    expect(usage.stderr).toBe("seamline check: --limit must be a whole number of at least 1, got 'x'\nRun `seamline check --help` for usage.\n");

    // Threads asked for explicitly, so the compiled scan runs its worker threads on small code.
    await fsp.mkdir(path.join(root, 'code'));
    for (let i = 0; i < 30; i++) {
      await fsp.writeFile(path.join(root, 'code', `m${i}.ts`), `export function f${i}(a: number) {\n  return a > ${i} ? 1 : 0;\n}\n`);
    }
    const scan = node(bin, ['scan', 'code', '--format', 'csv', '--threads', '2'], root);
    expect(scan.status).toBe(0);
    const rows = scan.stdout.trimEnd().split('\r\n');
    const cyclomatic = rows[0].split(',').indexOf('cyclomatic');
    const functions = rows.slice(1).filter((r) => /,function,/.test(r));
    expect(functions).toHaveLength(30);
    // if-then-else (here a ternary): V = 2 (McCabe 1976, IEEE TSE SE-2(4)).
    expect(new Set(functions.map((r) => r.split(',')[cyclomatic]))).toEqual(new Set(['2']));
    expect(scan.stderr).toMatch(/^scanned 30 files · /m);

    // The first scan saved the compiler's bytecode; the next ones take it back, or replace a
    // damaged file, and measure the same.
    const cacheFile = () => path.join(codeCache(), readdirSync(codeCache()).filter((name) => name.endsWith('.v8cache'))[0]);
    expect(readdirSync(codeCache()).filter((name) => name.endsWith('.v8cache'))).toHaveLength(1);
    const saved = readFileSync(cacheFile());
    const again = node(bin, ['scan', 'code', '--format', 'csv'], root);
    expect(again.status).toBe(0);
    expect(again.stdout).toBe(scan.stdout);
    expect(readFileSync(cacheFile())).toEqual(saved);
    const damaged = Buffer.from(saved);
    damaged[damaged.length >> 1] ^= 0xff;
    await fsp.writeFile(cacheFile(), damaged);
    const afterDamage = node(bin, ['scan', 'code', '--format', 'csv'], root);
    expect(afterDamage.status).toBe(0);
    expect(afterDamage.stdout).toBe(scan.stdout);
    expect(readFileSync(cacheFile()).equals(damaged)).toBe(false);
    expect(node(bin, ['scan', 'code', '--format', 'csv'], root).stdout).toBe(scan.stdout);
  }, 60000);
});
