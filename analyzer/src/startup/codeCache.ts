/**
 * Requiring a module through V8's code cache
 * ==========================================
 * A fresh process spends most of the time it takes to load a large CommonJS bundle compiling its
 * functions to bytecode, and compiles more of them lazily the first time they run. V8 can
 * serialise the bytecode a process ended up with and take it back in the next one (`vm.Script`'s
 * `cachedData`); Node 22's module compile cache, which ESLint and tsc switch on, is built on it.
 * Node 20 has no such cache, so this module loads one file the way Node's CommonJS loader does,
 * with a cache file beside it.
 *
 * The cache file is named after a hash of the source, Node's version and the architecture, and
 * starts with a SHA-1 of its own payload: a file from other code or a damaged file is never
 * handed to V8, and V8 itself rejects data from another version or other flags. Nothing here
 * ever fails the caller: without a usable cache the module is compiled as usual.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import Module from 'node:module';
import path from 'node:path';
import vm from 'node:vm';

/** What became of the cache for one load. */
export type CodeCacheStatus = 'hit' | 'miss' | 'rejected' | 'off';

export interface CachedModuleLoad {
  readonly exports: unknown;
  readonly status: CodeCacheStatus;
  /** Writes the bytecode compiled so far when the load could not use a cache; best effort. */
  save(): void;
}

const HEADER_BYTES = 20;
const SUFFIX = '.v8cache';

/** Node's loader internals this module reuses (stable since Node 12, used by the common caching packages). */
interface ModuleInternals {
  _nodeModulePaths(from: string): string[];
  wrap(source: string): string;
}
type LoadedModule = NodeJS.Module & { filename: string; paths: string[]; loaded: boolean };

/**
 * Loads `filename` (an absolute, resolved path) into `registry` — by default Node's own module
 * registry, so a later `require` of the same file returns these very exports.
 */
export function requireWithCodeCache(filename: string, cacheDir: string | undefined, registry: NodeJS.Dict<NodeJS.Module> = require.cache): CachedModuleLoad {
  const already = registry[filename];
  if (already) return unsaved(already.exports, 'off');
  const bytes = cacheDir === undefined ? undefined : readOrUndefined(filename);
  let source = bytes?.toString('utf8');
  if (source?.charCodeAt(0) === 0xfeff) source = source.slice(1);
  // A shebang is legal only at the very start of a script, not inside the module wrapper.
  if (cacheDir === undefined || bytes === undefined || source === undefined || source.startsWith('#!')) {
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    return unsaved(require(filename), 'off');
  }

  const key = createHash('sha1').update(bytes).update(`\0${process.version}\0${process.arch}`).digest('hex').slice(0, 20);
  const base = path.basename(filename).replace(/[^\w.-]/g, '_');
  const cacheFile = path.join(cacheDir, `${base}-${key}${SUFFIX}`);
  const cachedData = readVerified(cacheFile);
  const internals = Module as unknown as ModuleInternals;
  const script = new vm.Script(internals.wrap(source), { filename, cachedData });
  const status: CodeCacheStatus = cachedData === undefined ? 'miss' : script.cachedDataRejected ? 'rejected' : 'hit';

  const loaded = new Module(filename, module) as LoadedModule;
  loaded.filename = filename;
  loaded.paths = internals._nodeModulePaths(path.dirname(filename));
  registry[filename] = loaded;
  try {
    const wrapper = script.runInThisContext() as (...args: unknown[]) => void;
    wrapper.call(loaded.exports, loaded.exports, Module.createRequire(filename), loaded, filename, path.dirname(filename));
  } catch (error) {
    delete registry[filename];
    throw error;
  }
  loaded.loaded = true;

  return {
    get exports() {
      return loaded.exports;
    },
    status,
    save: status === 'hit' ? () => undefined : () => writeCache(cacheDir, cacheFile, base, () => script.createCachedData()),
  };
}

function unsaved(exports: unknown, status: CodeCacheStatus): CachedModuleLoad {
  return { exports, status, save: () => undefined };
}

function readOrUndefined(file: string): Buffer | undefined {
  try {
    return fs.readFileSync(file);
  } catch {
    return undefined;
  }
}

/** The payload of a cache file whose header matches it, else undefined. */
function readVerified(file: string): Buffer | undefined {
  const data = readOrUndefined(file);
  if (data === undefined || data.length <= HEADER_BYTES) return undefined;
  const payload = data.subarray(HEADER_BYTES);
  const expected = createHash('sha1').update(payload).digest();
  return expected.equals(data.subarray(0, HEADER_BYTES)) ? payload : undefined;
}

/** Writes atomically (temporary file, then rename) and removes the same module's older caches. */
function writeCache(cacheDir: string, cacheFile: string, base: string, produce: () => Buffer): void {
  const temp = `${cacheFile}.${process.pid}.tmp`;
  try {
    const payload = produce();
    const header = createHash('sha1').update(payload).digest();
    fs.writeFileSync(temp, Buffer.concat([header, payload]), { mode: 0o600 });
    fs.renameSync(temp, cacheFile);
    for (const name of fs.readdirSync(cacheDir)) {
      if (name.startsWith(`${base}-`) && name.endsWith(SUFFIX) && path.join(cacheDir, name) !== cacheFile) {
        fs.rmSync(path.join(cacheDir, name), { force: true });
      }
    }
  } catch {
    // A cache that cannot be written costs the next run its speed, nothing else.
    try {
      fs.rmSync(temp, { force: true });
    } catch {
      // Nothing more to tidy.
    }
  }
}
