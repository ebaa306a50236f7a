/**
 * Module design complexity iv(G)
 * ==============================
 * V(G) of a function's flow graph after McCabe's design reduction: blocks holding calls to
 * other modules' functions ("call nodes") are kept, and every decision that does not affect
 * whether (or how often) a call node is reached is removed. NIST SP 500-235 §7.4 states the
 * rules as: (0) call nodes cannot be reduced; (1) sequential non-call nodes are merged;
 * (2) repetitive structures (loops) without call nodes are removed; (3) conditional structures
 * with no call node in their branches are removed, their parallel edges merged.
 *
 * One rule here does all of these, and also works on unstructured code (`break` out of a loop,
 * early `return`) where the textbook rules stall: for a block h with immediate post-dominator t,
 * the blocks reachable from h's successors without passing t form h's region. When the region
 * holds no call node (h itself counts only when the region loops back to it), every path from
 * h reaches t without a call, so h's out-edges become one edge h → t and the region disappears;
 * an edge from elsewhere into the region is pointed at t (it too reaches t without a call).
 * A branch-free region (rule 1), a call-free loop (rule 2) and a call-free if/else or switch
 * (rule 3) are all such regions. Each collapse removes at least as many edges as blocks, so
 * V never grows: 1 ≤ iv ≤ V(G). iv = E − N + 2 of what is left.
 *
 * Edge cases: a function without call nodes has iv = 1; dead code is dropped first; a call
 * node's own loop (`while (poll()) {}`) is kept, since it decides how often the call runs;
 * a call in a decision whose branches hold no call (`if (ok()) x = 1;`) does not keep that
 * decision. The graph's decisions are counted as they are (a switch counts per case).
 *
 * [Reference]: T. J. McCabe & C. W. Butler, "Design Complexity Measurement and Testing",
 * CACM 32(12), 1989; A. H. Watson & T. J. McCabe, NIST SP 500-235 (1996), §7.4.
 */
import { EdgeLists } from '../essential/EdgeLists';
import type { FlowGraph } from '../model';
import { immediatePostDominators } from './postDominators';

export { callBlocksOf } from './callBlocksOf';

/** iv(G) of one function's graph, given the blocks that call other modules' functions. */
export function designComplexity(graph: FlowGraph, callBlocks: ReadonlySet<number>): number {
  const reducer = new DesignReducer(graph, callBlocks);
  if (!reducer.hasLiveCall()) return 1;
  reducer.reduce();
  return reducer.cyclomatic();
}

class DesignReducer {
  private readonly e: EdgeLists;
  private readonly live: Uint8Array;
  private readonly call: Uint8Array;
  /** Region membership: `mark[b] === stamp` while the current region is built. */
  private readonly mark: Int32Array;
  private stamp = 0;
  private readonly entry: number;
  private readonly exit: number;

  constructor(graph: FlowGraph, callBlocks: ReadonlySet<number>) {
    const n = graph.blocks.length;
    const isBlock = (id: number): boolean => Number.isInteger(id) && id >= 0 && id < n;
    if (!isBlock(graph.entry)) throw new RangeError(`analyzer/design: entry ${graph.entry} is not a block of the graph`);
    if (!isBlock(graph.exit)) throw new RangeError(`analyzer/design: exit ${graph.exit} is not a block of the graph`);
    this.entry = graph.entry;
    this.exit = graph.exit;
    this.e = new EdgeLists(n, graph.edges.length);
    graph.edges.forEach((edge, i) => {
      if (!isBlock(edge.from) || !isBlock(edge.to)) throw new RangeError(`analyzer/design: edge ${edge.from} → ${edge.to} names a block that does not exist`);
      this.e.add(i, edge.from, edge.to);
    });
    this.call = new Uint8Array(n);
    for (const b of callBlocks) {
      if (!isBlock(b)) throw new RangeError(`analyzer/design: call block ${b} is not a block of the graph`);
      this.call[b] = 1;
    }
    this.live = new Uint8Array(n).fill(1);
    this.mark = new Int32Array(n);
    this.dropDeadBlocks();
  }

  hasLiveCall(): boolean {
    return this.call.some((c, b) => c === 1 && this.live[b] === 1);
  }

  reduce(): void {
    // A collapse usually keeps the post-dominators of the blocks left, so one computation
    // serves a whole round. Not when the region loops back to h and is also entered from
    // elsewhere (a jump into a loop body): that entry now goes straight to t, so the blocks
    // above it may no longer pass h, and an ipdom of h read later in the round could name a
    // block that no longer post-dominates (its "region" would run past the exit). Such a
    // collapse ends the round. A round that collapses nothing ends the reduction.
    for (let changed = true; changed; ) {
      changed = false;
      const ipdom = immediatePostDominators(this.e, this.live, this.exit);
      for (const h of this.postOrder()) {
        const t = ipdom[h];
        if (!this.live[h] || t < 0 || !this.live[t] || this.e.outCount[h] === 0) continue;
        if (this.e.outCount[h] === 1 && this.e.to[this.e.outHead[h]] === t) continue;
        const region = this.callFreeRegion(h, t);
        if (!region) continue;
        changed = true;
        if (!this.collapse(h, t, region)) break;
      }
      if (changed) this.dropDeadBlocks();
    }
  }

  /** E − N + 2 over the live blocks (the exit always counts). */
  cyclomatic(): number {
    let nodes = 0;
    let edges = 0;
    for (let b = 0; b < this.live.length; b++) {
      if (!this.live[b]) continue;
      nodes++;
      edges += this.e.outCount[b];
    }
    return edges - nodes + 2;
  }

  /** The blocks reachable from h's successors without passing t, or null when a call node is among them. */
  private callFreeRegion(h: number, t: number): number[] | null {
    const stamp = ++this.stamp;
    const region: number[] = [];
    const stack: number[] = [h];
    while (stack.length > 0) {
      for (let i = this.e.outHead[stack.pop()!]; i >= 0; i = this.e.outNext[i]) {
        const s = this.e.to[i];
        if (s === t || this.mark[s] === stamp) continue;
        if (this.call[s]) return null;
        this.mark[s] = stamp;
        region.push(s);
        stack.push(s);
      }
    }
    return region;
  }

  /**
   * Replaces h's out-edges by one edge to t and removes the region (marked with the current
   * stamp). Returns false when the post-dominators of the blocks left may have changed: the
   * region passes through h and an edge from outside it was pointed at t, bypassing h.
   */
  private collapse(h: number, t: number, region: number[]): boolean {
    const stamp = this.stamp;
    let bypassed = false;
    for (const s of region) {
      if (s === h) continue;
      for (let i = this.e.inHead[s]; i >= 0; ) {
        const next = this.e.inNext[i];
        const p = this.e.from[i];
        if (p !== h && this.mark[p] !== stamp) {
          this.e.retarget(i, t);
          bypassed = true;
        }
        i = next;
      }
    }
    for (const s of region) {
      if (s === h) continue;
      while (this.e.outHead[s] >= 0) this.e.remove(this.e.outHead[s]);
      this.live[s] = 0;
    }
    const keep = this.e.outHead[h];
    while (this.e.outNext[keep] >= 0) this.e.remove(this.e.outNext[keep]);
    if (this.e.to[keep] !== t) this.e.retarget(keep, t);
    return !(bypassed && this.mark[h] === stamp);
  }

  /** Live blocks in post-order from the entry: inner structures come before the ones around them. */
  private postOrder(): number[] {
    const order: number[] = [];
    const seen = new Uint8Array(this.live.length);
    const stack: { b: number; edge: number }[] = [{ b: this.entry, edge: this.e.outHead[this.entry] }];
    seen[this.entry] = 1;
    while (stack.length > 0) {
      const top = stack[stack.length - 1];
      if (top.edge < 0) {
        order.push(top.b);
        stack.pop();
        continue;
      }
      const s = this.e.to[top.edge];
      top.edge = this.e.outNext[top.edge];
      if (!seen[s]) {
        seen[s] = 1;
        stack.push({ b: s, edge: this.e.outHead[s] });
      }
    }
    return order;
  }

  /** Removes blocks the entry no longer reaches (never the exit) with their edges. */
  private dropDeadBlocks(): void {
    const reached = new Uint8Array(this.live.length);
    const stack = [this.entry];
    reached[this.entry] = 1;
    while (stack.length > 0) {
      for (let i = this.e.outHead[stack.pop()!]; i >= 0; i = this.e.outNext[i]) {
        const s = this.e.to[i];
        if (!reached[s]) {
          reached[s] = 1;
          stack.push(s);
        }
      }
    }
    for (let b = 0; b < this.live.length; b++) {
      if (reached[b] || b === this.exit || !this.live[b]) continue;
      while (this.e.outHead[b] >= 0) this.e.remove(this.e.outHead[b]);
      this.live[b] = 0;
    }
  }
}
