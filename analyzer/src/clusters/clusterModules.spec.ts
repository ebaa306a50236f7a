import fc from 'fast-check';
import { UndirectedGraph } from 'graphology';
import louvain from 'graphology-communities-louvain';
import graphologyModularity from 'graphology-metrics/graph/modularity.js';
import seedrandom from 'seedrandom';
import { DEFAULT_MAP_SETTINGS, type ModuleEdge } from '../model';
import { ClusterInputError } from './ClusterInputError';
import { clusterModules } from './clusterModules';
import { moduleEdge, moduleRecord } from './fixtures/moduleMaps';
import { modularity } from './modularity';

/** Two dense groups (a1–a3, b1–b3) joined by one light edge, plus a module with no edges. */
function twoGroups() {
  const modules = [
    moduleRecord('a1.ts', { cyclomatic: 4, decisions: 3, functions: 2 }),
    moduleRecord('a2.ts', { cyclomatic: 3, decisions: 2, functions: 1 }),
    moduleRecord('a3.ts', { cyclomatic: 2, decisions: 1, functions: 1 }),
    moduleRecord('b1.ts', { cyclomatic: 10, decisions: 6, functions: 4 }),
    moduleRecord('b2.ts', { cyclomatic: 1, decisions: 0, functions: 1 }),
    moduleRecord('b3.ts', { cyclomatic: 1, decisions: 0, functions: 1 }),
    moduleRecord('lonely.ts', { cyclomatic: 9, decisions: 8, functions: 1 }),
  ];
  const edges = [
    moduleEdge('a1.ts', 'a2.ts', 3), moduleEdge('a2.ts', 'a1.ts', 2), moduleEdge('a2.ts', 'a3.ts', 4), moduleEdge('a3.ts', 'a1.ts', 5),
    moduleEdge('b1.ts', 'b2.ts', 4), moduleEdge('b2.ts', 'b3.ts', 4), moduleEdge('b3.ts', 'b1.ts', 4), moduleEdge('b1.ts', 'b1.ts', 9),
    moduleEdge('a3.ts', 'b1.ts', 1),
  ];
  return { modules, edges };
}

describe('clusterModules', () => {
  it('should find the two groups, keep a module without edges alone and number clusters by ΣV', () => {
    const { modules, edges } = twoGroups();
    const { clusters, assignment } = clusterModules(modules, edges, 'file', DEFAULT_MAP_SETTINGS);
    expect(clusters.map((c) => [c.id, c.members])).toEqual([
      ['c1', ['file:b1.ts', 'file:b2.ts', 'file:b3.ts']], // ΣV 12
      ['c2', ['file:a1.ts', 'file:a2.ts', 'file:a3.ts']], // ΣV 9, first path a1.ts
      ['c3', ['file:lonely.ts']], // ΣV 9, first path lonely.ts
    ]);
    expect(assignment.get('file:a2.ts')).toBe('c2');
    expect(assignment.size).toBe(7);
    // The same partition by index, for gravity: modules in id order, clusters by position.
    const { community } = clusterModules(modules, edges, 'file', DEFAULT_MAP_SETTINGS);
    const ids = modules.map((m) => m.id).sort();
    expect([...community].map((c, i) => [ids[i], clusters[c].id])).toEqual(ids.map((id) => [id, assignment.get(id)]));
  });

  it('should sum P, ΣV and decisions, and split the weight into inside and between (a→b plus b→a, no self-loop)', () => {
    const { modules, edges } = twoGroups();
    const [b, a, lonely] = clusterModules(modules, edges, 'file', DEFAULT_MAP_SETTINGS).clusters;
    expect(a).toEqual({ id: 'c2', level: 'file', members: a.members, functions: 4, cyclomatic: 9, decisions: 6, internalWeight: 3 + 2 + 4 + 5, externalWeight: 1 });
    expect(b).toMatchObject({ functions: 6, cyclomatic: 12, decisions: 6, internalWeight: 12, externalWeight: 1 });
    expect(lonely).toMatchObject({ functions: 1, cyclomatic: 9, decisions: 8, internalWeight: 0, externalWeight: 0 });
  });

  it('should report the Q that graphology-metrics gives the same undirected graph and partition', () => {
    const { modules, edges } = twoGroups();
    for (const resolution of [1, 0.5, 2]) {
      const result = clusterModules(modules, edges, 'file', { ...DEFAULT_MAP_SETTINGS, resolution });
      const g = new UndirectedGraph();
      modules.forEach((m) => g.addNode(m.id));
      edges.filter((e) => e.from !== e.to).forEach((e) => g.updateEdge(e.from, e.to, (attr) => ({ weight: ((attr.weight as number | undefined) ?? 0) + e.weight })));
      // graphology-metrics 2.4.2 modularity (reference library), same resolution.
      expect(result.modularity).toBeCloseTo(graphologyModularity(g, { getNodeCommunity: (n: string) => result.assignment.get(n)!, resolution }), 12);
    }
  });

  it('should only look at the given level', () => {
    const { modules, edges } = twoGroups();
    const folder = moduleRecord('src', { cyclomatic: 99 }, 'folder');
    const result = clusterModules([...modules, folder], [...edges, moduleEdge('folder:src', 'folder:src', 1, 'folder')], 'file', DEFAULT_MAP_SETTINGS);
    expect(result.assignment.has('folder:src')).toBe(false);
    expect(clusterModules([...modules, folder], edges, 'folder', DEFAULT_MAP_SETTINGS).clusters).toEqual([
      { id: 'c1', level: 'folder', members: ['folder:src'], functions: 1, cyclomatic: 99, decisions: 0, internalWeight: 0, externalWeight: 0 },
    ]);
  });

  it('should give singletons and Q = 0 without edges, and nothing for no modules', () => {
    const result = clusterModules([moduleRecord('x.ts'), moduleRecord('y.ts')], [], 'file', DEFAULT_MAP_SETTINGS);
    expect(result.clusters.map((c) => c.members)).toEqual([['file:x.ts'], ['file:y.ts']]);
    expect(result.modularity).toBe(0);
    expect(clusterModules([], [], 'file', DEFAULT_MAP_SETTINGS)).toEqual({ clusters: [], assignment: new Map(), modularity: 0, community: new Int32Array(0) });
  });

  it('should refuse an edge to an unknown module, a negative weight and a module listed twice', () => {
    const { modules, edges } = twoGroups();
    expect(() => clusterModules(modules, [...edges, moduleEdge('a1.ts', 'gone.ts')], 'file', DEFAULT_MAP_SETTINGS)).toThrow(/analyzer\/clusters: edge file:a1.ts → file:gone.ts names a module/);
    expect(() => clusterModules(modules, [moduleEdge('a1.ts', 'a2.ts', -2)], 'file', DEFAULT_MAP_SETTINGS)).toThrow(ClusterInputError);
    expect(() => clusterModules([...modules, modules[0]], edges, 'file', DEFAULT_MAP_SETTINGS)).toThrow(/listed twice/);
  });

  // Properties: reference-checks §9.7 (Louvain Q ≥ Q(singletons), Q ≤ 1; derived from Newman & Girvan 2004)
  // and agreement with graphology Louvain on the same graph, order and seed.
  it('should partition every module once, keep ΣV, and match graphology Louvain run directly', () => {
    const mapArb = fc.integer({ min: 1, max: 25 }).chain((n) =>
      fc.record({
        raw: fc.array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1), fc.integer({ min: 1, max: 6 })), { maxLength: 60 }),
        sizes: fc.array(fc.integer({ min: 1, max: 40 }), { minLength: n, maxLength: n }),
        seed: fc.string({ maxLength: 6 }),
      }),
    );
    fc.assert(
      fc.property(mapArb, ({ raw, sizes, seed }) => {
        const modules = sizes.map((v, i) => moduleRecord(`m${String(i).padStart(2, '0')}.ts`, { cyclomatic: v }));
        const edges: ModuleEdge[] = raw.map(([a, b, w]) => moduleEdge(modules[a].id, modules[b].id, w));
        const settings = { ...DEFAULT_MAP_SETTINGS, seed };
        const result = clusterModules(modules, edges, 'file', settings);

        expect(result.clusters.flatMap((c) => c.members).sort()).toEqual(modules.map((m) => m.id));
        expect(result.clusters.reduce((s, c) => s + c.cyclomatic, 0)).toBe(sizes.reduce((s, v) => s + v, 0));
        const pairs = edges.filter((e) => e.from !== e.to);
        expect(result.modularity).toBeGreaterThanOrEqual(modularity(pairs, (id) => id) - 1e-12);
        expect(result.modularity).toBeLessThanOrEqual(1);

        // The same graph built directly (ids in order, pairs merged and sorted) gives graphology Louvain's partition.
        const g = new UndirectedGraph();
        modules.forEach((m) => g.addNode(m.id));
        const sums = new Map<string, number>();
        for (const e of pairs) {
          const key = e.from < e.to ? `${e.from} ${e.to}` : `${e.to} ${e.from}`;
          sums.set(key, (sums.get(key) ?? 0) + e.weight);
        }
        [...sums].sort(([x], [y]) => (x < y ? -1 : 1)).forEach(([key, weight]) => g.addEdge(key.split(' ')[0], key.split(' ')[1], { weight }));
        if (g.size > 0) {
          const direct = louvain.detailed(g, { rng: seedrandom(seed), getEdgeWeight: 'weight' });
          const sameCluster = (x: string, y: string) => result.assignment.get(x) === result.assignment.get(y);
          for (const x of modules) for (const y of modules) expect(sameCluster(x.id, y.id)).toBe(direct.communities[x.id] === direct.communities[y.id]);
          expect(result.modularity).toBeCloseTo(direct.modularity, 10);
        }
      }),
      { numRuns: 200 },
    );
  });
});
