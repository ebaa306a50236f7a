// Ours: `seamline scan` without the call graph, both cores, writing the snapshot JSON.
const fs = require('node:fs');
const os = require('node:os');
const path = require('node:path');
const { rxjsFiles, largeFile } = require('./corpus.cjs');

const root = path.resolve(__dirname, '../..');
// Start-up as the `seamline` command does it (analyzer/bin/seamline.js): the compiler through its
// code cache (SEAMLINE_CODE_CACHE from the benchmark), then the CLI. Loading the compiler is
// start-up, as in the parse baseline (which requires typescript first).
const codeCache = require(path.join(root, 'dist/analyzer/analyzer/src/startup/compilerCodeCache.js'));
codeCache.enableCompilerCodeCache(process.env);
codeCache.preloadCompiler();
const { runCli } = require(path.join(root, 'dist/analyzer/analyzer/src/cli/main.js'));
require(path.join(root, 'dist/analyzer/analyzer/src/project/scanDirectory.js'));
const { Writable } = require('node:stream');

const sink = () => new Writable({ write(_c, _e, cb) { cb(); } });
async function main() {
  let target;
  let tmpDir;
  if (process.argv[2] === 'large') {
    // One file in a folder of its own, so the scan sees exactly that file.
    tmpDir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-bench-'));
    fs.copyFileSync(largeFile(), path.join(tmpDir, 'typescript.js'));
    target = tmpDir;
  } else {
    target = rxjsFiles().root;
  }
  const out = path.join(os.tmpdir(), `seamline-bench-${process.pid}.json`);
  const started = process.hrtime.bigint();
  let summary = '';
  const stderr = new Writable({ write(c, _e, cb) { summary += c; cb(); } });
  const code = await runCli(['scan', target, '--no-calls', '--max-line-length', '0', '--out', out], { stdout: sink(), stderr, cwd: root, isTTY: false });
  const ms = Number(process.hrtime.bigint() - started) / 1e6;
  // The counts come from the summary line, so the process does what `seamline scan` does and no
  // more (reading the snapshot back cost the whole-process figure ~20 ms); the tests check the snapshot.
  const written = fs.statSync(out).size;
  fs.rmSync(out, { force: true });
  if (tmpDir) fs.rmSync(tmpDir, { recursive: true, force: true });
  const counts = /^scanned ([\d,]+) files?(?: \([^)]*\))? · ([\d,]+) functions?/m.exec(summary);
  if (code !== 0 || !counts || written === 0) throw new Error(`scan exited with ${code}: ${summary}`);
  const count = (text) => Number(text.replace(/,/g, ''));
  console.log(JSON.stringify({ ms, maxRssKb: process.resourceUsage().maxRSS, files: count(counts[1]), functions: count(counts[2]) }));
}
main().catch((err) => {
  console.error(err);
  process.exit(1);
});
