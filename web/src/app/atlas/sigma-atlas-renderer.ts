import { toBlob } from '@sigma/export-image';
import forceAtlas2 from 'graphology-layout-forceatlas2';
import FA2Layout from 'graphology-layout-forceatlas2/worker';
import Sigma from 'sigma';

import type { AtlasEdgeAttributes, AtlasGraph, AtlasNodeAttributes } from './atlas-graph';
import { layoutMovement, SETTLED_MOVEMENT, type AtlasRenderer, type AtlasRendererEvents } from './atlas-renderer';
import { edgeLook, nodeLook, PLAIN_VIEW, type AtlasView } from './atlas-view';
import { capturePositions } from './position-cache';

/** How often a running layout is checked for settling. */
const CHECK_EVERY_MS = 400;

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
      const running = new FA2Layout(graph, {
        settings: { ...forceAtlas2.inferSettings(graph), edgeWeightInfluence: 0.5, slowDown: 2 },
        getEdgeWeight: 'weight',
      });
      layout = running;
      return new Promise<void>((resolve) => {
        let previous = capturePositions(graph).xy;
        let quietChecks = 0;
        const check = setInterval(() => {
          const movement = layoutMovement(previous, graph);
          previous = capturePositions(graph).xy;
          quietChecks = movement < SETTLED_MOVEMENT ? quietChecks + 1 : 0;
          if (quietChecks >= 2) finish();
        }, CHECK_EVERY_MS);
        const deadline = setTimeout(() => finish(), maxMs);
        const finish = () => {
          clearInterval(check);
          clearTimeout(deadline);
          running.kill();
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
