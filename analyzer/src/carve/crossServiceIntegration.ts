/**
 * Integration complexity of a split
 * =================================
 * How many independent integration tests the calls crossing service boundaries need. The
 * cross-service call graph has a node per function taking part in a cross-service call and an
 * edge per distinct (caller, callee) pair; with e edges, n nodes and p weakly connected
 * components, S1 = (e − n + p) + p = e − n + 2p: the graph's cyclomatic number (its independent
 * cycles) plus one test per connected group of calls. A split with no cross-service calls needs
 * none (0); a single crossing call needs one; every pair that closes a cycle or joins two
 * callers of the same function adds one. Components are found with union-find (no recursion).
 *
 * [Reference]: our adaptation of McCabe & Butler 1989 (CACM 32(12)) and Watson & McCabe,
 * NIST SP 500-235 §7.5, S1 = S0 − n + 1 (integration tests of a call tree), to the subgraph of
 * cross-service calls, counted as McCabe 1976 counts v(G) = e − n + 2p.
 */
import type { CarveIndex } from './prepareCarve';

/** The cross-service call graph's size and its S1 = e − n + 2p under `serviceOf` (a service per module slot). */
export function crossServiceIntegration(index: CarveIndex, serviceOf: Int32Array): { edges: number; functions: number; components: number; integrationComplexity: number } {
  // parent[f] = -1: f takes no part (yet); roots point to themselves.
  const parent = new Int32Array(index.functionCount).fill(-1);
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]];
      x = parent[x];
    }
    return x;
  };
  let edges = 0;
  let functions = 0;
  let components = 0;
  for (let k = 0; k < index.pairFrom.length; k++) {
    if (serviceOf[index.pairFromModule[k]] === serviceOf[index.pairToModule[k]]) continue;
    edges++;
    const a = index.pairFrom[k];
    const b = index.pairTo[k];
    if (parent[a] === -1) {
      parent[a] = a;
      functions++;
      components++;
    }
    if (parent[b] === -1) {
      parent[b] = b;
      functions++;
      components++;
    }
    const ra = find(a);
    const rb = find(b);
    if (ra !== rb) {
      parent[ra] = rb;
      components--;
    }
  }
  return { edges, functions, components, integrationComplexity: edges - functions + 2 * components };
}
