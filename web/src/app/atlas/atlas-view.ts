import { premultiplied, type AtlasEdgeAttributes, type AtlasNodeAttributes } from './atlas-graph';

/** What the person has chosen to see: the selection and the two filters. */
export interface AtlasView {
  /** The selected module, or null. */
  selected: string | null;
  /** The selected module's neighbours (stay bright while the rest is dimmed). */
  neighbours: ReadonlySet<string>;
  /** Modules with a smaller ΣV are hidden (the selected one always shows). */
  minCyclomatic: number;
  /** Links lighter than this are hidden. */
  minWeight: number;
}

/** Nothing selected, nothing filtered. */
export const PLAIN_VIEW: AtlasView = { selected: null, neighbours: new Set(), minCyclomatic: 0, minWeight: 0 };

/** The colour of modules and links outside the selected neighbourhood. */
export const DIMMED_COLOUR = '#E4E7E8';
/** The colour of the selected module's links. */
export const HIGHLIGHT_EDGE_COLOUR = premultiplied(38, 50, 56, 0.85);

/** How one node is drawn (the fields sigma's node reducer may change). */
export interface NodeLook {
  hidden?: boolean;
  color?: string;
  label?: string | null;
  highlighted?: boolean;
  zIndex?: number;
}

/** How one link is drawn (the fields sigma's edge reducer may change). */
export interface EdgeLook {
  hidden?: boolean;
  color?: string;
  zIndex?: number;
}

/** Whether a module is filtered out by the ΣV filter. */
export function isNodeFiltered(id: string, attributes: Pick<AtlasNodeAttributes, 'cyclomatic'>, view: AtlasView): boolean {
  return id !== view.selected && attributes.cyclomatic < view.minCyclomatic;
}

/** Changes to one node's look under `view`; null when it is drawn as it is. */
export function nodeLook(id: string, attributes: AtlasNodeAttributes, view: AtlasView): NodeLook | null {
  if (isNodeFiltered(id, attributes, view)) return { hidden: true };
  if (view.selected === null) return null;
  if (id === view.selected) return { highlighted: true, zIndex: 2 };
  if (view.neighbours.has(id)) return { zIndex: 1 };
  return { color: DIMMED_COLOUR, label: null, zIndex: 0 };
}

/** Changes to one link's look under `view`; null when it is drawn as it is. */
export function edgeLook(
  source: string,
  target: string,
  attributes: Pick<AtlasEdgeAttributes, 'weight'>,
  view: AtlasView,
): EdgeLook | null {
  if (attributes.weight < view.minWeight) return { hidden: true };
  if (view.selected === null) return null;
  if (source === view.selected || target === view.selected) return { color: HIGHLIGHT_EDGE_COLOUR, zIndex: 1 };
  return { color: DIMMED_COLOUR, zIndex: 0 };
}
