import { toBlob } from '@sigma/export-image';
import forceAtlas2 from 'graphology-layout-forceatlas2';
import FA2Layout from 'graphology-layout-forceatlas2/worker';
import Sigma from 'sigma';

import type { AtlasEdgeAttributes, AtlasGraph, AtlasNodeAttributes } from './atlas-graph';
import { layoutMovement, nodePositions, SETTLED_MOVEMENT, type AtlasRenderer, type AtlasRendererEvents } from './atlas-renderer';
import { edgeLook, nodeLook, PLAIN_VIEW, type AtlasView } from './atlas-view';

/** How often a running layout is checked for settling. */
const CHECK_EVERY_MS = 400;
/** How often the map shows the layout's progress: small maps animate, large ones step. */
const SMALL_SHOW_EVERY_MS = 60;
const LARGE_SHOW_EVERY_MS = 1_200;

/** Draws the map with sigma (WebGL) and lays it out with ForceAtlas2 in a web worker. */
export async function createSigmaAtlasRenderer(
  container: HTMLElement,
  graph: AtlasGraph,
  events: AtlasRendererEvents,
): Promise<AtlasRenderer> {
  let view: AtlasView = PLAIN_VIEW;
  const large = graph.order > 5_000 || graph.size > 20_000;
  const sigma = new Sigma<AtlasNodeAttributes, AtlasEdgeAttributes>(graph, container, {
    labelFont: "'IBM Plex Sans', system-ui, sans-serif",
    labelSize: 12,
    labelWeight: '500',
    labelColor: { color: '#263238' },
    labelRenderedSizeThreshold: 9,
    labelDensity: 0.6,
    zIndex: true,
    // Keeps panning smooth on very large maps.
    hideEdgesOnMove: large,
    nodeReducer: (id, data) => {
      const look = nodeLook(id, data, view);
      return look ? { ...data, ...look } : data;
    },
    edgeReducer: (edge, data) => {
      if (view.selected === null && data.weight >= view.minWeight) return data;
      const [source, target] = graph.extremities(edge);
      const look = edgeLook(source, target, data, view);
      return look ? { ...data, ...look } : data;
    },
  });
  sigma.on('clickNode', ({ node }) => events.nodeClicked(node));
  sigma.on('clickStage', () => events.stageClicked());
  sigma.on('enterNode', () => (container.style.cursor = 'pointer'));
  sigma.on('leaveNode', () => (container.style.cursor = ''));
  // sigma follows window resizes only; the map also changes size when the side panel opens.
  const resizes = new ResizeObserver(() => sigma.refresh());
  resizes.observe(container);

  let layout: FA2Layout | null = null;
  let finishLayout: (() => void) | null = null;

  const stopLayout = () => finishLayout?.();

  return {
    setView(next) {
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
      const showEvery = graph.order + graph.size > 3_000 ? LARGE_SHOW_EVERY_MS : SMALL_SHOW_EVERY_MS;
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
        const check = setInterval(() => {
          const movement = layoutMovement(previous, working);
          previous = nodePositions(working);
          quietChecks = movement < SETTLED_MOVEMENT ? quietChecks + 1 : 0;
          if (quietChecks >= 2) finish();
        }, CHECK_EVERY_MS);
        const showing = setInterval(show, showEvery);
        const deadline = setTimeout(() => finish(), maxMs);
        const finish = () => {
          clearInterval(check);
          clearInterval(showing);
          clearTimeout(deadline);
          running.kill();
          show();
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
