/**
 * Which module a function belongs to
 * ==================================
 * At the file level a function belongs to the module whose path is its file. At the folder and
 * package levels it belongs to the module whose path is its file or the longest folder that
 * contains it, so a nested package wins over the package around it. A module with the path `.`
 * or `` stands for the scanned root and takes every file no other module claims. A file no
 * module claims belongs to none (undefined). Lookups walk up the file's folders one `/` at a
 * time against a hash of the paths, so each costs the file's depth, not the number of modules.
 */
import type { ModuleLevel, ModuleRecord } from '../model';

/** A lookup from a file (posix path relative to the root) to the id of its module at `level`. */
export function moduleMembership(modules: readonly ModuleRecord[], level: ModuleLevel): (file: string) => string | undefined {
  const byPath = new Map<string, string>();
  let rootModule: string | undefined;
  for (const m of modules) {
    if (m.level !== level) continue;
    if (level !== 'file' && (m.path === '.' || m.path === '')) rootModule = m.id;
    else byPath.set(m.path, m.id);
  }
  const cache = new Map<string, string | undefined>();
  return (file) => {
    if (cache.has(file)) return cache.get(file);
    let found = byPath.get(file);
    if (level !== 'file') {
      let dir = file;
      for (let slash = dir.lastIndexOf('/'); found === undefined && slash > 0; slash = dir.lastIndexOf('/')) {
        dir = dir.slice(0, slash);
        found = byPath.get(dir);
      }
      found ??= rootModule;
    }
    cache.set(file, found);
    return found;
  };
}
