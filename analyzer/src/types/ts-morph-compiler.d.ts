// Types for the compiler module ts-morph bundles and re-exports as `ts`, which analyzer/src/compiler.ts
// loads on its own; the package ships no declarations beside that file, so tsconfig.server.json's
// `paths` points its name here.
import { ts } from 'ts-morph';

export = ts;
