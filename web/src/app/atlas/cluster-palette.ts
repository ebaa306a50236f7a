import type { ModuleGraph } from './module-graph';

/**
 * Eight categorical hues that stay apart for the common colour-vision deficiencies
 * (Paul Tol's "muted" qualitative set), in the order clusters receive them.
 */
export const CLUSTER_HUES: readonly string[] = [
  '#332288',
  '#44AA99',
  '#CC6677',
  '#DDCC77',
  '#88CCEE',
  '#117733',
  '#882255',
  '#999933',
];

/** Modules of the clusters beyond the eighth, and modules without a cluster. */
export const OTHER_COLOUR = '#9E9E9E';

/** One legend row: a colour and what it stands for. */
export interface ClusterSwatch {
  /** Cluster id; null for the grey "other" row. */
  id: string | null;
  label: string;
  colour: string;
  /** How many modules carry the colour. */
  members: number;
  /** ΣV of those modules. */
  cyclomatic: number;
}

/** The legend and the colour of every cluster. */
export interface ClusterColours {
  /** One row per coloured cluster, largest ΣV first, then the grey row if any module is grey. */
  swatches: ClusterSwatch[];
  /** The colour of a module of `cluster`. */
  colourOf(cluster: string | null): string;
}

/**
 * Gives the clusters with the largest ΣV a hue each (ties: by id) and every other module grey,
 * so colours stay the same for the same snapshot and level.
 */
export function clusterColours(graph: Pick<ModuleGraph, 'nodes' | 'clusters'>): ClusterColours {
  const ranked = [...graph.clusters].sort((a, b) => b.cyclomatic - a.cyclomatic || a.id.localeCompare(b.id));
  const colours = new Map<string, string>();
  const swatches: ClusterSwatch[] = [];
  for (const cluster of ranked.slice(0, CLUSTER_HUES.length)) {
    const colour = CLUSTER_HUES[swatches.length];
    colours.set(cluster.id, colour);
    swatches.push({
      id: cluster.id,
      label: `Cluster ${cluster.id}`,
      colour,
      members: cluster.size,
      cyclomatic: cluster.cyclomatic,
    });
  }
  let otherMembers = 0;
  let otherCyclomatic = 0;
  let otherClusters = 0;
  const seenOther = new Set<string | null>();
  for (const node of graph.nodes) {
    if (node.cluster !== null && colours.has(node.cluster)) continue;
    otherMembers += 1;
    otherCyclomatic += node.cyclomatic;
    if (node.cluster !== null && !seenOther.has(node.cluster)) otherClusters += 1;
    seenOther.add(node.cluster);
  }
  if (otherMembers > 0) {
    const label =
      otherClusters === 0
        ? 'No cluster'
        : `${otherClusters} more cluster${otherClusters === 1 ? '' : 's'}${seenOther.has(null) ? ' and no cluster' : ''}`;
    swatches.push({ id: null, label, colour: OTHER_COLOUR, members: otherMembers, cyclomatic: otherCyclomatic });
  }
  return {
    swatches,
    colourOf: (cluster) => (cluster !== null && colours.get(cluster)) || OTHER_COLOUR,
  };
}
