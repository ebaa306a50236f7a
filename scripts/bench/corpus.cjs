// The benchmark corpora: rxjs's TypeScript sources, and one very large JavaScript file.
const fs = require('node:fs');
const path = require('node:path');

/** Every .ts file (no declarations) under rxjs's src/, sorted. */
function rxjsFiles() {
  const root = path.join(path.dirname(require.resolve('rxjs/package.json')), 'src');
  const files = [];
  const pending = [root];
  while (pending.length) {
    const dir = pending.pop();
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, e.name);
      if (e.isDirectory()) pending.push(full);
      else if (/\.ts$/.test(e.name) && !/\.d\.ts$/.test(e.name)) files.push(full);
    }
  }
  return { root, files: files.sort() };
}

/** The typescript package's lib/typescript.js: one file of several hundred thousand lines. */
function largeFile() {
  return path.join(path.dirname(require.resolve('typescript/package.json')), 'lib', 'typescript.js');
}

module.exports = { rxjsFiles, largeFile };
