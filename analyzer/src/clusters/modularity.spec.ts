import fc from 'fast-check';
import { UndirectedGraph } from 'graphology';
import graphologyModularity from 'graphology-metrics/graph/modularity.js';
import { ClusterInputError } from './ClusterInputError';
import { mergeModuleEdges } from './mergeModuleEdges';
import { modularity, pairModularity, type WeightedPair } from './modularity';

/** Two triangles a-b-c and d-e-f joined by the edge c-d of weight `bridge`. */
function twoTriangles(bridge: number): WeightedPair[] {
  const e = (from: string, to: string, weight = 1) => ({ from, to, weight });
  return [e('a', 'b'), e('b', 'c'), e('a', 'c'), e('d', 'e'), e('e', 'f'), e('d', 'f'), e('c', 'd', bridge)];
}
const triangles = new Map(['a', 'b', 'c', 'd', 'e', 'f'].map((n) => [n, n < 'd' ? 'left' : 'right']));

function toGraphology(edges: WeightedPair[]): UndirectedGraph {
  const g = new UndirectedGraph();
  for (const e of edges) g.updateEdge(e.from, e.to, (attr) => ({ weight: ((attr.weight as number | undefined) ?? 0) + e.weight }));
  return g;
}

describe('modularity', () => {
  // Worked by hand from Newman 2006, Q = Σ_c [L_c/m − γ (d_c/2m)²]: m = 7, each triangle keeps
  // L = 3 and has degree sum d = 7, so Q = 2 (3/7 − 1/4) = 5/14.
  it('should give 5/14 for two unit triangles joined by one edge, split into the triangles', () => {
    expect(modularity(twoTriangles(1), triangles)).toBeCloseTo(5 / 14, 15);
  });

  // By hand: bridge weight 2 → m = 8, L = 3, d = 8 per side: Q = 2 (3/8 − 1/4) = 1/4;
  // with γ = 0.5: Q = 2 (3/8 − 0.5 · 1/4) = 1/2.
  it('should weigh edges and apply the resolution γ', () => {
    expect(modularity(twoTriangles(2), triangles)).toBeCloseTo(1 / 4, 15);
    expect(modularity(twoTriangles(2), triangles, 0.5)).toBeCloseTo(1 / 2, 15);
  });

  // By hand: a–b weight 2 and a self-loop a–a weight 3: m = 5, d(a) = 2 + 2·3 = 8, d(b) = 2;
  // singletons: (3/5 − 0.64) + (0 − 0.04) = −0.08; together: 5/5 − 1 = 0.
  it('should count a self-loop once inside its community and twice in its degree', () => {
    const edges = [{ from: 'a', to: 'b', weight: 2 }, { from: 'a', to: 'a', weight: 3 }];
    expect(modularity(edges, (n) => n)).toBeCloseTo(-0.08, 15);
    expect(modularity(edges, () => 0)).toBeCloseTo(0, 15);
  });

  it('should treat a→b and b→a as one undirected edge of the summed weight', () => {
    const split = new Map([['a', 1], ['b', 2], ['c', 2]]);
    const directed = [{ from: 'a', to: 'b', weight: 1 }, { from: 'b', to: 'a', weight: 2 }, { from: 'b', to: 'c', weight: 4 }];
    const merged = [{ from: 'a', to: 'b', weight: 3 }, { from: 'c', to: 'b', weight: 4 }];
    expect(modularity(directed, split)).toBeCloseTo(modularity(merged, split), 15);
  });

  it('should give 0 for a graph without edge weight', () => {
    expect(modularity([], new Map())).toBe(0);
    expect(modularity([{ from: 'a', to: 'b', weight: 0 }], new Map())).toBe(0);
  });

  it('should refuse negative weights, nodes without a community and a bad resolution', () => {
    expect(() => modularity([{ from: 'a', to: 'b', weight: -1 }], () => 0)).toThrow(ClusterInputError);
    expect(() => modularity([{ from: 'a', to: 'b', weight: 1 }], new Map([['a', 0]]))).toThrow(/analyzer\/clusters: node b has no community/);
    expect(() => modularity([], () => 0, Number.NaN)).toThrow(ClusterInputError);
  });

  // Reference: graphology-metrics 2.4.2's modularity (a general-purpose library we did not write).
  it('should equal graphology-metrics on random weighted graphs, partitions and resolutions', () => {
    const graphArb = fc.integer({ min: 2, max: 14 }).chain((n) =>
      fc.record({
        edges: fc.array(fc.record({ a: fc.nat(n - 1), b: fc.nat(n - 1), w: fc.integer({ min: 1, max: 9 }) }), { minLength: 1, maxLength: 40 }),
        labels: fc.array(fc.nat(3), { minLength: n, maxLength: n }),
        resolution: fc.double({ min: 0.1, max: 3, noNaN: true }),
      }),
    );
    fc.assert(
      fc.property(graphArb, ({ edges, labels, resolution }) => {
        const pairs = edges.map(({ a, b, w }) => ({ from: String(a), to: String(b), weight: w }));
        const community = (node: string) => labels[Number(node)];
        const reference = graphologyModularity(toGraphology(pairs), { getNodeCommunity: (node: string) => community(node), getEdgeWeight: 'weight', resolution });
        expect(modularity(pairs, community, resolution)).toBeCloseTo(reference, 12);
      }),
      { numRuns: 500 },
    );
  });

  it('should give the same Q from merged index pairs and community numbers (pairModularity) as graphology-metrics', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 14 }).chain((n) => fc.record({
        n: fc.constant(n),
        edges: fc.array(fc.record({ a: fc.nat(n - 1), b: fc.nat(n - 1), w: fc.integer({ min: 0, max: 9 }) }), { minLength: 1, maxLength: 40 }),
        labels: fc.array(fc.nat(3), { minLength: n, maxLength: n }),
        resolution: fc.double({ min: 0.1, max: 3, noNaN: true }),
      })), ({ n, edges, labels, resolution }) => {
        const ids = Array.from({ length: n }, (_, i) => `file:m${String(i).padStart(2, '0')}.ts`);
        const moduleEdges = edges.map(({ a, b, w }) => ({ level: 'file' as const, from: ids[a], to: ids[b], weight: w, calls: w, imports: 0 }));
        const pairs = mergeModuleEdges(ids, moduleEdges, 'file');
        const withoutLoops = edges.filter(({ a, b, w }) => a !== b && w > 0).map(({ a, b, w }) => ({ from: String(a), to: String(b), weight: w }));
        const reference = withoutLoops.length === 0 ? 0
          : graphologyModularity(toGraphology(withoutLoops), { getNodeCommunity: (node: string) => labels[Number(node)], getEdgeWeight: 'weight', resolution });
        expect(pairModularity(pairs, Int32Array.from(labels), 4, resolution)).toBeCloseTo(reference, 12);
      }),
      { numRuns: 300 },
    );
  });

  // reference-checks §9.7 (derived from Newman & Girvan 2004): relabelling communities leaves Q unchanged.
  it('should not depend on the communities’ labels', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.nat(9), fc.nat(9), fc.integer({ min: 1, max: 5 })), { minLength: 1, maxLength: 30 }), fc.array(fc.nat(3), { minLength: 10, maxLength: 10 }), (raw, labels) => {
        const pairs = raw.map(([a, b, w]) => ({ from: String(a), to: String(b), weight: w }));
        const renamed = (node: string) => `group-${(labels[Number(node)] * 7 + 3) % 4}`;
        expect(modularity(pairs, renamed)).toBeCloseTo(modularity(pairs, (node) => labels[Number(node)]), 14);
      }),
      { numRuns: 300 },
    );
  });
});
