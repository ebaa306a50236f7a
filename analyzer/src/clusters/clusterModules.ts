/**
 * Clusters of modules
 * ===================
 * Groups one level's modules into candidate service boundaries with Louvain community
 * detection on the weighted, undirected module graph: module edges a→b and b→a become one
 * undirected edge whose weight is their sum; self-loops and zero weights are left out. Louvain
 * runs with the map's resolution and a random order seeded from the map's seed, and modules are
 * added in id order, so the same modules and edges always give the same clusters. A module with
 * no edges stays alone: it is a cluster of one. Clusters are numbered c1, c2, … by descending
 * ΣV, ties by the first member's path. Q is computed by our own pairModularity() on the same graph.
 *
 * [Reference]: V. D. Blondel, J.-L. Guillaume, R. Lambiotte, E. Lefebvre, "Fast unfolding of
 * communities in large networks", J. Stat. Mech. (2008) P10008 (graphology-communities-louvain).
 */
import { UndirectedGraph } from 'graphology';
import louvain from 'graphology-communities-louvain';
import seedrandom from 'seedrandom';
import type { ClusterRecord, MapSettings, ModuleEdge, ModuleLevel, ModuleRecord } from '../model';
import { ClusterInputError } from './ClusterInputError';
import { indexLevel, type LevelIndex } from './levelIndex';
import { mergeLevelEdges, type MergedEdges } from './mergeModuleEdges';
import { pairModularity } from './modularity';

/** What clustering one level gives: the clusters, each module's cluster id and the partition's Q. */
export interface ClusteredLevel {
  clusters: ClusterRecord[];
  assignment: Map<string, string>;
  modularity: number;
  /** Each module's cluster as its position in `clusters` (c1 = 0), in the order of the level index. */
  community: Int32Array;
}

/** Louvain clusters of `level`'s modules (see the file header). */
export function clusterModules(modules: ModuleRecord[], edges: ModuleEdge[], level: ModuleLevel, settings: MapSettings): ClusteredLevel {
  return clusterLevel(indexModuleLevel(modules, edges, level), settings);
}

/** `level`'s modules in id order and its edges by index: what clusterLevel and rankLevelGravity read. */
export function indexModuleLevel(modules: readonly ModuleRecord[], edges: readonly ModuleEdge[], level: ModuleLevel): LevelIndex {
  return indexLevel(sortedById(modules.filter((m) => m.level === level)), edges, level, (message) => new ClusterInputError(message));
}

/** The same from an indexed level whose modules are in id order (clusterModules sorts them). */
export function clusterLevel(indexed: LevelIndex, settings: MapSettings): ClusteredLevel {
  const own = indexed.modules;
  const merged = mergeLevelEdges(indexed);

  const graph = new UndirectedGraph<Record<string, never>, { weight: number }>();
  // NOTE: nodes are keyed by their index, not their (long) module id: graphology hashes keys on
  // every lookup, and short keys halve the time to build a 100,000-module graph. Our own edge
  // keys spare it generating (and checking) a random key per edge.
  const keys = own.map((_, i) => String(i));
  for (const key of keys) graph.addNode(key);
  for (let k = 0; k < merged.size; k++) graph.addEdgeWithKey(String(k), keys[merged.lo[k]], keys[merged.hi[k]], { weight: merged.weight[k] });

  // Louvain on a graph without edges has nothing to move: every module keeps its own community.
  const found = graph.size === 0 ? null : louvain(graph, { resolution: settings.resolution, rng: seedrandom(settings.seed), getEdgeWeight: 'weight' });
  const raw = new Int32Array(own.length);
  const communityIds = new Map<number, number>();
  for (let i = 0; i < own.length; i++) {
    const label = found === null ? i : found[keys[i]];
    let c = communityIds.get(label);
    if (c === undefined) communityIds.set(label, (c = communityIds.size));
    raw[i] = c;
  }

  const { clusters, rankOf } = describeClusters(own, raw, communityIds.size, merged, indexed.level);
  const community = raw.map((c) => rankOf[c]);
  const assignment = new Map<string, string>();
  for (let i = 0; i < own.length; i++) assignment.set(own[i].id, clusters[community[i]].id);
  return { clusters, assignment, modularity: pairModularity(merged, community, clusters.length, settings.resolution), community };
}

function sortedById(modules: readonly ModuleRecord[]): readonly ModuleRecord[] {
  for (let i = 1; i < modules.length; i++) {
    // Snapshots list modules in id order already; sort only when they are not.
    if (!(modules[i - 1].id < modules[i].id)) return [...modules].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  }
  return modules;
}

interface Tally {
  members: number[];
  functions: number;
  cyclomatic: number;
  decisions: number;
  internalWeight: number;
  externalWeight: number;
  firstPath: string;
}

function describeClusters(own: readonly ModuleRecord[], community: Int32Array, count: number, merged: MergedEdges, level: ModuleLevel): { clusters: ClusterRecord[]; rankOf: Int32Array } {
  const tallies: Tally[] = Array.from({ length: count }, () => ({ members: [], functions: 0, cyclomatic: 0, decisions: 0, internalWeight: 0, externalWeight: 0, firstPath: '' }));
  for (let i = 0; i < own.length; i++) {
    const t = tallies[community[i]];
    const m = own[i];
    if (t.members.length === 0 || m.path < t.firstPath) t.firstPath = m.path;
    t.members.push(i);
    t.functions += m.functions;
    t.cyclomatic += m.cyclomatic;
    t.decisions += m.decisions;
  }
  for (let k = 0; k < merged.size; k++) {
    const a = community[merged.lo[k]];
    const b = community[merged.hi[k]];
    const w = merged.weight[k];
    if (a === b) tallies[a].internalWeight += w;
    else {
      tallies[a].externalWeight += w;
      tallies[b].externalWeight += w;
    }
  }
  const order = tallies.map((_, c) => c).sort((x, y) => tallies[y].cyclomatic - tallies[x].cyclomatic || (tallies[x].firstPath < tallies[y].firstPath ? -1 : tallies[x].firstPath > tallies[y].firstPath ? 1 : 0));
  const rankOf = new Int32Array(count);
  order.forEach((c, rank) => (rankOf[c] = rank));
  const clusters = order.map((c, rank) => {
    const t = tallies[c];
    return {
      id: `c${rank + 1}`,
      level,
      // Members were pushed in id order.
      members: t.members.map((i) => own[i].id),
      functions: t.functions,
      cyclomatic: t.cyclomatic,
      decisions: t.decisions,
      internalWeight: t.internalWeight,
      externalWeight: t.externalWeight,
    };
  });
  return { clusters, rankOf };
}
