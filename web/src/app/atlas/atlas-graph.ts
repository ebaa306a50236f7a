import Graph from 'graphology';

import { clusterColours, type ClusterSwatch } from './cluster-palette';
import { moduleLabel, type ModuleGraph, type ModuleNode } from './module-graph';

/** What the map keeps on each module node (sigma reads x, y, size, color, label). */
export interface AtlasNodeAttributes {
  x: number;
  y: number;
  size: number;
  color: string;
  label: string;
  /** ΣV, for the "hide small modules" filter. */
  cyclomatic: number;
  cluster: string | null;
}

/** What the map keeps on each link (sigma reads size, color; the layout reads weight). */
export interface AtlasEdgeAttributes {
  weight: number;
  size: number;
  color: string;
}

/** The graphology graph behind the map. */
export type AtlasGraph = Graph<AtlasNodeAttributes, AtlasEdgeAttributes>;

/** Everything the Atlas draws and lists for one snapshot and level. */
export interface AtlasModel {
  graph: AtlasGraph;
  /** Modules by id. */
  byId: ReadonlyMap<string, ModuleNode>;
  /** Modules, largest ΣV first (the order of the module list). */
  modules: readonly ModuleNode[];
  swatches: readonly ClusterSwatch[];
  maxCyclomatic: number;
  maxWeight: number;
}

/** Node radius in pixels at zoom 1: the smallest and largest module. */
export const NODE_SIZE = { min: 3, max: 22 } as const;
/** Link width in pixels: the lightest and heaviest link. */
export const EDGE_SIZE = { min: 0.5, max: 6 } as const;
/**
 * The colour of links: translucent, so dense maps stay readable. sigma blends as if colours
 * were premultiplied by their alpha, so the channels are given premultiplied (a slate grey,
 * rgb(96, 110, 120), at 35 %).
 */
export const EDGE_COLOUR = premultiplied(96, 110, 120, 0.35);

/** An rgba() colour with its channels premultiplied by `alpha`, as sigma's WebGL blending expects. */
export function premultiplied(r: number, g: number, b: number, alpha: number): string {
  return `rgba(${Math.round(r * alpha)}, ${Math.round(g * alpha)}, ${Math.round(b * alpha)}, ${alpha})`;
}

/** Node size from ΣV on a square-root scale, so area grows with ΣV. */
export function nodeSize(cyclomatic: number, maxCyclomatic: number): number {
  if (maxCyclomatic <= 0) return NODE_SIZE.min;
  const share = Math.sqrt(Math.max(0, cyclomatic) / maxCyclomatic);
  return NODE_SIZE.min + (NODE_SIZE.max - NODE_SIZE.min) * share;
}

/** Link width from its weight (call sites plus imports) on a square-root scale. */
export function edgeSize(weight: number, maxWeight: number): number {
  if (maxWeight <= 0) return EDGE_SIZE.min;
  const share = Math.sqrt(Math.max(0, weight) / maxWeight);
  return EDGE_SIZE.min + (EDGE_SIZE.max - EDGE_SIZE.min) * share;
}

/**
 * Builds the map's graph in one pass over the nodes and one over the links. Links whose index
 * points at no node and links of a module to itself are left out; repeated links between the
 * same two modules in the same direction are summed. Every node starts at (0, 0): place them
 * with `seedPositions` or saved positions.
 */
export function buildAtlasModel(data: ModuleGraph): AtlasModel {
  const colours = clusterColours(data);
  const graph: AtlasGraph = new Graph<AtlasNodeAttributes, AtlasEdgeAttributes>({
    type: 'directed',
    multi: false,
    allowSelfLoops: false,
  });
  const byId = new Map<string, ModuleNode>();
  let maxCyclomatic = 0;
  for (const node of data.nodes) {
    if (node.cyclomatic > maxCyclomatic) maxCyclomatic = node.cyclomatic;
  }
  for (const node of data.nodes) {
    if (byId.has(node.id)) continue;
    byId.set(node.id, node);
    graph.addNode(node.id, {
      x: 0,
      y: 0,
      size: nodeSize(node.cyclomatic, maxCyclomatic),
      color: colours.colourOf(node.cluster),
      label: moduleLabel(node),
      cyclomatic: node.cyclomatic,
      cluster: node.cluster,
    });
  }
  for (const [fromIndex, toIndex, weight] of data.links) {
    const from = data.nodes[fromIndex]?.id;
    const to = data.nodes[toIndex]?.id;
    if (from === undefined || to === undefined || from === to) continue;
    const existing = graph.edge(from, to);
    if (existing === undefined) {
      graph.addDirectedEdge(from, to, { weight, size: 0, color: EDGE_COLOUR });
    } else {
      graph.updateEdgeAttribute(existing, 'weight', (w) => (w ?? 0) + weight);
    }
  }
  let maxWeight = 0;
  graph.forEachEdge((_edge, attributes) => {
    if (attributes.weight > maxWeight) maxWeight = attributes.weight;
  });
  graph.forEachEdge((_edge, attributes) => {
    attributes.size = edgeSize(attributes.weight, maxWeight);
  });
  const modules = [...byId.values()].sort(
    (a, b) => b.cyclomatic - a.cyclomatic || moduleLabel(a).localeCompare(moduleLabel(b)),
  );
  return { graph, byId, modules, swatches: colours.swatches, maxCyclomatic, maxWeight };
}

/**
 * Deterministic start positions: each cluster gets a spot on a large circle (largest cluster
 * first), and its modules sit on a sunflower spiral around that spot, largest ΣV in the
 * middle. Clustered modules start near each other, so the layout settles sooner.
 */
export function seedPositions(model: Pick<AtlasModel, 'graph' | 'modules'>): void {
  const groups = new Map<string, string[]>();
  for (const module of model.modules) {
    const key = module.cluster ?? '';
    let members = groups.get(key);
    if (!members) groups.set(key, (members = []));
    members.push(module.id);
  }
  const ordered = [...groups.values()].sort((a, b) => b.length - a.length);
  const total = model.modules.length;
  const ringRadius = ordered.length > 1 ? Math.sqrt(total) * 12 : 0;
  const golden = Math.PI * (3 - Math.sqrt(5));
  ordered.forEach((members, groupIndex) => {
    const angle = (2 * Math.PI * groupIndex) / ordered.length;
    const cx = ringRadius * Math.cos(angle);
    const cy = ringRadius * Math.sin(angle);
    members.forEach((id, i) => {
      const r = 4 * Math.sqrt(i + 0.5);
      model.graph.mergeNodeAttributes(id, { x: cx + r * Math.cos(i * golden), y: cy + r * Math.sin(i * golden) });
    });
  });
}

/** Ids of the modules linked to `id` in either direction (empty for an unknown id). */
export function neighbourhood(graph: AtlasGraph, id: string | null): ReadonlySet<string> {
  if (id === null || !graph.hasNode(id)) return new Set();
  return new Set(graph.neighbors(id));
}

/** A module's heaviest links, in and out, for the side panel. */
export interface ModuleLink {
  id: string;
  label: string;
  weight: number;
}

/** The `limit` heaviest links into (`in`) or out of (`out`) a module. */
export function heaviestLinks(graph: AtlasGraph, id: string, direction: 'in' | 'out', limit: number): ModuleLink[] {
  if (!graph.hasNode(id)) return [];
  const links: ModuleLink[] = [];
  const visit = (_edge: string, attributes: AtlasEdgeAttributes, source: string, target: string) => {
    const other = direction === 'in' ? source : target;
    links.push({ id: other, label: graph.getNodeAttribute(other, 'label'), weight: attributes.weight });
  };
  if (direction === 'in') graph.forEachInEdge(id, visit);
  else graph.forEachOutEdge(id, visit);
  return links.sort((a, b) => b.weight - a.weight || a.label.localeCompare(b.label)).slice(0, limit);
}
