/**
 * One level's modules and edges by index
 * =======================================
 * Clustering and gravity both read a level's directed module edges as pairs of module indexes.
 * Mapping 10^5 module ids and 10^6 edge ends through a Map is the costly part of that, so it is
 * done once here and shared: the level's modules, their ids, and the kept edges as parallel
 * arrays. Self-loops and zero weights are dropped (they change neither clusters nor traffic); an
 * edge naming a module that is not at the level, or with a negative or non-finite weight, is
 * refused with the caller's error type, and so is a module listed twice.
 */
import type { ModuleEdge, ModuleLevel, ModuleRecord } from '../model';

/** A level's directed edges between the modules `ids`, by index into `ids`. */
export interface LevelEdges {
  ids: readonly string[];
  /** Kept edges: `from[k] → to[k]` with `weight[k]` > 0 and `from[k] !== to[k]`. */
  size: number;
  from: Int32Array;
  to: Int32Array;
  weight: Float64Array;
}

/** The same with the level's modules, in the order of `ids`. */
export interface LevelIndex extends LevelEdges {
  level: ModuleLevel;
  modules: readonly ModuleRecord[];
}

/** Indexes `level`'s modules, in the order given, and its edges (see the file header); errors are made by `fail`. */
export function indexLevel(modules: readonly ModuleRecord[], edges: readonly ModuleEdge[], level: ModuleLevel, fail: (message: string) => Error): LevelIndex {
  const own = modules.filter((m) => m.level === level);
  return { level, modules: own, ...indexLevelEdges(own.map((m) => m.id), edges, level, fail) };
}

/** Indexes `level`'s edges between the modules `ids` (see the file header). */
export function indexLevelEdges(ids: readonly string[], edges: readonly ModuleEdge[], level: ModuleLevel, fail: (message: string) => Error): LevelEdges {
  const index = new Map<string, number>();
  for (let i = 0; i < ids.length; i++) {
    if (index.has(ids[i])) throw fail(`module ${ids[i]} is listed twice`);
    index.set(ids[i], i);
  }
  const from = new Int32Array(edges.length);
  const to = new Int32Array(edges.length);
  const weight = new Float64Array(edges.length);
  let size = 0;
  for (const e of edges) {
    if (e.level !== level) continue;
    const a = index.get(e.from);
    const b = index.get(e.to);
    if (a === undefined || b === undefined) throw fail(`edge ${e.from} → ${e.to} names a module that is not among the ${level} modules`);
    if (!Number.isFinite(e.weight) || e.weight < 0) throw fail(`edge ${e.from} → ${e.to} has weight ${e.weight}; weights must be finite and ≥ 0`);
    if (a === b || e.weight === 0) continue;
    from[size] = a;
    to[size] = b;
    weight[size++] = e.weight;
  }
  return { ids, size, from: from.subarray(0, size), to: to.subarray(0, size), weight: weight.subarray(0, size) };
}
