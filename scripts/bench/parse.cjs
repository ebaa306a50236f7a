// Baseline: a bare parse of every file with the project's own TypeScript, in one process.
const fs = require('node:fs');
const ts = require('typescript');
const { rxjsFiles, largeFile } = require('./corpus.cjs');

const files = process.argv[2] === 'large' ? [largeFile()] : rxjsFiles().files;
const started = process.hrtime.bigint();
let statements = 0;
for (const file of files) {
  const sf = ts.createSourceFile(file, fs.readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true);
  statements += sf.statements.length;
}
const ms = Number(process.hrtime.bigint() - started) / 1e6;
console.log(JSON.stringify({ ms, maxRssKb: process.resourceUsage().maxRSS, files: files.length, statements }));
