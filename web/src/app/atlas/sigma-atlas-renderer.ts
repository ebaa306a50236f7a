import { toBlob } from '@sigma/export-image';
import forceAtlas2 from 'graphology-layout-forceatlas2';
import FA2Layout from 'graphology-layout-forceatlas2/worker';
import Sigma from 'sigma';

import type { AtlasEdgeAttributes, AtlasGraph, AtlasNodeAttributes } from './atlas-graph';
import {
  isLargeMap, layoutMovement, nodePositions, SETTLED_MOVEMENT, type AtlasRenderer, type AtlasRendererEvents, type AtlasRendererOptions,
} from './atlas-renderer';
import { edgeLook, nodeLook, PLAIN_VIEW, type AtlasView } from './atlas-view';

/** How often a running layout is checked for settling. */
const CHECK_EVERY_MS = 400;
/** How often the map shows the layout's progress: small maps animate, large ones step. */
const SMALL_SHOW_EVERY_MS = 60;
const LARGE_SHOW_EVERY_MS = 1_200;

/** The layout is not taken as settled before this many rounds, however little the nodes move. */
export const MIN_LAYOUT_ROUNDS = 60;

/**
 * A frame that took longer than this (drawing plus handing the picture to the screen) means
 * this browser draws the map slowly — software WebGL, a weak graphics chip: the layout's steps
 * are then not shown, only its result, so the page stays responsive while it runs.
 */
export const SLOW_FRAME_MS = 120;

/** Draws the map with sigma (WebGL) and lays it out with ForceAtlas2 in a web worker. */
export async function createSigmaAtlasRenderer(
  container: HTMLElement,
  graph: AtlasGraph,
  events: AtlasRendererEvents,
  options: AtlasRendererOptions = {},
): Promise<AtlasRenderer> {
  let view: AtlasView = PLAIN_VIEW;
  const largeMap = isLargeMap(graph);
  /** Links of a large map are hidden while it is laid out (also in its first frame when a layout follows). */
  let linksHidden = largeMap && options.layoutFollows === true;
  const hugeMap = graph.order > 5_000 || graph.size > 20_000;
  const frames = new FrameCost();
  frames.beforeRender();
  const sigma = new Sigma<AtlasNodeAttributes, AtlasEdgeAttributes>(graph, container, {
    labelFont: "'IBM Plex Sans', system-ui, sans-serif",
    labelSize: 12,
    labelWeight: '500',
    labelColor: { color: '#263238' },
    labelRenderedSizeThreshold: 9,
    labelDensity: 0.6,
    zIndex: true,
    // Keeps panning smooth on very large maps.
    hideEdgesOnMove: hugeMap,
    nodeReducer: (id, data) => {
      const look = nodeLook(id, data, view);
      return look ? { ...data, ...look } : data;
    },
    edgeReducer: (edge, data) => {
      if (linksHidden) return { ...data, hidden: true };
      if (view.selected === null && data.weight >= view.minWeight) return data;
      const [source, target] = graph.extremities(edge);
      const look = edgeLook(source, target, data, view);
      return look ? { ...data, ...look } : data;
    },
  });
  // The constructor drew the first frame; later frames are timed from sigma's own events.
  frames.afterRender();
  sigma.on('beforeRender', () => frames.beforeRender());
  sigma.on('afterRender', () => frames.afterRender());
  sigma.on('clickNode', ({ node }) => events.nodeClicked(node));
  sigma.on('clickStage', () => events.stageClicked());
  sigma.on('enterNode', () => (container.style.cursor = 'pointer'));
  sigma.on('leaveNode', () => (container.style.cursor = ''));
  // sigma follows window resizes only; the map also changes size when the side panel opens. A
  // new size needs a new frame, not a new index (the observer also reports the size it starts with).
  let size = [container.clientWidth, container.clientHeight].join('×');
  const resizes = new ResizeObserver(() => {
    const next = [container.clientWidth, container.clientHeight].join('×');
    if (next === size) return;
    size = next;
    sigma.scheduleRender();
  });
  resizes.observe(container);

  let layout: FA2Layout | null = null;
  let finishLayout: (() => void) | null = null;

  const stopLayout = () => finishLayout?.();

  return {
    setView(next) {
      // The screen hands the same view again when only the renderer changed: nothing to redraw.
      if (next === view) return;
      view = next;
      // Colours and hidden flags change the drawn data: a full refresh (no graph rebuild).
      sigma.refresh();
    },
    focusNode(id) {
      const display = sigma.getNodeDisplayData(id);
      if (!display) return;
      const camera = sigma.getCamera();
      void camera.animate({ x: display.x, y: display.y, ratio: Math.min(camera.ratio, 0.5) }, { duration: 450 });
    },
    runLayout(maxMs) {
      stopLayout();
      if (graph.order === 0) return Promise.resolve();
      // The worker writes positions into a copy that nothing draws; the map takes them over at
      // a pace its size allows, so a 20,000-module map is not re-indexed on every iteration.
      const working = graph.copy();
      const running = new FA2Layout(working, {
        settings: { ...forceAtlas2.inferSettings(working), edgeWeightInfluence: 0.5, slowDown: 2 },
        getEdgeWeight: 'weight',
      });
      layout = running;
      const showEvery = largeMap ? LARGE_SHOW_EVERY_MS : SMALL_SHOW_EVERY_MS;
      if (largeMap && !linksHidden) {
        linksHidden = true;
        sigma.refresh();
      }
      const copyPositions = () =>
        graph.forEachNode((id, attributes) => {
          attributes.x = working.getNodeAttribute(id, 'x');
          attributes.y = working.getNodeAttribute(id, 'y');
        });
      const show = () =>
        graph.updateEachNodeAttributes(
          (id, attributes) => {
            attributes.x = working.getNodeAttribute(id, 'x');
            attributes.y = working.getNodeAttribute(id, 'y');
            return attributes;
          },
          { attributes: ['x', 'y'] },
        );
      return new Promise<void>((resolve) => {
        let previous = nodePositions(working);
        let quietChecks = 0;
        // Each answer of the worker is one round of the layout. On a large map a round takes
        // long enough that two checks may see little movement only because few rounds ran.
        let rounds = 0;
        working.on('eachNodeAttributesUpdated', () => void rounds++);
        const check = setInterval(() => {
          const movement = layoutMovement(previous, working);
          previous = nodePositions(working);
          quietChecks = movement < SETTLED_MOVEMENT && rounds >= MIN_LAYOUT_ROUNDS ? quietChecks + 1 : 0;
          if (quietChecks >= 2) finish();
        }, CHECK_EVERY_MS);
        // Steps are shown while frames are quick; one slow frame and only the result is shown.
        const showing = setInterval(() => {
          if (frames.lastMs > SLOW_FRAME_MS) clearInterval(showing);
          else show();
        }, showEvery);
        const deadline = setTimeout(() => finish(), maxMs);
        const finish = () => {
          clearInterval(check);
          clearInterval(showing);
          clearTimeout(deadline);
          running.kill();
          linksHidden = false;
          // Positions and links change together: one full refresh draws both.
          copyPositions();
          sigma.refresh();
          if (layout === running) layout = null;
          finishLayout = null;
          resolve();
        };
        finishLayout = finish;
        running.start();
      });
    },
    stopLayout,
    exportPng() {
      // The export helper is typed for untyped attributes; it only reads the graph and settings.
      return toBlob(sigma as unknown as Sigma, { format: 'png', backgroundColor: '#ffffff' });
    },
    destroy() {
      stopLayout();
      layout?.kill();
      resizes.disconnect();
      sigma.kill();
    },
  };
}
/**
 * The cost of the last frame: from the start of sigma's drawing until the second frame callback
 * after it, by which time the browser has handed the picture to the screen whether sigma drew
 * inside a frame callback or in a task of its own (with software WebGL the canvas is read back
 * on the main thread in between, and that is most of the cost). At most one frame too long.
 */
class FrameCost {
  lastMs = 0;
  private started = 0;
  private pending = 0;

  beforeRender(): void {
    this.started = performance.now();
  }

  afterRender(): void {
    const started = this.started;
    cancelAnimationFrame(this.pending);
    this.pending = requestAnimationFrame(() => {
      this.pending = requestAnimationFrame(() => {
        this.lastMs = performance.now() - started;
      });
    });
  }
}
