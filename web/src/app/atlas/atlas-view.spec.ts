import { DIMMED_COLOUR, edgeLook, HIGHLIGHT_EDGE_COLOUR, nodeLook, PLAIN_VIEW, type AtlasView } from './atlas-view';

const node = { x: 0, y: 0, size: 5, color: '#332288', label: 'src/routing', cyclomatic: 20, cluster: 'c1' };

describe('atlas view', () => {
  it('should draw everything as it is with nothing selected or filtered', () => {
    expect(nodeLook('a', node, PLAIN_VIEW)).toBeNull();
    expect(edgeLook('a', 'b', { weight: 1 }, PLAIN_VIEW)).toBeNull();
  });

  it('should hide modules below the ΣV filter, except the selected one, and links below the weight filter', () => {
    const view: AtlasView = { ...PLAIN_VIEW, minCyclomatic: 21, minWeight: 3 };

    expect(nodeLook('a', node, view)).toEqual({ hidden: true });
    expect(nodeLook('a', { ...node, cyclomatic: 21 }, view)).toBeNull();
    expect(nodeLook('a', node, { ...view, selected: 'a' })).toEqual({ highlighted: true, zIndex: 2 });
    expect(edgeLook('a', 'b', { weight: 2 }, view)).toEqual({ hidden: true });
    expect(edgeLook('a', 'b', { weight: 3 }, view)).toBeNull();
  });

  it('should keep the selected module and its neighbours bright and dim the rest', () => {
    const view: AtlasView = { ...PLAIN_VIEW, selected: 'a', neighbours: new Set(['b']) };

    expect(nodeLook('a', node, view)).toEqual({ highlighted: true, zIndex: 2 });
    expect(nodeLook('b', node, view)).toEqual({ zIndex: 1 });
    expect(nodeLook('c', node, view)).toEqual({ color: DIMMED_COLOUR, label: null, zIndex: 0 });
    expect(edgeLook('b', 'a', { weight: 1 }, view)).toEqual({ color: HIGHLIGHT_EDGE_COLOUR, zIndex: 1 });
    expect(edgeLook('b', 'c', { weight: 1 }, view)).toEqual({ color: DIMMED_COLOUR, zIndex: 0 });
  });
});
