/**
 * Actual complexity AC
 * ====================
 * The cyclomatic number of the part of a flow graph that a test run covered: how many
 * independent paths the executed outcomes can combine into. Starting at the entry, control
 * follows every plain edge of a reached block and a decision's edge only when that outcome
 * is covered; AC = E − N + 1 over the reached blocks and followed edges, plus 1 for the
 * virtual exit → entry edge when the exit was reached (so a fully covered graph gives
 * exactly V(G) = E − N + 2). A unit that never ran has AC = 0; one that ran has AC ≥ 1.
 * AC ≤ V(G) always (a subgraph's cycle rank never exceeds the graph's), so V − AC counts
 * the basis paths no test has walked yet.
 *
 * [Reference]: McCabe 1976 (IEEE TSE SE-2(4)), cyclomatic number v = e − n + 2p; Watson &
 * McCabe, NIST SP 500-235 (1996), §2 (the virtual exit → entry edge).
 */
import type { FlowGraph } from '../model';

/** AC of a graph given [true covered, false covered] per decision (graph.decisions order) and whether the unit ran. */
export function actualComplexity(graph: FlowGraph, outcomes: readonly (readonly [boolean, boolean])[], ran: boolean): number {
  if (!ran) return 0;
  const indexOf = new Map(graph.decisions.map((d, i) => [d.id, i]));
  const out: number[][] = graph.blocks.map(() => []);
  graph.edges.forEach((e, i) => out[e.from]?.push(i));
  const followed = (edge: number): boolean => {
    const e = graph.edges[edge];
    if (e.decision === undefined) return true;
    const covered = outcomes[indexOf.get(e.decision) ?? -1];
    return covered !== undefined && covered[e.outcome === 'true' ? 0 : 1];
  };
  const seen = new Set<number>([graph.entry]);
  const stack = [graph.entry];
  let edges = 0;
  while (stack.length > 0) {
    const at = stack.pop()!;
    for (const edge of out[at] ?? []) {
      if (!followed(edge)) continue;
      edges++;
      const to = graph.edges[edge].to;
      if (!seen.has(to)) {
        seen.add(to);
        stack.push(to);
      }
    }
  }
  const virtualEdge = seen.has(graph.exit) ? 1 : 0;
  return Math.max(1, edges - seen.size + 1 + virtualEdge);
}
