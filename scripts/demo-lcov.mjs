#!/usr/bin/env node
// Regenerates the coverage reports of the invented Otterbay demo codebase:
//   test/fixtures/otterbay/<version>/coverage/lcov.info   (committed; the demo ships them)
// by running the demo's own tests (*.test.ts, which `npm test` never runs) with the root's jest
// and test/fixtures/otterbay/jest.demo.config.cjs. Paths in the report (SF:) are made relative
// to the version's folder, e.g. `SF:src/orders/createOrder.ts`, so the report travels with the
// code. A version whose tests fail keeps its old report.
//   node scripts/demo-lcov.mjs            both versions
//   node scripts/demo-lcov.mjs after      one version
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { fileURLToPath } from 'node:url';

const VERSIONS = ['before', 'after'];
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const demo = path.join(root, 'test/fixtures/otterbay');
const config = path.join(demo, 'jest.demo.config.cjs');
const jestBin = path.join(root, 'node_modules/jest/bin/jest.js');

function fail(message, code = 1) {
  console.error(`demo-lcov: ${message}`);
  process.exit(code);
}

/** Splits lcov text into records, rewrites each SF: path relative to `versionRoot`, sorts by path. */
export function relativeLcov(text, versionRoot, reportCwd) {
  const records = text
    .split(/^end_of_record\s*$/m)
    .map((record) => record.trim())
    .filter((record) => record !== '');
  const rewritten = records.map((record) => {
    const lines = record.split(/\r?\n/);
    const index = lines.findIndex((line) => line.startsWith('SF:'));
    if (index < 0) throw new Error('a record of the report names no source file (no SF: line)');
    const absolute = path.resolve(reportCwd, lines[index].slice(3));
    const relative = path.relative(versionRoot, absolute).split(path.sep).join('/');
    if (relative.startsWith('../') || path.isAbsolute(relative)) throw new Error(`the report names ${absolute}, outside ${versionRoot}`);
    if (!fs.existsSync(absolute)) throw new Error(`the report names ${relative}, which does not exist`);
    lines[index] = `SF:${relative}`;
    return { file: relative, text: `${lines.join('\n')}\nend_of_record\n` };
  });
  rewritten.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
  return rewritten.map((record) => record.text).join('');
}

function regenerate(version) {
  const versionRoot = path.join(demo, version);
  const scratch = fs.mkdtempSync(path.join(os.tmpdir(), `otterbay-${version}-coverage-`));
  try {
    console.log(`demo-lcov: running the ${version}/ tests with coverage…`);
    // cwd is the version's folder: jest's lcov writer names files relative to it.
    const run = spawnSync(
      process.execPath,
      [jestBin, '--config', config, '--ci', '--maxWorkers=2', '--coverage', '--coverageReporters=lcovonly', `--coverageDirectory=${scratch}`],
      { cwd: versionRoot, env: { ...process.env, OTTERBAY_VERSION: version }, stdio: 'inherit' },
    );
    if (run.error) throw new Error(`could not start jest: ${run.error.message}`);
    if (run.status !== 0) throw new Error(`the ${version}/ tests failed (exit ${run.status}); its lcov.info is left as it was`);
    const produced = path.join(scratch, 'lcov.info');
    if (!fs.existsSync(produced)) throw new Error(`jest wrote no ${produced}`);
    const text = relativeLcov(fs.readFileSync(produced, 'utf8'), versionRoot, versionRoot);
    const target = path.join(versionRoot, 'coverage', 'lcov.info');
    fs.mkdirSync(path.dirname(target), { recursive: true });
    // Written beside the target and renamed, so a reader never sees half a report.
    fs.writeFileSync(`${target}.tmp`, text);
    fs.renameSync(`${target}.tmp`, target);
    const files = (text.match(/^SF:/gm) ?? []).length;
    const found = sum(text, /^LF:(\d+)$/gm);
    const hit = sum(text, /^LH:(\d+)$/gm);
    console.log(`demo-lcov: wrote ${path.relative(root, target)} (${files} files, ${hit} of ${found} lines covered)`);
  } finally {
    fs.rmSync(scratch, { recursive: true, force: true });
  }
}

function sum(text, pattern) {
  let total = 0;
  for (const match of text.matchAll(pattern)) total += Number(match[1]);
  return total;
}

function main() {
  const asked = process.argv.slice(2);
  const unknown = asked.filter((version) => !VERSIONS.includes(version));
  if (unknown.length > 0) fail(`unknown version ${unknown.join(', ')}; usage: node scripts/demo-lcov.mjs [before] [after]`, 2);
  if (!fs.existsSync(jestBin)) fail(`jest is not installed at ${path.relative(root, jestBin)}: run npm ci first`, 2);
  for (const version of asked.length > 0 ? asked : VERSIONS) {
    try {
      regenerate(version);
    } catch (error) {
      fail(error.message);
    }
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) main();
