import type { FlowGraph } from '../model';
import { constructGraph, flowGraph, reachableCyclomatic } from '../testing/graphs';
import { basisCoverageGap } from './basisCoverageGap';
import { basisPaths } from './basisPaths';
import type { BasisPath } from './basisPaths';
import { pathRank } from './pathRank';

/** Paths written as block walks, in a stable order, for comparing with published lists. */
const walks = (paths: BasisPath[]): string[] => paths.map((p) => p.blocks.join('-')).sort();

function expectWellFormed(graph: FlowGraph, paths: BasisPath[]): void {
  for (const path of paths) {
    expect(path.blocks[0]).toBe(graph.entry);
    expect(path.blocks[path.blocks.length - 1]).toBe(graph.exit);
    expect(path.blocks).toHaveLength(path.edges.length + 1);
    path.edges.forEach((i, k) => {
      expect(graph.edges[i].from).toBe(path.blocks[k]);
      expect(graph.edges[i].to).toBe(path.blocks[k + 1]);
    });
  }
}

describe('basisPaths', () => {
  it('should give euclid three paths, the baseline being the walk for input (4, 2)', () => {
    // NIST SP 500-235 §2.1/§2.4 (reference-checks 2.2): nodes 0–13, decisions at 1 (if) and
    // 7 (while), back edge 10 → 7, v = 3; the test path for (4, 2) is 0-1-5-6-7-11-12-13.
    // Edges other than those named in the text are from memory (15 edges in all).
    const euclid = flowGraph('0>1; 1?2:5; 2>3; 3>4; 4>5; 5>6; 6>7; 7?8:11@while; 8>9; 9>10; 10>7; 11>12; 12>13');
    expect(euclid.edges).toHaveLength(15);
    expect(reachableCyclomatic(euclid)).toBe(3);
    const paths = basisPaths(euclid);
    expect(paths).toHaveLength(3);
    expect(paths[0].blocks.join('-')).toBe('0-1-5-6-7-11-12-13');
    expect(pathRank(euclid, paths)).toBe(3);
    expectWellFormed(euclid, paths);
  });

  it('should find the four Pressman basis paths', () => {
    // Pressman, Software Engineering (reference-checks 4.1): e = 11, n = 9, V = 4 (VERIFIED-TEXT);
    // the edge list and the basis 1-11; 1-2-3-4-5-10-1-11; 1-2-3-6-8-9-10-1-11; 1-2-3-6-7-9-10-1-11
    // are from memory. Nodes renumbered: 1→0, 2-3→1, 4-5→2, 6→3, 7→4, 8→5, 9→6, 10→7, 11→8.
    const graph = flowGraph('0?1:8@while; 1?2:3; 2>7; 3?4:5; 4>6; 5>6; 6>7; 7>0');
    expect(graph.edges.length - graph.blocks.length + 2).toBe(4);
    const paths = basisPaths(graph);
    const names = ['1', '2-3', '4-5', '6', '7', '8', '9', '10', '11'];
    expect(walks(paths).map((w) => w.split('-').map((b) => names[Number(b)]).join('-')).sort()).toEqual(
      ['1-11', '1-2-3-4-5-10-1-11', '1-2-3-6-8-9-10-1-11', '1-2-3-6-7-9-10-1-11'].sort(),
    );
    expect(pathRank(graph, paths)).toBe(4);
  });

  it('should flip each baseline decision once and keep the baseline choices after the flip', () => {
    // NIST SP 500-235 §6 (reference-checks 2.10): each new path differs from the baseline at one decision.
    const graph = constructGraph({ t: 'seq', items: [{ t: 'if', then: { t: 'stmt' } }, { t: 'if', then: { t: 'stmt' } }, { t: 'if', then: { t: 'stmt' } }] });
    const paths = basisPaths(graph);
    expect(paths).toHaveLength(4);
    const baseline = paths[0].steps.map((s) => s.outcome);
    expect(baseline).toEqual(['false', 'false', 'false']);
    for (const path of paths.slice(1)) {
      const differences = path.steps.filter((s, k) => s.outcome !== baseline[k]);
      expect(differences).toHaveLength(1);
    }
  });

  it('should reach a loop body decision by entering the loop once', () => {
    // while (a) { if (b) x(); } — the body's if is first reached by the path that enters the loop.
    const graph = constructGraph({ t: 'while', body: { t: 'if', then: { t: 'stmt' } } });
    const paths = basisPaths(graph);
    expect(paths.map((p) => p.steps.map((s) => `${s.decision}${s.outcome[0]}`).join(' '))).toEqual([
      '0f',
      '0t 1f 0f',
      '0t 1t 0f',
    ]);
    expect(pathRank(graph, paths)).toBe(3);
  });

  it('should give a path to each of two parallel edges (an empty then-branch)', () => {
    // `if (c) {}`: V = 2 even though both outcomes land on the same block.
    const graph = flowGraph('0>1; 1?2:2; 2>3');
    const paths = basisPaths(graph);
    expect(paths.map((p) => p.edges)).toEqual([[0, 1, 3], [0, 2, 3]]);
    expect(pathRank(graph, paths)).toBe(2);
  });

  it('should give a straight function a single path', () => {
    const graph = flowGraph('0>1; 1>2');
    expect(basisPaths(graph)).toEqual([{ blocks: [0, 1, 2], edges: [0, 1], steps: [] }]);
  });

  it('should leave out dead decisions and say so', () => {
    // Block 3 (a decision) is never reached: V of the whole graph is 3, of the reachable part 2.
    const graph = flowGraph('0>1; 1?2:4; 2>4; 3?2:4; 4>5');
    expect(graph.edges.length - graph.blocks.length + 2).toBe(3);
    const paths = basisPaths(graph);
    expect(paths).toHaveLength(2);
    expect(basisCoverageGap(graph)).toEqual({ exitReachable: true, unreachableDecisions: [1], trappedDecisions: [], trappedOutcomes: [] });
  });

  it('should skip outcomes that never reach the exit', () => {
    // if (c) { for (;;) {} } — the true outcome enters an endless loop.
    const graph = flowGraph('0>1; 1?2:4; 2>3; 3>2; 4>5');
    const paths = basisPaths(graph);
    expect(walks(paths)).toEqual(['0-1-4-5']);
    expect(basisCoverageGap(graph)).toEqual({ exitReachable: true, unreachableDecisions: [], trappedDecisions: [], trappedOutcomes: [{ decision: 0, outcome: 'true' }] });
  });

  it('should return no paths when the entry cannot reach the exit', () => {
    const graph = flowGraph('0>1; 1>1', { exit: 2 });
    graph.blocks.push({ id: 2, kind: 'exit' });
    expect(basisPaths(graph)).toEqual([]);
    expect(basisCoverageGap(graph).exitReachable).toBe(false);
  });

  it('should refuse a path longer than maxPathLength', () => {
    const graph = constructGraph({ t: 'while', body: { t: 'seq', items: [{ t: 'stmt' }, { t: 'stmt' }] } });
    expect(() => basisPaths(graph, { maxPathLength: 4 })).toThrow(/^analyzer\/paths: a basis path needs \d+ edges, more than maxPathLength 4/);
    expect(basisPaths(graph, { maxPathLength: 50 })).toHaveLength(2);
  });

  it('should refuse a graph with a missing block', () => {
    expect(() => basisPaths({ ...flowGraph('0>1'), exit: 7 })).toThrow(/^analyzer\/paths: exit 7/);
  });

  it('should handle a 2,000-block graph without recursion', () => {
    // 500 nested whiles: deep enough to break a recursive walk.
    let tree: Parameters<typeof constructGraph>[0] = { t: 'stmt' };
    for (let k = 0; k < 500; k++) tree = { t: 'while', body: tree };
    const graph = constructGraph(tree);
    const paths = basisPaths(graph);
    expect(paths).toHaveLength(501);
    expectWellFormed(graph, paths.slice(-3));
  });
});
