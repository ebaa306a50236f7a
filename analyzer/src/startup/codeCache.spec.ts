import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { requireWithCodeCache } from './codeCache';

// Each load goes into a registry of the test's own, as a fresh process's module registry would,
// from a folder of its own: V8 keeps the scripts an isolate compiled, keyed by source and file
// name, and would hand the same file back without looking at the cache data at all.
type Registry = NodeJS.Dict<NodeJS.Module>;
type Fixture = { answer: number; describe(n: number): string };

let scratch: string;
let cacheDir: string;
let source: string;
let copies = 0;
beforeEach(() => {
  scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-code-cache-'));
  cacheDir = path.join(scratch, 'cache');
  fs.mkdirSync(cacheDir);
  // A lazily compiled function and a require relative to the module, as in the compiler bundle.
  source = [
    "'use strict';",
    "const word = require('./word');",
    'exports.answer = 6 * 7;',
    'exports.describe = function describe(n) { return n % 2 === 0 ? `${n} is ${word}` : `${n} is odd`; };',
    '',
  ].join('\n');
});
afterEach(() => fs.rmSync(scratch, { recursive: true, force: true }));

/** A fresh copy of the module (same content, so the same cache file), as an absolute path. */
function moduleCopy(text = source): string {
  const dir = path.join(scratch, `lib-${++copies}`);
  fs.mkdirSync(dir);
  fs.writeFileSync(path.join(dir, 'word.js'), 'module.exports = "even";\n');
  fs.writeFileSync(path.join(dir, 'bundle.js'), text);
  return path.join(dir, 'bundle.js');
}

const cacheFiles = () => fs.readdirSync(cacheDir).filter((name) => name.endsWith('.v8cache'));

function load(text = source, registry: Registry = {}) {
  const file = moduleCopy(text);
  const result = requireWithCodeCache(file, cacheDir, registry);
  const exports = result.exports as Fixture;
  // Called after loading, so its bytecode is compiled lazily and belongs in the saved cache.
  expect(exports.describe(4)).toBe('4 is even');
  return { result, exports, registry, file };
}

describe('requireWithCodeCache', () => {
  it('should compile without a cache the first time, save it, and take it back on the next load', () => {
    const first = load();
    expect(first.result.status).toBe('miss');
    expect(first.exports.answer).toBe(42);
    expect(first.registry[first.file]?.exports).toBe(first.exports);
    expect(cacheFiles()).toEqual([]);
    first.result.save();
    expect(cacheFiles()).toHaveLength(1);

    const second = load();
    expect(second.result.status).toBe('hit');
    expect(second.exports.describe(3)).toBe('3 is odd');
    expect(second.exports.describe(8)).toBe('8 is even');
    const saved = fs.readFileSync(path.join(cacheDir, cacheFiles()[0]));
    second.result.save();
    expect(fs.readFileSync(path.join(cacheDir, cacheFiles()[0]))).toEqual(saved);
  });

  it('should never hand V8 a damaged cache file, and replace it when saving', () => {
    load().result.save();
    const file = path.join(cacheDir, cacheFiles()[0]);
    const damaged = fs.readFileSync(file);
    damaged[damaged.length - 1] ^= 0xff;
    fs.writeFileSync(file, damaged);

    const reload = load();
    expect(reload.result.status).toBe('miss');
    expect(reload.exports.answer).toBe(42);
    reload.result.save();
    expect(load().result.status).toBe('hit');
  });

  it('should compile as usual when V8 rejects the data, and replace it when saving', () => {
    load().result.save();
    const file = path.join(cacheDir, cacheFiles()[0]);
    // A well-formed file (its header matches) whose payload is not V8's.
    const payload = Buffer.from('not bytecode at all, but long enough to look like some');
    fs.writeFileSync(file, Buffer.concat([createHash('sha1').update(payload).digest(), payload]));

    const reload = load();
    expect(reload.result.status).toBe('rejected');
    expect(reload.exports.describe(5)).toBe('5 is odd');
    reload.result.save();
    expect(load().result.status).toBe('hit');
  });

  it('should use a new cache when the source changes, and remove the old one', () => {
    load().result.save();
    const before = cacheFiles();
    const changed = load(source.replace('6 * 7', '6 * 9'));
    expect(changed.result.status).toBe('miss');
    expect(changed.exports.answer).toBe(54);
    changed.result.save();
    expect(cacheFiles()).toHaveLength(1);
    expect(cacheFiles()).not.toEqual(before);
  });

  it('should return the module a registry already holds, and write nothing', () => {
    const held = { answer: 1 };
    const moduleFile = moduleCopy();
    const registry: Registry = { [moduleFile]: { exports: held } as NodeJS.Module };
    const result = requireWithCodeCache(moduleFile, cacheDir, registry);
    expect(result.exports).toBe(held);
    expect(result.status).toBe('off');
    result.save();
    expect(cacheFiles()).toEqual([]);
  });

  it('should load as usual without a cache folder', () => {
    const result = requireWithCodeCache(moduleCopy(), undefined, {});
    expect(result.status).toBe('off');
    expect((result.exports as Fixture).answer).toBe(42);
  });

  it('should leave nothing in the registry when the module throws while loading', () => {
    const moduleFile = moduleCopy("throw new Error('broken bundle');\n");
    const registry: Registry = {};
    expect(() => requireWithCodeCache(moduleFile, cacheDir, registry)).toThrow('broken bundle');
    expect(registry[moduleFile]).toBeUndefined();
  });

  it('should not fail the caller when the cache cannot be written', () => {
    const first = requireWithCodeCache(moduleCopy(), path.join(scratch, 'missing'), {});
    expect(first.status).toBe('miss');
    expect(() => first.save()).not.toThrow();
    expect(fs.readdirSync(scratch).sort()).toEqual(['cache', 'lib-' + copies]);
  });
});
