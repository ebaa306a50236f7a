#!/usr/bin/env node
// The `seamline` command: runs the compiled CLI (dist/analyzer/analyzer/src/cli/main.js), which
// `npm ci` builds through the root package's `prepare` script. Exit codes: see docs/cli.md.
'use strict';

const fs = require('node:fs');
const path = require('node:path');

const main = path.join(__dirname, '..', '..', 'dist', 'analyzer', 'analyzer', 'src', 'cli', 'main.js');

if (!fs.existsSync(main)) {
  process.stderr.write("Seamline's CLI is not built yet: run `npm run build:analyzer`\n");
  process.exit(2);
}

// The compiler's bytecode is kept between runs (docs/decisions.md); SEAMLINE_CODE_CACHE=off turns that off.
require(path.join(main, '..', '..', 'startup', 'compilerCodeCache.js')).enableCompilerCodeCache(process.env);
require(main).runFromProcess();
