import louvain from 'graphology-communities-louvain';
import graphologyModularity from 'graphology-metrics/graph/modularity.js';
import { DEFAULT_MAP_SETTINGS } from '../model';
import { clusterModules } from './clusterModules';
import { karateGraph, karateModules } from './fixtures/moduleMaps';
import { modularity } from './modularity';

// Zachary 1977, J. Anthropological Research 33:452–473, as built by graphology-generators 0.11.2.
const g = karateGraph();
const edges = g.mapEdges((_e, _attr, from, to) => ({ from, to, weight: 1 }));
const reference = (community: (node: string) => number | string) => graphologyModularity(g, { getNodeCommunity: (node: string) => community(node) });

// reference-checks §5.3 (VERIFIED-RUN): the "Mr. Hi" faction.
const MR_HI = new Set([0, 1, 2, 3, 4, 5, 6, 7, 8, 10, 11, 12, 13, 16, 17, 19, 21].map(String));
// reference-checks §5.4: Brandes et al. 2008, IEEE TKDE 20(2):172–188, the exact optimum (VERIFIED-RUN partition).
const OPTIMUM = [[0, 1, 2, 3, 7, 11, 12, 13, 17, 19, 21], [4, 5, 6, 10, 16], [23, 24, 25, 27, 28, 31], [8, 9, 14, 15, 18, 20, 22, 26, 29, 30, 32, 33]];
const optimum = new Map(OPTIMUM.flatMap((members, c) => members.map((n) => [String(n), c] as const)));
const BEST_Q = 0.4197896120973044;

describe('modularity on Zachary’s karate club', () => {
  // reference-checks §5.3 and §5.7: 34 nodes, 78 undirected edges (UndirectedGraph, not the mixed Graph).
  it('should read the standard graph', () => {
    expect([g.order, g.size, g.undirectedSize, g.degree('0'), g.degree('33'), g.degree('32')]).toEqual([34, 78, 78, 16, 17, 12]);
  });

  // reference-checks §5.3 (VERIFIED-RUN, graphology-metrics and networkx): club split Q = 0.3582347140039…
  it('should give Q = 0.358235 for the club split', () => {
    const club = (node: string) => (MR_HI.has(node) ? 'hi' : 'officer');
    expect(Math.abs(modularity(edges, club) - 0.358235)).toBeLessThan(1e-6);
    expect(modularity(edges, club)).toBeCloseTo(reference(club), 12);
  });

  // reference-checks §5.4: Brandes et al. 2008, optimum 0.4198 (exact 0.4197896120973044, VERIFIED-RUN).
  it('should give Q = 0.4197896 for the optimal partition', () => {
    expect(Math.abs(modularity(edges, optimum) - BEST_Q)).toBeLessThan(1e-9);
  });

  // reference-checks §5.1 (VERIFIED-RUN on karate: 0 and −0.049803) and §9.7.
  it('should give 0 for one community and a negative Q for singletons', () => {
    expect(modularity(edges, () => 'all')).toBeCloseTo(0, 15);
    const singletons = modularity(edges, (node) => node);
    expect(singletons).toBeLessThan(0);
    expect(singletons).toBeCloseTo(-0.049803, 6);
    expect(singletons).toBeCloseTo(reference((node) => node), 12);
  });

  // reference-checks §5.5 (VERIFIED-RUN): graphology Louvain with randomWalk:false ends at Q = 0.4188034188034188.
  it('should agree with graphology Louvain’s own Q for its deterministic partition', () => {
    const found = louvain.detailed(g, { randomWalk: false });
    expect(found.modularity).toBeCloseTo(0.4188034188034188, 12);
    expect(modularity(edges, (node) => found.communities[node])).toBeCloseTo(found.modularity, 12);
  });

  // reference-checks §9.7: Q is invariant to relabelling communities.
  it('should not depend on the communities’ labels', () => {
    const relabelled = new Map([...optimum].map(([node, c]) => [node, `group ${(c * 3 + 1) % 4}`]));
    expect(modularity(edges, relabelled)).toBeCloseTo(modularity(edges, optimum), 15);
  });
});

describe('clusterModules on Zachary’s karate club', () => {
  const { modules, edges: moduleEdges } = karateModules();
  const nodeOf = (id: string) => id.slice('file:'.length);

  // reference-checks §5.5 (VERIFIED-RUN): graphology Louvain finds 4 communities with Q in [0.415, 0.41979];
  // §5.4: no partition exceeds the optimum 0.41979 + 1e-9 (Brandes et al. 2008).
  it('should find 4 clusters with Q in [0.415, 0.41979] with the default seed', () => {
    const result = clusterModules(modules, moduleEdges, 'file', DEFAULT_MAP_SETTINGS);
    expect(result.clusters).toHaveLength(4);
    expect(result.modularity).toBeGreaterThanOrEqual(0.415);
    expect(result.modularity).toBeLessThanOrEqual(BEST_Q + 1e-9);
    // The reported Q is the partition's, as graphology-metrics computes it.
    expect(result.modularity).toBeCloseTo(reference((node) => result.assignment.get(`file:${node}`)!), 12);
  });

  // Louvain's outcome depends on the seed and the node order (modules come in id order here, not
  // Zachary's numbering): reference-checks §5.5 reports 0.385–0.4198 over 200 networkx seeds and
  // 3 distinct values, all ≥ 0.4156, for graphology in Zachary's order.
  it('should stay between 0.385 and the optimum for every seed, reaching 0.415 for most', () => {
    const qs = Array.from({ length: 40 }, (_, i) => {
      const result = clusterModules(modules, moduleEdges, 'file', { ...DEFAULT_MAP_SETTINGS, seed: `seed${i}` });
      expect(result.clusters.length).toBeGreaterThanOrEqual(3);
      expect(result.modularity).toBeCloseTo(reference((node) => result.assignment.get(`file:${node}`)!), 12);
      return result.modularity;
    });
    expect(Math.min(...qs)).toBeGreaterThanOrEqual(0.385);
    expect(Math.max(...qs)).toBeLessThanOrEqual(BEST_Q + 1e-9);
    expect(qs.filter((q) => q >= 0.415).length).toBeGreaterThanOrEqual(qs.length * 0.6);
  });

  it('should give the same clusters for the same seed, and use the seed', () => {
    const run = (seed: string) => JSON.stringify(clusterModules(modules, moduleEdges, 'file', { ...DEFAULT_MAP_SETTINGS, seed }));
    expect(run('seamline')).toBe(run('seamline'));
    const partitions = new Set(Array.from({ length: 20 }, (_, i) => run(`seed${i}`)));
    expect(partitions.size).toBeGreaterThan(1);
  });

  it('should give the same clusters whatever the order of modules and edges', () => {
    const forward = clusterModules(modules, moduleEdges, 'file', DEFAULT_MAP_SETTINGS);
    const backward = clusterModules([...modules].reverse(), [...moduleEdges].reverse().map((e) => ({ ...e, from: e.to, to: e.from })), 'file', DEFAULT_MAP_SETTINGS);
    expect(backward).toEqual(forward);
  });

  it('should cover every member once and split the 78 edges into inside and between', () => {
    const { clusters } = clusterModules(modules, moduleEdges, 'file', DEFAULT_MAP_SETTINGS);
    expect(clusters.flatMap((c) => c.members.map(nodeOf)).sort()).toEqual(g.nodes().sort());
    const inside = clusters.reduce((s, c) => s + c.internalWeight, 0);
    const between = clusters.reduce((s, c) => s + c.externalWeight, 0) / 2;
    expect(inside + between).toBe(78);
  });
});
