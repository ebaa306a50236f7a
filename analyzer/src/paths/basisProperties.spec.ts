import fc from 'fast-check';
import { essentialComplexity } from '../essential/essentialComplexity';
import type { FlowGraph } from '../model';
import { constructArbitrary, constructGraph, reachableBlocks, reachableCyclomatic, rewire } from '../testing/graphs';
import { basisCoverageGap } from './basisCoverageGap';
import { basisPaths } from './basisPaths';
import type { BasisPath } from './basisPaths';
import { pathRank } from './pathRank';

function followsEdges(graph: FlowGraph, path: BasisPath): boolean {
  const decisionSteps = path.edges.filter((i) => graph.edges[i].decision !== undefined);
  return (
    path.blocks[0] === graph.entry &&
    path.blocks[path.blocks.length - 1] === graph.exit &&
    path.edges.every((i, k) => graph.edges[i].from === path.blocks[k] && graph.edges[i].to === path.blocks[k + 1]) &&
    decisionSteps.length === path.steps.length &&
    decisionSteps.every((i, k) => graph.edges[i].decision === path.steps[k].decision && graph.edges[i].outcome === path.steps[k].outcome)
  );
}

/** Every block the entry reaches can also reach the exit. */
function allReachExit(graph: FlowGraph): boolean {
  const reached = reachableBlocks(graph);
  const toExit = graph.blocks.map((b) => b.id === graph.exit);
  for (let changed = true; changed; ) {
    changed = false;
    for (const e of graph.edges) {
      if (toExit[e.to] && !toExit[e.from]) toExit[e.from] = changed = true;
    }
  }
  return graph.blocks.every((b) => !reached[b.id] || toExit[b.id]);
}

/** The same graph with its blocks numbered in another order (a permutation drawn from `seed`). */
function renumber(graph: FlowGraph, seed: number): FlowGraph {
  const order = graph.blocks.map((b) => b.id);
  let state = seed;
  for (let k = order.length - 1; k > 0; k--) {
    state = (state * 1103515245 + 12345) % 2147483648;
    const j = state % (k + 1);
    [order[k], order[j]] = [order[j], order[k]];
  }
  const id = (b: number): number => order[b];
  const blocks = graph.blocks.map((b) => ({ ...b, id: id(b.id) })).sort((x, y) => x.id - y.id);
  const edges = graph.edges.map((e) => ({ ...e, from: id(e.from), to: id(e.to) }));
  const decisions = graph.decisions.map((d) => ({ ...d, block: id(d.block) }));
  return { blocks, edges, decisions, entry: id(graph.entry), exit: id(graph.exit) };
}

const unstructured = fc.tuple(
  constructArbitrary(4),
  fc.array(fc.tuple(fc.nat(1000), fc.nat(1000)), { minLength: 1, maxLength: 3 }),
  fc.nat(1_000_000),
);

describe('basis paths and ev(G) on generated graphs', () => {
  it('structured programs: V paths of rank V, all entry → exit, and ev = 1', () => {
    fc.assert(
      fc.property(constructArbitrary(5), (tree) => {
        const graph = constructGraph(tree);
        const v = graph.edges.length - graph.blocks.length + 2;
        // NIST SP 500-235 §4.1 (reference-checks 2.3): with binary decisions, v = decisions + 1.
        expect(v).toBe(graph.decisions.length + 1);
        const paths = basisPaths(graph);
        // NIST SP 500-235 §6 (reference-checks 2.10, 9.6): exactly v paths, rank v.
        expect(paths).toHaveLength(v);
        expect(pathRank(graph, paths)).toBe(v);
        expect(paths.every((p) => followsEdges(graph, p))).toBe(true);
        // McCabe 1976 / NIST SP 500-235 §10.2 (reference-checks 1.12, 9.4): structured ⇒ ev = 1.
        expect(essentialComplexity(graph).essential).toBe(1);
      }),
      { numRuns: 300 },
    );
  });

  it('unstructured graphs: independent paths, the gap explains any shortfall, 1 ≤ ev ≤ V and ev ≠ 2', () => {
    let withGap = 0;
    let aboveOne = 0;
    fc.assert(
      fc.property(unstructured, ([tree, moves, seed]) => {
        const graph = rewire(constructGraph(tree), moves);
        const v = graph.edges.length - graph.blocks.length + 2;
        const paths = basisPaths(graph);
        const gap = basisCoverageGap(graph);
        const missing = gap.unreachableDecisions.length + gap.trappedDecisions.length + gap.trappedOutcomes.length;
        if (missing > 0) withGap++;
        expect(paths).toHaveLength(gap.exitReachable ? graph.decisions.length + 1 - missing : 0);
        expect(pathRank(graph, paths)).toBe(paths.length);
        expect(paths.every((p) => followsEdges(graph, p))).toBe(true);
        if (allReachExit(graph)) expect(paths).toHaveLength(reachableCyclomatic(graph));

        // NIST SP 500-235 §10.2 (reference-checks 2.8, 9.5): 1 ≤ ev ≤ v and ev ≠ 2.
        const { essential } = essentialComplexity(graph);
        if (essential > 1) aboveOne++;
        expect(essential).toBeGreaterThanOrEqual(1);
        expect(essential).toBeLessThanOrEqual(v);
        expect(essential).not.toBe(2);

        // The reduction's order follows block numbers; the result must not.
        const other = renumber(graph, seed);
        expect(essentialComplexity(other).essential).toBe(essential);
        expect(basisPaths(other)).toHaveLength(paths.length);
      }),
      { numRuns: 1000 },
    );
    // The generator must really produce both kinds of graph for the checks above to mean anything.
    expect(withGap).toBeGreaterThan(10);
    expect(aboveOne).toBeGreaterThan(100);
  });
});
