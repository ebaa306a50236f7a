/**
 * Routes to the exit
 * ==================
 * Shared ground for the basis-path functions: each block's out-edges, which blocks the entry
 * reaches, the length of the shortest route from each block to the exit (−1 when there is
 * none, e.g. inside `for (;;) {}`), and each block's preferred edge: the out-edge that starts a
 * shortest route to the exit, ties going to the `true` outcome (for `catch`, to "completes": a
 * baseline should not need an exception), then to the lower edge index.
 * Following preferred edges always reaches the exit without repeating a block, because each
 * step shortens the remaining route by one.
 *
 * [Reference]: breadth-first search, E. F. Moore, "The shortest path through a maze", 1959.
 */
import type { FlowGraph } from '../model';

export interface RouteToExit {
  /** Edge indices leaving each block, in edge order. */
  out: number[][];
  reachable: Uint8Array;
  /** Edges on the shortest route from each block to the exit; −1 when the exit cannot be reached. */
  distance: Int32Array;
  /** The out-edge starting a shortest route to the exit, −1 where there is none. */
  preferred: Int32Array;
}

/** Indexes a flow graph for path building; throws on edges that name missing blocks. */
export function routeToExit(graph: FlowGraph): RouteToExit {
  const n = graph.blocks.length;
  const check = (id: number, what: string): void => {
    if (!Number.isInteger(id) || id < 0 || id >= n) throw new RangeError(`analyzer/paths: ${what} ${id} is not a block of the graph`);
  };
  check(graph.entry, 'entry');
  check(graph.exit, 'exit');
  const out: number[][] = Array.from({ length: n }, () => []);
  const into: number[][] = Array.from({ length: n }, () => []);
  graph.edges.forEach((e, i) => {
    check(e.from, 'edge source');
    check(e.to, 'edge target');
    out[e.from].push(i);
    into[e.to].push(i);
  });

  const reachable = new Uint8Array(n);
  const stack = [graph.entry];
  reachable[graph.entry] = 1;
  while (stack.length > 0) {
    for (const i of out[stack.pop()!]) {
      const to = graph.edges[i].to;
      if (!reachable[to]) {
        reachable[to] = 1;
        stack.push(to);
      }
    }
  }

  const distance = new Int32Array(n).fill(-1);
  distance[graph.exit] = 0;
  const queue = [graph.exit];
  for (let head = 0; head < queue.length; head++) {
    const b = queue[head];
    for (const i of into[b]) {
      const from = graph.edges[i].from;
      if (distance[from] < 0) {
        distance[from] = distance[b] + 1;
        queue.push(from);
      }
    }
  }

  const catches = new Set(graph.decisions.filter((d) => d.kind === 'catch').map((d) => d.id));
  const favoured = (i: number): boolean => {
    const { decision, outcome } = graph.edges[i];
    return outcome === (decision !== undefined && catches.has(decision) ? 'false' : 'true');
  };
  const preferred = new Int32Array(n).fill(-1);
  for (let b = 0; b < n; b++) {
    if (b === graph.exit) continue;
    let best = -1;
    for (const i of out[b]) {
      const d = distance[graph.edges[i].to];
      if (d < 0) continue;
      if (best < 0) {
        best = i;
        continue;
      }
      const bestD = distance[graph.edges[best].to];
      if (d < bestD || (d === bestD && favoured(i) && !favoured(best))) best = i;
    }
    preferred[b] = best;
  }
  return { out, reachable, distance, preferred };
}
