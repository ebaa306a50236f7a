import { CLUSTER_HUES, clusterColours, OTHER_COLOUR } from './cluster-palette';
import type { ModuleCluster } from './module-graph';
import { demoModuleGraph, moduleRecord } from './module-graph.fixtures';

function cluster(id: string, cyclomatic: number, size = 1): ModuleCluster {
  return { id, size, functions: 1, cyclomatic, decisions: 0, internalWeight: 0, externalWeight: 0 };
}

describe('clusterColours', () => {
  it('should give the largest clusters by ΣV the first hues and grey to modules without a cluster', () => {
    const colours = clusterColours(demoModuleGraph());

    expect(colours.colourOf('c1')).toBe(CLUSTER_HUES[0]);
    expect(colours.colourOf('c2')).toBe(CLUSTER_HUES[1]);
    expect(colours.colourOf(null)).toBe(OTHER_COLOUR);
    expect(colours.colourOf('unknown')).toBe(OTHER_COLOUR);
    expect(colours.swatches).toEqual([
      { id: 'c1', label: 'Cluster c1', colour: CLUSTER_HUES[0], members: 2, cyclomatic: 500 },
      { id: 'c2', label: 'Cluster c2', colour: CLUSTER_HUES[1], members: 1, cyclomatic: 100 },
      { id: null, label: 'No cluster', colour: OTHER_COLOUR, members: 1, cyclomatic: 4 },
    ]);
  });

  it('should paint clusters beyond the eighth grey and sum them in one legend row', () => {
    const clusters = Array.from({ length: 10 }, (_, i) => cluster(`k${i}`, 100 - i));
    const nodes = clusters.map((c) => moduleRecord(c.id, { id: c.id, cluster: c.id, cyclomatic: c.cyclomatic }));
    const colours = clusterColours({ nodes, clusters });

    expect(new Set(colours.swatches.slice(0, 8).map((s) => s.colour)).size).toBe(8);
    expect(colours.colourOf('k7')).toBe(CLUSTER_HUES[7]);
    expect(colours.colourOf('k8')).toBe(OTHER_COLOUR);
    expect(colours.swatches[8]).toEqual({ id: null, label: '2 more clusters', colour: OTHER_COLOUR, members: 2, cyclomatic: 92 + 91 });
  });

  it('should order clusters of equal ΣV by id, so colours stay the same between visits', () => {
    const a = clusterColours({ nodes: [], clusters: [cluster('b', 5), cluster('a', 5)] });
    const b = clusterColours({ nodes: [], clusters: [cluster('a', 5), cluster('b', 5)] });

    expect(a.swatches).toEqual(b.swatches);
    expect(a.colourOf('a')).toBe(CLUSTER_HUES[0]);
  });

  it('should use distinct, valid hex colours that differ from grey', () => {
    expect(new Set(CLUSTER_HUES).size).toBe(CLUSTER_HUES.length);
    for (const hue of CLUSTER_HUES) expect(hue).toMatch(/^#[0-9A-F]{6}$/i);
    expect(CLUSTER_HUES).not.toContain(OTHER_COLOUR);
  });
});
