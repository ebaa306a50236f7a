/**
 * Cyclomatic complexity V(G)
 * ==========================
 * `cyclomaticOf` computes McCabe's v(G) = e − n + 2p straight from a flow graph, with p the
 * number of weakly connected components (union-find, no recursion), so it also works on the
 * union of several units' graphs (additivity: v of the union = Σ v of the parts).
 * `reportedCyclomatic` applies the `--switch one` reporting convention: a switch with k ≥ 1
 * cases counts as one decision, i.e. (k − 1) is subtracted per switch; the graph is unchanged.
 *
 * Edge cases: an empty graph has n = e = p = 0 and v = 0; an edge naming a missing block throws.
 *
 * [Reference]: McCabe 1976, IEEE TSE SE-2(4), v(G) = e − n + 2p; Watson & McCabe, NIST SP
 * 500-235 §2.2 and §2.5 (multiway decisions); ESLint 9 `complexity` `variant: "modified"`.
 */
import { FlowGraphError } from '../cfg/FlowGraphError';
import type { CountingSettings } from '../model/CountingSettings';
import type { FlowGraph } from '../model/FlowGraph';

/** Node, edge and component counts of a flow graph and its strict V(G) = E − N + 2P. */
export function cyclomaticOf(graph: FlowGraph): { nodes: number; edges: number; components: number; strict: number } {
  const n = graph.blocks.length;
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]];
      x = parent[x];
    }
    return x;
  };
  let components = n;
  for (const edge of graph.edges) {
    if (!(edge.from >= 0 && edge.from < n && edge.to >= 0 && edge.to < n)) {
      throw new FlowGraphError(`edge ${edge.from} → ${edge.to} names a block that does not exist (${n} blocks)`);
    }
    const a = find(edge.from);
    const b = find(edge.to);
    if (a !== b) {
      parent[a] = b;
      components--;
    }
  }
  const edges = graph.edges.length;
  return { nodes: n, edges, components, strict: edges - n + 2 * components };
}

/** V(G) as reported: with `switch: 'one'`, strict − Σ (cases − 1) over switches with at least one case. */
export function reportedCyclomatic(strict: number, casesPerSwitch: readonly number[], settings: CountingSettings): number {
  if (settings.switch !== 'one') return strict;
  let reported = strict;
  for (const cases of casesPerSwitch) if (cases >= 1) reported -= cases - 1;
  return reported;
}
