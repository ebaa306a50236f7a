/**
 * What a basis set cannot cover
 * =============================
 * Names the decisions and outcomes no entry-to-exit path can exercise, so that a short basis
 * set is explained rather than silent: decisions in dead code (the entry never reaches their
 * block), decisions the entry reaches but from which the exit cannot be reached (inside an
 * endless loop), and single outcomes whose target never reaches the exit. With the flow
 * graph's usual shape (two out-edges per decision, one per other block), `basisPaths` returns
 * exactly 1 + decisions − unreachableDecisions − trappedDecisions − trappedOutcomes paths,
 * which is V(G) when all three lists are empty, and none at all when `exitReachable` is false
 * (the function never returns, whatever it decides).
 *
 * [Reference]: A. H. Watson & T. J. McCabe, NIST SP 500-235 (1996), §6 (a basis set has V(G)
 * paths when every node lies on an entry-to-exit path).
 */
import type { FlowGraph, Outcome } from '../model';
import { routeToExit } from './routeToExit';

/** Decisions and outcomes that no entry-to-exit path can take. */
export interface BasisCoverageGap {
  /** Whether any path leads from the entry to the exit. */
  exitReachable: boolean;
  /** Decisions whose block the entry does not reach (dead code). */
  unreachableDecisions: number[];
  /** Reachable decisions whose block cannot reach the exit at all. */
  trappedDecisions: number[];
  /** Outcomes of the other reachable decisions that lead where the exit cannot be reached. */
  trappedOutcomes: { decision: number; outcome: Outcome }[];
}

/** Why `basisPaths` may return fewer than V(G) paths for this graph. */
export function basisCoverageGap(graph: FlowGraph): BasisCoverageGap {
  const { reachable, distance } = routeToExit(graph);
  const gap: BasisCoverageGap = { exitReachable: distance[graph.entry] >= 0, unreachableDecisions: [], trappedDecisions: [], trappedOutcomes: [] };
  for (const d of graph.decisions) {
    if (!reachable[d.block]) gap.unreachableDecisions.push(d.id);
    else if (distance[d.block] < 0) gap.trappedDecisions.push(d.id);
  }
  graph.edges.forEach((e) => {
    if (e.decision === undefined || !e.outcome) return;
    if (reachable[e.from] && distance[e.from] >= 0 && distance[e.to] < 0) {
      gap.trappedOutcomes.push({ decision: e.decision, outcome: e.outcome });
    }
  });
  return gap;
}
