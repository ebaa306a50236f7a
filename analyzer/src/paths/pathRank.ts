/**
 * Rank of a set of paths
 * ======================
 * Builds the path × edge incidence matrix (how often each path takes each edge, plus one
 * column for the virtual exit → entry edge that closes every path into a circuit) and returns
 * its rank: the number of linearly independent paths among them. A basis set has rank V(G).
 * The elimination runs modulo a prime just below 2^26, so every product stays an exact
 * integer in a double. A rank found modulo p is a lower bound of the rank over the rationals
 * (a minor that is non-zero modulo p is non-zero), so "rank = number of paths" is exact
 * proof of independence; a lower rank is re-checked modulo a second prime, and the larger
 * result is returned (the two can only both be low by the rarest of coincidences).
 *
 * [Reference]: McCabe 1976, IEEE TSE SE-2(4), Theorem 1 (v = number of linearly independent
 * circuits); NIST SP 500-235 §2.2 (the virtual edge) and §6.
 */
import type { FlowGraph } from '../model';

const PRIMES = [67108859, 67108837];

/** Rank of the paths' edge-count vectors, with the virtual exit → entry edge. */
export function pathRank(graph: FlowGraph, paths: readonly { edges: readonly number[] }[]): number {
  const columns = graph.edges.length + 1;
  const rows = paths.map((path) => {
    const row = new Float64Array(columns);
    for (const i of path.edges) {
      if (!Number.isInteger(i) || i < 0 || i >= graph.edges.length) throw new RangeError(`analyzer/paths: edge ${i} is not an edge of the graph`);
      row[i] += 1;
    }
    row[columns - 1] = 1;
    return row;
  });
  let best = 0;
  for (const p of PRIMES) {
    best = Math.max(best, rankModulo(rows.map((r) => r.slice()), columns, p));
    if (best === Math.min(rows.length, columns)) break;
  }
  return best;
}

function rankModulo(rows: Float64Array[], columns: number, p: number): number {
  let rank = 0;
  for (let c = 0; c < columns && rank < rows.length; c++) {
    let pivot = -1;
    for (let r = rank; r < rows.length; r++) {
      rows[r][c] %= p;
      if (pivot < 0 && rows[r][c] !== 0) pivot = r;
    }
    if (pivot < 0) continue;
    [rows[rank], rows[pivot]] = [rows[pivot], rows[rank]];
    const top = rows[rank];
    const inverse = inverseModulo(top[c], p);
    for (let k = c; k < columns; k++) top[k] = (top[k] * inverse) % p;
    for (let r = rank + 1; r < rows.length; r++) {
      const row = rows[r];
      const factor = row[c];
      if (factor === 0) continue;
      for (let k = c; k < columns; k++) {
        if (top[k] !== 0) row[k] = (((row[k] - factor * top[k]) % p) + p) % p;
      }
    }
    rank++;
  }
  return rank;
}

function inverseModulo(a: number, p: number): number {
  let [r0, r1] = [p, a % p];
  let [t0, t1] = [0, 1];
  while (r1 !== 0) {
    const q = Math.floor(r0 / r1);
    [r0, r1] = [r1, r0 - q * r1];
    [t0, t1] = [t1, t0 - q * t1];
  }
  return ((t0 % p) + p) % p;
}
