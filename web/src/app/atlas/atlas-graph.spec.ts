import {
  buildAtlasModel,
  EDGE_SIZE,
  edgeSize,
  heaviestLinks,
  neighbourhood,
  NODE_SIZE,
  nodeSize,
  seedPositions,
} from './atlas-graph';
import { CLUSTER_HUES, OTHER_COLOUR } from './cluster-palette';
import { demoModuleGraph } from './module-graph.fixtures';

describe('atlas graph', () => {
  it('should size nodes by the square root of ΣV and links by the square root of their weight', () => {
    expect(nodeSize(0, 400)).toBe(NODE_SIZE.min);
    expect(nodeSize(400, 400)).toBe(NODE_SIZE.max);
    expect(nodeSize(100, 400)).toBeCloseTo(NODE_SIZE.min + (NODE_SIZE.max - NODE_SIZE.min) / 2);
    expect(nodeSize(5, 0)).toBe(NODE_SIZE.min);
    expect(edgeSize(10, 40)).toBeCloseTo(EDGE_SIZE.min + (EDGE_SIZE.max - EDGE_SIZE.min) / 2);
    expect(edgeSize(40, 40)).toBe(EDGE_SIZE.max);
  });

  it('should build one node per module with its colour, size and label, and drop self-loops and dangling links', () => {
    const model = buildAtlasModel(demoModuleGraph());

    expect(model.graph.order).toBe(4);
    expect(model.graph.size).toBe(3);
    expect(model.maxCyclomatic).toBe(400);
    expect(model.maxWeight).toBe(40);
    const core = model.graph.getNodeAttributes('folder:src/dispatch-core');
    expect(core).toMatchObject({ label: 'src/dispatch-core', color: CLUSTER_HUES[0], size: NODE_SIZE.max, cyclomatic: 400 });
    expect(model.graph.getNodeAttribute('folder:src/shared', 'color')).toBe(OTHER_COLOUR);
    const heavy = model.graph.edge('folder:src/routing', 'folder:src/dispatch-core');
    expect(heavy && model.graph.getEdgeAttributes(heavy)).toMatchObject({ weight: 40, size: EDGE_SIZE.max });
    expect(model.modules.map((m) => m.path)).toEqual(['src/dispatch-core', 'src/billing', 'src/routing', 'src/shared']);
    expect(model.swatches.map((s) => s.label)).toEqual(['Cluster c1', 'Cluster c2', 'No cluster']);
  });

  it('should sum repeated links between the same modules in the same direction', () => {
    const data = demoModuleGraph();
    data.links.push([0, 1, 5]);
    const model = buildAtlasModel(data);

    const edge = model.graph.edge('folder:src/routing', 'folder:src/dispatch-core');
    expect(edge && model.graph.getEdgeAttribute(edge, 'weight')).toBe(45);
    expect(model.graph.size).toBe(3);
  });

  it('should seed distinct positions, the same every time, with a cluster kept together', () => {
    const first = buildAtlasModel(demoModuleGraph());
    const second = buildAtlasModel(demoModuleGraph());
    seedPositions(first);
    seedPositions(second);

    const at = (m: typeof first, id: string) => {
      const { x, y } = m.graph.getNodeAttributes(id);
      return [x, y];
    };
    const ids = first.graph.nodes();
    expect(ids.map((id) => at(first, id))).toEqual(ids.map((id) => at(second, id)));
    expect(new Set(ids.map((id) => at(first, id).join(','))).size).toBe(ids.length);
    const distance = (a: string, b: string) => Math.hypot(at(first, a)[0] - at(first, b)[0], at(first, a)[1] - at(first, b)[1]);
    // Same cluster (c1) nearer than different clusters.
    expect(distance('folder:src/routing', 'folder:src/dispatch-core')).toBeLessThan(
      distance('folder:src/routing', 'folder:src/billing'),
    );
  });

  it('should find a module’s neighbours both ways and its heaviest links', () => {
    const { graph } = buildAtlasModel(demoModuleGraph());

    expect([...neighbourhood(graph, 'folder:src/dispatch-core')].sort()).toEqual(['folder:src/billing', 'folder:src/routing']);
    expect(neighbourhood(graph, null).size).toBe(0);
    expect(neighbourhood(graph, 'folder:nowhere').size).toBe(0);
    expect(heaviestLinks(graph, 'folder:src/dispatch-core', 'in', 5)).toEqual([
      { id: 'folder:src/routing', label: 'src/routing', weight: 40 },
    ]);
    expect(heaviestLinks(graph, 'folder:src/dispatch-core', 'out', 5)).toEqual([
      { id: 'folder:src/billing', label: 'src/billing', weight: 10 },
    ]);
    expect(heaviestLinks(graph, 'folder:src/routing', 'in', 5)).toEqual([]);
  });
});
