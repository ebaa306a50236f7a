// The call graph against its floor. Usage: node scripts/bench/calls.cjs <rxjs|typeorm> <checker|calls>
//   checker: create the TypeScript program and checker over the same files with the same options,
//            and resolve every call's and `new`'s signature (what any call resolution must do);
//   calls:   Seamline's call graph (units, resolution, dispatch, references, imports, externals).
// Both load the compiler before the timer starts; each run is a process of its own.
const path = require('node:path');
const dist = path.resolve(__dirname, '../../dist/analyzer/analyzer/src');
const { createProgram } = require(path.join(dist, 'project/createProgram.js'));
const { buildCallGraph } = require(path.join(dist, 'call-graph/buildCallGraph.js'));
const { listSourceFiles } = require(path.join(dist, 'project/listSourceFiles.js'));
const { DEFAULT_SETTINGS } = require(path.join(dist, 'model/index.js'));
const { ts } = require('ts-morph');
const { rxjsFiles } = require('./corpus.cjs');

const [corpus, what] = process.argv.slice(2);
// typeorm's exports map hides its package.json from require.resolve.
const root = corpus === 'typeorm' ? path.resolve(__dirname, '../../node_modules/typeorm') : rxjsFiles().root;
const { files } = listSourceFiles(root);
void ts.version;

const started = process.hrtime.bigint();
let result;
if (what === 'checker') {
  const { program } = createProgram({ root, files });
  const checker = program.getTypeChecker();
  let resolved = 0;
  for (const file of files) {
    const sf = program.getSourceFile(path.join(root, file));
    if (!sf) continue;
    const stack = [sf];
    while (stack.length) {
      const node = stack.pop();
      if (ts.isCallExpression(node) || ts.isNewExpression(node)) {
        if (checker.getResolvedSignature(node)) resolved++;
      }
      ts.forEachChild(node, (c) => void stack.push(c));
    }
  }
  result = { resolved };
} else {
  const graph = buildCallGraph({ root, files, settings: DEFAULT_SETTINGS });
  result = { edges: graph.calls.length, failed: graph.failedFiles.length };
}
const ms = Number(process.hrtime.bigint() - started) / 1e6;
console.log(JSON.stringify({ ms, maxRssKb: process.resourceUsage().maxRSS, files: files.length, ...result }));
