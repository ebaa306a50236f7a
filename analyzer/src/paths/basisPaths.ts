/**
 * Basis paths by the baseline method
 * ==================================
 * Lists V(G) linearly independent entry-to-exit paths, each a test case to write:
 * 1. The baseline takes, at every decision, the outcome that starts the shortest route to the
 *    exit (ties go to `true`, for `catch` to "completes"), so it never repeats a block: it skips
 *    loops and optional branches and is the quickest way through the function.
 * 2. Each decision the baseline passes is then flipped once: the new path agrees with the
 *    baseline up to that decision, takes the other outcome, and from there follows the
 *    baseline's rule (shortest route to the exit) again.
 * 3. Decisions first reached by a flipped path are flipped the same way, copying that path up
 *    to the decision, until every reachable outcome has been taken.
 * A flipped loop test enters the body once and leaves on the next visit, so loop bodies are
 * reached and loops repeat at most as often as needed. Every new path takes one outcome that
 * no earlier path took, hence the paths are linearly independent (`pathRank` checks it).
 * The count is 1 + the decisions the paths can exercise. That is V(G) when every block is
 * reachable from the entry and reaches the exit. Decisions in dead code cannot be exercised,
 * and outcomes that never reach the exit (`for (;;) {}`) cannot end a path: the count drops by
 * one for each; `basisCoverageGap` names them. A graph whose entry cannot reach the exit has
 * no paths.
 *
 * [Reference]: A. H. Watson & T. J. McCabe, NIST SP 500-235 (1996), §6 "The Baseline Method".
 */
import type { FlowGraph, Outcome } from '../model';
import { routeToExit } from './routeToExit';

/** One path from entry to exit, as a test case. */
export interface BasisPath {
  blocks: number[];
  edges: number[];
  /** the outcome taken at each decision along the path, in order */
  steps: { decision: number; outcome: Outcome }[];
}

export interface BasisPathOptions {
  /** Longest path allowed, in edges; a longer one is refused with a RangeError. Default: no limit. */
  maxPathLength?: number;
}

/** A basis set of entry-to-exit paths (baseline first), built by the baseline method. */
export function basisPaths(graph: FlowGraph, options: BasisPathOptions = {}): BasisPath[] {
  const maxPathLength = options.maxPathLength ?? Number.POSITIVE_INFINITY;
  const { out, distance, preferred } = routeToExit(graph);
  if (distance[graph.entry] < 0) return [];

  const routes: number[][] = [];
  const n = graph.blocks.length;
  const seen = new Uint8Array(n);
  // For each branching block, where it was first reached: which path, and after how many edges.
  const firstPath = new Int32Array(n);
  const firstAt = new Int32Array(n);
  const toFlip: number[] = [];

  const finish = (edges: number[]): void => {
    let at = edges.length === 0 ? graph.entry : graph.edges[edges[edges.length - 1]].to;
    while (at !== graph.exit) {
      edges.push(preferred[at]);
      at = graph.edges[preferred[at]].to;
    }
    if (edges.length > maxPathLength) {
      throw new RangeError(`analyzer/paths: a basis path needs ${edges.length} edges, more than maxPathLength ${maxPathLength}`);
    }
    const index = routes.length;
    routes.push(edges);
    for (let k = 0; k <= edges.length; k++) {
      const b = k === 0 ? graph.entry : graph.edges[edges[k - 1]].to;
      if (seen[b] || out[b].length < 2) continue;
      seen[b] = 1;
      firstPath[b] = index;
      firstAt[b] = k;
      toFlip.push(b);
    }
  };

  finish([]);
  for (let q = 0; q < toFlip.length; q++) {
    const b = toFlip[q];
    for (const i of out[b]) {
      if (i === preferred[b] || distance[graph.edges[i].to] < 0) continue;
      const edges = routes[firstPath[b]].slice(0, firstAt[b]);
      edges.push(i);
      finish(edges);
    }
  }
  return routes.map((edges) => toPath(graph, edges));
}

function toPath(graph: FlowGraph, edges: number[]): BasisPath {
  const blocks = [graph.entry];
  const steps: BasisPath['steps'] = [];
  for (const i of edges) {
    const edge = graph.edges[i];
    blocks.push(edge.to);
    if (edge.decision !== undefined && edge.outcome) steps.push({ decision: edge.decision, outcome: edge.outcome });
  }
  return { blocks, edges, steps };
}
