/**
 * Immediate post-dominators
 * =========================
 * For every live block of a graph being rewritten, the nearest block that every path from it to
 * the exit passes through (−1 for the exit and for dead blocks). Computed as dominators of the
 * reversed graph rooted at the exit, with the iterative algorithm of Cooper, Harvey and Kennedy
 * (reverse post-order, "intersect" by post-order numbers; explicit stacks, no recursion).
 *
 * Edge case: a block from which the exit cannot be reached (an endless loop) gets a virtual edge
 * to the exit here only, so that every live block has a post-dominator; the graph is unchanged.
 *
 * [Reference]: K. D. Cooper, T. J. Harvey, K. Kennedy, "A Simple, Fast Dominance Algorithm",
 * Software Practice & Experience 4 (2001).
 */
import type { EdgeLists } from '../essential/EdgeLists';

/** ipdom[b] for every block b (−1 when b is the exit or not live). */
export function immediatePostDominators(e: EdgeLists, live: Uint8Array, exit: number): Int32Array {
  const n = live.length;
  const reaches = blocksReachingExit(e, live, exit);
  // Post-order of the reversed graph (edges walked backwards, plus the virtual edges), from the exit.
  const order = new Int32Array(n).fill(-1);
  const sequence: number[] = [];
  const visited = new Uint8Array(n);
  const stack: { b: number; edge: number; virtual: number }[] = [{ b: exit, edge: e.inHead[exit], virtual: 0 }];
  visited[exit] = 1;
  while (stack.length > 0) {
    const top = stack[stack.length - 1];
    let next = -1;
    while (top.edge >= 0 && next < 0) {
      const p = e.from[top.edge];
      top.edge = e.inNext[top.edge];
      if (live[p] && !visited[p]) next = p;
    }
    // The exit's virtual predecessors: live blocks that cannot reach it.
    while (next < 0 && top.b === exit && top.virtual < n) {
      const p = top.virtual++;
      if (live[p] && !reaches[p] && !visited[p]) next = p;
    }
    if (next >= 0) {
      visited[next] = 1;
      stack.push({ b: next, edge: e.inHead[next], virtual: n });
    } else {
      order[top.b] = sequence.length;
      sequence.push(top.b);
      stack.pop();
    }
  }

  const idom = new Int32Array(n).fill(-1);
  idom[exit] = exit;
  const intersect = (a: number, b: number): number => {
    while (a !== b) {
      while (order[a] < order[b]) a = idom[a];
      while (order[b] < order[a]) b = idom[b];
    }
    return a;
  };
  for (let changed = true; changed; ) {
    changed = false;
    for (let k = sequence.length - 2; k >= 0; k--) {
      const b = sequence[k];
      let candidate = reaches[b] ? -1 : exit;
      for (let i = e.outHead[b]; i >= 0; i = e.outNext[i]) {
        const s = e.to[i];
        if (order[s] < 0 || idom[s] < 0) continue;
        candidate = candidate < 0 ? s : intersect(s, candidate);
      }
      if (candidate >= 0 && idom[b] !== candidate) {
        idom[b] = candidate;
        changed = true;
      }
    }
  }
  idom[exit] = -1;
  return idom;
}

function blocksReachingExit(e: EdgeLists, live: Uint8Array, exit: number): Uint8Array {
  const reaches = new Uint8Array(live.length);
  reaches[exit] = 1;
  const stack = [exit];
  while (stack.length > 0) {
    for (let i = e.inHead[stack.pop()!]; i >= 0; i = e.inNext[i]) {
      const p = e.from[i];
      if (live[p] && !reaches[p]) {
        reaches[p] = 1;
        stack.push(p);
      }
    }
  }
  return reaches;
}
