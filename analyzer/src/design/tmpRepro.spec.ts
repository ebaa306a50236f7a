import { constructGraph, rewire, reachableCyclomatic, type Construct } from '../testing/graphs';
import { designComplexity } from './designComplexity';
const cases: [Construct, [number, number][], number[], number][] = [
 [{"t":"switch","cases":[{"t":"if","then":{"t":"stmt"}},{"t":"switch","cases":[{"t":"while","body":{"t":"stmt"}}]},{"t":"while","body":{"t":"stmt"}}]},[[1588117619,1537917246]],[0],1565453471],
 [{"t":"ifElse","then":{"t":"seq","items":[{"t":"stmt"},{"t":"stmt"}]},"else":{"t":"while","body":{"t":"stmt"}}},[[0,457823714]],[0],872705667],
 [{"t":"if","then":{"t":"while","body":{"t":"if","then":{"t":"stmt"}}}},[[1060309465,1894864613]],[0],2098592891],
];
it('repro', () => {
  for (const [tree, move, picks, extra] of cases) {
    const graph = rewire(constructGraph(tree), move);
    const n = graph.blocks.length;
    const calls = new Set(picks.map((p) => p % n));
    const iv = designComplexity(graph, calls);
    const iv2 = designComplexity(graph, new Set([...calls, extra % n]));
    console.log(JSON.stringify({edges: graph.edges.map(e=>`${e.from}>${e.to}`).join(' '), exit: graph.exit, calls:[...calls], extra: extra%n, iv, iv2, v: reachableCyclomatic(graph)}));
  }
});
