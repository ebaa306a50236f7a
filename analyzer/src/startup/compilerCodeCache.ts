/**
 * The compiler through the code cache
 * ===================================
 * The `seamline` command switches this on before anything else; the scan then loads the compiler
 * bundle (analyzer/src/compiler.ts) through the code cache before its first import of it, and the
 * bytecode compiled during the run is saved when the process exits, if the cache was missing or
 * out of date. Library users and test runners never switch it on and load the compiler as usual.
 * Measured in docs/benchmarks.md; the choice is recorded in docs/decisions.md.
 */
import { requireWithCodeCache, type CachedModuleLoad } from './codeCache';
import { codeCacheDir } from './codeCacheDir';

/** The module analyzer/src/compiler.ts imports. */
export const COMPILER_MODULE = '@ts-morph/common/dist/typescript.js';

let enabledFor: NodeJS.ProcessEnv | undefined;
let load: CachedModuleLoad | undefined;
// Resolved (created and checked) on first use, once per process.
let dir: { path: string | undefined } | undefined;

/** Lets `preloadCompiler` use the code cache in this process, and saves it at exit. */
export function enableCompilerCodeCache(env: NodeJS.ProcessEnv = process.env): void {
  if (enabledFor) return;
  enabledFor = env;
  process.once('exit', () => load?.save());
}

/** Loads the compiler through the code cache if this process enabled it; does nothing otherwise. */
export function preloadCompiler(): void {
  if (!enabledFor || load) return;
  load = requireWithCodeCache(require.resolve(COMPILER_MODULE), compilerCodeCacheDir());
}

/** The folder the calling thread's code cache is in, for a worker thread to read (undefined when off). */
export function compilerCodeCacheDir(): string | undefined {
  if (!enabledFor) return undefined;
  dir ??= { path: codeCacheDir(enabledFor) };
  return dir.path;
}

/**
 * In a worker thread, before anything imports the compiler: loads it through the cache the
 * parent thread uses. Only the parent saves, so threads never race to write the file.
 */
export function preloadCompilerInThread(cacheDir: string | undefined): void {
  if (cacheDir !== undefined) requireWithCodeCache(require.resolve(COMPILER_MODULE), cacheDir);
}
