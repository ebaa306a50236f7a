/**
 * Undirected module edges
 * =======================
 * Turns one level's directed module edges into undirected weighted pairs over module indexes:
 * a→b and b→a (and any repeats) add up, self-loops and zero weights are dropped. Pairs come out
 * sorted by (lower index, higher index), so the result does not depend on the edges' order.
 * An edge whose end is not one of the level's modules, or whose weight is negative or not a
 * number, is refused. Linear apart from sorting each module's neighbours: a counting sort by
 * the lower index, then a sort within each bucket (insertion sort for the usual few), merging repeats.
 */
import type { ModuleEdge, ModuleLevel } from '../model';
import { ClusterInputError } from './ClusterInputError';
import { indexLevelEdges, type LevelEdges } from './levelIndex';

/** Undirected pairs as parallel arrays: `lo[k] < hi[k]` index into the module ids. */
export interface MergedEdges {
  size: number;
  lo: Int32Array;
  hi: Int32Array;
  weight: Float64Array;
}

/** Merges `level`'s edges between the modules `ids` into undirected weighted pairs. */
export function mergeModuleEdges(ids: readonly string[], edges: readonly ModuleEdge[], level: ModuleLevel): MergedEdges {
  return mergeLevelEdges(indexLevelEdges(ids, edges, level, (message) => new ClusterInputError(message)));
}

/** The same from an indexed level (indexLevel), which has refused bad edges and dropped self-loops. */
export function mergeLevelEdges(level: LevelEdges): MergedEdges {
  const n = level.ids.length;
  const count = level.size;
  const rawLo = new Int32Array(count);
  const rawHi = new Int32Array(count);
  const start = new Int32Array(n + 1);
  for (let k = 0; k < count; k++) {
    const a = level.from[k];
    const b = level.to[k];
    rawLo[k] = a < b ? a : b;
    rawHi[k] = a < b ? b : a;
    start[rawLo[k] + 1]++;
  }
  const rawW = level.weight;
  for (let i = 0; i < n; i++) start[i + 1] += start[i];

  // Bucket by the lower index, then sort and merge each bucket by the higher index.
  const hiOf = new Int32Array(count);
  const wOf = new Float64Array(count);
  const fill = start.slice(0, n);
  for (let k = 0; k < count; k++) {
    const at = fill[rawLo[k]]++;
    hiOf[at] = rawHi[k];
    wOf[at] = rawW[k];
  }
  const lo = new Int32Array(count);
  const hi = new Int32Array(count);
  const weight = new Float64Array(count);
  let size = 0;
  for (let a = 0; a < n; a++) {
    const from = start[a];
    const to = start[a + 1];
    if (to - from > 16) sortLargeBucket(hiOf, wOf, from, to);
    else insertionSort(hiOf, wOf, from, to);
    for (let k = from; k < to; k++) {
      if (k > from && hiOf[k] === hiOf[k - 1]) weight[size - 1] += wOf[k];
      else {
        lo[size] = a;
        hi[size] = hiOf[k];
        weight[size++] = wOf[k];
      }
    }
  }
  return { size, lo: lo.subarray(0, size), hi: hi.subarray(0, size), weight: weight.subarray(0, size) };
}

function insertionSort(hiOf: Int32Array, wOf: Float64Array, from: number, to: number): void {
  for (let k = from + 1; k < to; k++) {
    const h = hiOf[k];
    const w = wOf[k];
    let j = k - 1;
    while (j >= from && hiOf[j] > h) {
      hiOf[j + 1] = hiOf[j];
      wOf[j + 1] = wOf[j];
      j--;
    }
    hiOf[j + 1] = h;
    wOf[j + 1] = w;
  }
}

// NOTE: a hub's bucket can hold thousands of neighbours; insertion sort would be quadratic there.
function sortLargeBucket(hiOf: Int32Array, wOf: Float64Array, from: number, to: number): void {
  const order = Array.from({ length: to - from }, (_, i) => from + i).sort((x, y) => hiOf[x] - hiOf[y]);
  const h = order.map((k) => hiOf[k]);
  const w = order.map((k) => wOf[k]);
  hiOf.set(h, from);
  wOf.set(w, from);
}
