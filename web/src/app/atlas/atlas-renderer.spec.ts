import Graph from 'graphology';

import type { AtlasGraph } from './atlas-graph';
import { layoutBudgetMs, layoutMovement, nodePositions } from './atlas-renderer';

function line(points: Array<[number, number]>): AtlasGraph {
  const graph: AtlasGraph = new Graph();
  points.forEach(([x, y], i) => graph.addNode(`n${i}`, { x, y, size: 1, color: '#000', label: '', cyclomatic: 1, cluster: null }));
  return graph;
}

describe('layout checks', () => {
  it('should measure the mean step of a node relative to the layout’s extent', () => {
    const graph = line([[0, 0], [100, 0]]);
    const before = nodePositions(graph);
    expect([...before]).toEqual([0, 0, 100, 0]);
    expect(layoutMovement(before, graph)).toBe(0);

    graph.setNodeAttribute('n1', 'x', 110);
    // One node moved 10 of 2 nodes: mean 5, extent 110.
    expect(layoutMovement(before, graph)).toBeCloseTo(5 / 110);
    expect(layoutMovement(new Float32Array(), line([]))).toBe(0);
  });

  it('should give larger maps more time, up to 20 seconds', () => {
    expect(layoutBudgetMs(10)).toBe(3_010);
    expect(layoutBudgetMs(20_000)).toBe(20_000);
  });
});
