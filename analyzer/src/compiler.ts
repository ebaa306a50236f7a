/**
 * The TypeScript compiler
 * =======================
 * The compiler ts-morph bundles and re-exports as `ts`, loaded on its own. Measuring functions
 * needs only its parser, and loading ts-morph's wrapper layer with it added about 150 ms to the
 * start of every scan (docs/benchmarks.md). The call graph loads ts-morph for its Project, which
 * hands out this same module object, so there is one compiler per thread and nodes from either
 * side are interchangeable (compiler.spec.ts checks that it is the same object).
 */
import ts = require('@ts-morph/common/dist/typescript.js');

export { ts };
