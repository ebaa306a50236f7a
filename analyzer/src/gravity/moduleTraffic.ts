/**
 * Module traffic across clusters
 * ==============================
 * For each module of one level, from the level's directed module edges (weight = call sites
 * plus imports) and a cluster per module: how many other modules call it and it calls, how many
 * other clusters its callers and its callees sit in, how many other clusters it touches either
 * way (spread), and how much of its edge weight, in and out, stays inside its own cluster
 * (cohesion; 1 for a module with no edges: nothing leaves). Repeated edges add up, self-loops
 * and zero weights are ignored. A module missing from the assignment is a cluster of its own.
 * Linear in modules plus edges: adjacency in flat arrays, distinct counts with a stamp per
 * module and per cluster instead of sets.
 */
import type { ModuleEdge, ModuleLevel } from '../model';
import { indexLevelEdges, type LevelEdges } from '../clusters/levelIndex';
import { GravityInputError } from './GravityInputError';

/** Per-module facts, each array indexed like the module ids given. */
export interface ModuleTraffic {
  callers: Int32Array;
  callees: Int32Array;
  callerClusters: Int32Array;
  calleeClusters: Int32Array;
  spread: Int32Array;
  /** Edge weight in plus out, and the part of it inside the module's cluster. */
  weight: Float64Array;
  ownWeight: Float64Array;
  cohesion: Float64Array;
  /** Clusters with at least one member that has an edge at this level. */
  activeClusters: number;
}

/** Counts the traffic of the modules `ids` (see the file header). */
export function moduleTraffic(ids: readonly string[], edges: readonly ModuleEdge[], assignment: ReadonlyMap<string, string>, level: ModuleLevel): ModuleTraffic {
  return levelTraffic(indexLevelEdges(ids, edges, level, (message) => new GravityInputError(message)), clusterIndexes(ids, assignment));
}

/** The same from an indexed level and each module's cluster as a small integer (below the module count). */
export function levelTraffic(level: LevelEdges, cluster: Int32Array): ModuleTraffic {
  const n = level.ids.length;
  const m = level.size;
  // Flat adjacency (CSR) for out- and in-edges: degrees, then fill.
  const outStart = new Int32Array(n + 1);
  const inStart = new Int32Array(n + 1);
  for (let k = 0; k < m; k++) {
    outStart[level.from[k] + 1]++;
    inStart[level.to[k] + 1]++;
  }
  for (let i = 0; i < n; i++) {
    outStart[i + 1] += outStart[i];
    inStart[i + 1] += inStart[i];
  }
  const outTo = new Int32Array(m);
  const outW = new Float64Array(m);
  const inFrom = new Int32Array(m);
  const inW = new Float64Array(m);
  const outFill = outStart.slice(0, n);
  const inFill = inStart.slice(0, n);
  for (let t = 0; t < m; t++) {
    const w = level.weight[t];
    const a = level.from[t];
    const b = level.to[t];
    outTo[outFill[a]] = b;
    outW[outFill[a]++] = w;
    inFrom[inFill[b]] = a;
    inW[inFill[b]++] = w;
  }

  const traffic: ModuleTraffic = {
    callers: new Int32Array(n), callees: new Int32Array(n), callerClusters: new Int32Array(n), calleeClusters: new Int32Array(n),
    spread: new Int32Array(n), weight: new Float64Array(n), ownWeight: new Float64Array(n), cohesion: new Float64Array(n), activeClusters: 0,
  };
  // Stamps: seenModule[j] === i + 1 once module j was counted for module i (same for clusters).
  const seenModule = new Int32Array(n);
  const seenCluster = new Int32Array(n);
  const seenEither = new Int32Array(n);
  const active = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const stamp = i + 1;
    const own = cluster[i];
    for (let k = inStart[i]; k < inStart[i + 1]; k++) {
      const j = inFrom[k];
      const c = cluster[j];
      traffic.weight[i] += inW[k];
      if (c === own) traffic.ownWeight[i] += inW[k];
      if (seenModule[j] !== stamp) {
        seenModule[j] = stamp;
        traffic.callers[i]++;
      }
      if (c !== own && seenCluster[c] !== stamp) {
        seenCluster[c] = stamp;
        traffic.callerClusters[i]++;
      }
      if (c !== own && seenEither[c] !== stamp) {
        seenEither[c] = stamp;
        traffic.spread[i]++;
      }
    }
    // The same stamps, negated, for the out side: in- and out-counts stay separate.
    for (let k = outStart[i]; k < outStart[i + 1]; k++) {
      const j = outTo[k];
      const c = cluster[j];
      traffic.weight[i] += outW[k];
      if (c === own) traffic.ownWeight[i] += outW[k];
      if (seenModule[j] !== -stamp) {
        seenModule[j] = -stamp;
        traffic.callees[i]++;
      }
      if (c !== own && seenCluster[c] !== -stamp) {
        seenCluster[c] = -stamp;
        traffic.calleeClusters[i]++;
      }
      if (c !== own && seenEither[c] !== stamp) {
        seenEither[c] = stamp;
        traffic.spread[i]++;
      }
    }
    traffic.cohesion[i] = traffic.weight[i] > 0 ? traffic.ownWeight[i] / traffic.weight[i] : 1;
    if (traffic.weight[i] > 0 && active[own] === 0) {
      active[own] = 1;
      traffic.activeClusters++;
    }
  }
  return traffic;
}

/** Cluster of each module as a small integer; modules without one get a cluster of their own. */
export function clusterIndexes(ids: readonly string[], assignment: ReadonlyMap<string, string>): Int32Array {
  const byName = new Map<string, number>();
  const cluster = new Int32Array(ids.length);
  let next = 0;
  ids.forEach((id, i) => {
    const name = assignment.get(id);
    if (name === undefined) cluster[i] = next++;
    else {
      let c = byName.get(name);
      if (c === undefined) byName.set(name, (c = next++));
      cluster[i] = c;
    }
  });
  return cluster;
}
