import { InjectionToken } from '@angular/core';

import type { AtlasGraph } from './atlas-graph';
import type { AtlasView } from './atlas-view';

/** What the map reports back to the screen. */
export interface AtlasRendererEvents {
  /** A module was clicked on the map. */
  nodeClicked(id: string): void;
  /** Empty space was clicked on the map. */
  stageClicked(): void;
}

/**
 * The map drawing, behind a small interface: sigma (WebGL) in the browser, a test double in
 * unit tests (jsdom has no WebGL).
 */
export interface AtlasRenderer {
  /** Redraws with a new selection or filters (no rebuild of the graph). */
  setView(view: AtlasView): void;
  /** Moves the camera to a module. */
  focusNode(id: string): void;
  /**
   * Runs the force layout in a web worker until the positions settle or `maxMs` passes;
   * resolves when it has stopped (also when stopped early by `stopLayout`).
   */
  runLayout(maxMs: number): Promise<void>;
  /** Stops a running layout where it is. */
  stopLayout(): void;
  /** The current view (camera, selection, filters) as a PNG image. */
  exportPng(): Promise<Blob>;
  /** Frees the WebGL context, the worker and the listeners. */
  destroy(): void;
}

/** What the map needs to know when it is created. */
export interface AtlasRendererOptions {
  /** A layout will run at once (no saved positions): large maps then start without links. */
  layoutFollows?: boolean;
}

/** Creates a renderer drawing `graph` into `container`. */
export type AtlasRendererFactory = (
  container: HTMLElement,
  graph: AtlasGraph,
  events: AtlasRendererEvents,
  options?: AtlasRendererOptions,
) => Promise<AtlasRenderer>;

/** The renderer the Atlas uses; sigma is loaded only when a map is first drawn. */
export const ATLAS_RENDERER = new InjectionToken<AtlasRendererFactory>('Atlas renderer', {
  providedIn: 'root',
  factory: () => (container, graph, events, options) =>
    import('./sigma-atlas-renderer').then((m) => m.createSigmaAtlasRenderer(container, graph, events, options)),
});

/**
 * Maps above this many modules plus links are "large": while their layout runs the links are
 * not drawn (only the modules move; the links come back when it stops), so each step of the
 * layout costs the browser a fraction of a full frame. Drawing every link of a 60,000-link map
 * on each step would keep the main thread busy for as long as one frame takes to draw.
 */
export const LARGE_MAP = 3_000;

/** Whether a map is large (see `LARGE_MAP`). */
export function isLargeMap(graph: Pick<AtlasGraph, 'order' | 'size'>): boolean {
  return graph.order + graph.size > LARGE_MAP;
}

/** How long the layout may run for a map of `order` modules (larger maps get longer, up to 20 s). */
export function layoutBudgetMs(order: number): number {
  return Math.min(20_000, 3_000 + order);
}

/**
 * How far the nodes moved since `previous` (x, y pairs in graph order), as a share of the
 * layout's extent: the mean step of a node divided by the larger side of the bounding box.
 * The layout counts as settled when this stays small.
 */
export function layoutMovement(previous: Float32Array, graph: AtlasGraph): number {
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  let moved = 0;
  let i = 0;
  graph.forEachNode((_id, { x, y }) => {
    moved += Math.hypot(x - previous[2 * i], y - previous[2 * i + 1]);
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
    i += 1;
  });
  if (i === 0) return 0;
  const extent = Math.max(maxX - minX, maxY - minY, 1e-9);
  return moved / i / extent;
}

/** The x, y pairs of the graph's nodes, in graph order (for `layoutMovement`). */
export function nodePositions(graph: AtlasGraph): Float32Array {
  const xy = new Float32Array(graph.order * 2);
  let i = 0;
  graph.forEachNode((_id, { x, y }) => {
    xy[i++] = x;
    xy[i++] = y;
  });
  return xy;
}

/** Below this movement per check (see `layoutMovement`) the layout is settled. */
export const SETTLED_MOVEMENT = 0.002;
