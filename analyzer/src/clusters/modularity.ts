/**
 * Modularity Q
 * ============
 * How much more edge weight a partition keeps inside its communities than a random graph with
 * the same degrees would: Q = (1/2m) Σ_ij [A_ij − γ k_i k_j / 2m] δ(c_i, c_j), computed per
 * community as Q = Σ_c [ L_c / m − γ (d_c / 2m)² ] (L_c = weight inside c, d_c = Σ degrees in c),
 * in one pass over the edges. Edges are undirected: a directed pair a→b and b→a simply adds up,
 * so module edges can be passed as they are. A self-loop of weight w counts w inside its
 * community and 2w in its node's degree (A_ii = 2w, the usual convention, also graphology's).
 * Nodes without edges add nothing. A graph with no edge weight has no defined Q: 0 is returned,
 * the value of the one-community partition. γ (resolution) = 1 is classic modularity.
 *
 * [Reference]: M. E. J. Newman & M. Girvan, "Finding and evaluating community structure in
 * networks", Phys. Rev. E 69, 026113 (2004); M. E. J. Newman, "Modularity and community
 * structure in networks", PNAS 103(23):8577–8582 (2006); the resolution γ as in graphology.
 */
import { ClusterInputError } from './ClusterInputError';

/** One undirected, weighted edge (a ModuleEdge fits as it is). */
export interface WeightedPair {
  from: string;
  to: string;
  weight: number;
}

/** The community of each node: a map or a function. */
export type Partition = ReadonlyMap<string, string | number> | ((node: string) => string | number | undefined);

/** Q of `partition` over the undirected weighted graph given by `edges` (see the file header). */
export function modularity(edges: Iterable<WeightedPair>, partition: Partition, resolution = 1): number {
  if (!Number.isFinite(resolution) || resolution < 0) throw new ClusterInputError(`resolution must be a finite number ≥ 0, got ${resolution}`);
  const communityOf = typeof partition === 'function' ? partition : (node: string) => partition.get(node);
  const inside = new Map<string | number, number>();
  const degree = new Map<string | number, number>();
  let m = 0;
  for (const e of edges) {
    const w = e.weight;
    if (!Number.isFinite(w) || w < 0) throw new ClusterInputError(`edge ${e.from} → ${e.to} has weight ${w}; weights must be finite and ≥ 0`);
    if (w === 0) continue;
    const a = communityOf(e.from);
    const b = communityOf(e.to);
    if (a === undefined || b === undefined) throw new ClusterInputError(`node ${a === undefined ? e.from : e.to} has no community`);
    m += w;
    degree.set(a, (degree.get(a) ?? 0) + w);
    degree.set(b, (degree.get(b) ?? 0) + w);
    if (a === b) inside.set(a, (inside.get(a) ?? 0) + w);
  }
  if (m === 0) return 0;
  let q = 0;
  for (const [c, d] of degree) {
    const share = d / (2 * m);
    q += (inside.get(c) ?? 0) / m - resolution * share * share;
  }
  return q;
}

/**
 * The same Q for pairs already merged and checked (mergeLevelEdges: finite weights ≥ 0, no
 * self-loops) and a partition given as each node's community number (0 … communities − 1): typed
 * arrays instead of maps, for levels of 10^5 modules.
 */
export function pairModularity(pairs: { size: number; lo: Int32Array; hi: Int32Array; weight: Float64Array }, community: Int32Array, communities: number, resolution = 1): number {
  if (!Number.isFinite(resolution) || resolution < 0) throw new ClusterInputError(`resolution must be a finite number ≥ 0, got ${resolution}`);
  const inside = new Float64Array(communities);
  const degree = new Float64Array(communities);
  let m = 0;
  for (let k = 0; k < pairs.size; k++) {
    const w = pairs.weight[k];
    const a = community[pairs.lo[k]];
    const b = community[pairs.hi[k]];
    m += w;
    degree[a] += w;
    degree[b] += w;
    if (a === b) inside[a] += w;
  }
  if (m === 0) return 0;
  let q = 0;
  for (let c = 0; c < communities; c++) {
    const share = degree[c] / (2 * m);
    q += inside[c] / m - resolution * share * share;
  }
  return q;
}
