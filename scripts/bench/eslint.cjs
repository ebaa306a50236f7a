// Baseline: ESLint's complexity rule alone over every file, in one process, as a user runs it.
const fs = require('node:fs');
const { Linter } = require('eslint');
const tsParser = require('@typescript-eslint/parser');
const { rxjsFiles } = require('./corpus.cjs');

const { files } = rxjsFiles();
const started = process.hrtime.bigint();
const linter = new Linter({ configType: 'flat' });
const config = [{
  files: ['**/*.ts'],
  languageOptions: { parser: tsParser, ecmaVersion: 'latest', sourceType: 'module' },
  linterOptions: { noInlineConfig: true },
  rules: { complexity: ['error', { max: 0 }] },
}];
let reports = 0;
for (const file of files) reports += linter.verify(fs.readFileSync(file, 'utf8'), config, { filename: file }).length;
const ms = Number(process.hrtime.bigint() - started) / 1e6;
console.log(JSON.stringify({ ms, maxRssKb: process.resourceUsage().maxRSS, files: files.length, reports }));
