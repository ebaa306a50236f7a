import type { CompactGraph } from './flow-types';
import { describeBlock, layoutFlowGraph, lineRange, MAX_TITLE_CHARS, svgPath } from './flow-layout';
import { loadVanGraph } from './flow-fixtures';

describe('layoutFlowGraph', () => {
  it('should place every block and every edge of the graph', () => {
    const layout = layoutFlowGraph(loadVanGraph());

    expect(layout.blocks.map((b) => b.id)).toEqual([0, 1, 2, 3, 4, 5, 6]);
    expect(layout.edges.map((e) => [e.from, e.to])).toEqual([[0, 1], [1, 2], [2, 3], [2, 4], [3, 4], [4, 5], [4, 6], [5, 4]]);
    for (const block of layout.blocks) {
      expect(block.x - block.width / 2).toBeGreaterThanOrEqual(0);
      expect(block.x + block.width / 2).toBeLessThanOrEqual(layout.width);
      expect(block.y + block.height / 2).toBeLessThanOrEqual(layout.height);
    }
    for (const edge of layout.edges) expect(edge.path).toMatch(/^M[\d.]+,[\d.]+ .*L[\d.]+,[\d.]+$/);
  });

  it('should lay the graph out top to bottom, entry above exit', () => {
    const { blocks } = layoutFlowGraph(loadVanGraph());

    expect(blocks[0].y).toBeLessThan(blocks[1].y);
    expect(blocks[1].y).toBeLessThan(blocks[2].y);
    expect(blocks[4].y).toBeLessThan(blocks[6].y);
  });

  it('should name each decision edge with its outcome word and leave other edges unlabelled', () => {
    const { edges } = layoutFlowGraph(loadVanGraph());

    expect(edges.map((e) => e.label)).toEqual(['', '', 'true', 'false', '', 'enter', 'leave', '']);
    expect(edges[2]).toMatchObject({ decision: 0, outcome: 'true' });
    expect(edges[6]).toMatchObject({ decision: 1, outcome: 'false' });
    expect(edges[0]).toMatchObject({ decision: null, outcome: null });
  });

  it('should keep parallel edges (an empty branch) apart', () => {
    const graph: CompactGraph = {
      entry: 0,
      exit: 2,
      blocks: [null, [1, 5, 1, 9], null],
      edges: [[0, 1], [1, 2, 0, 1], [1, 2, 0, 0]],
      decisions: [{ kind: 'if', block: 1, span: { line: 1, column: 5, endLine: 1, endColumn: 9 }, text: 'done' }],
    };
    const { edges } = layoutFlowGraph(graph);

    expect(edges).toHaveLength(3);
    expect(edges[1].path).not.toBe(edges[2].path);
    expect([edges[1].label, edges[2].label]).toEqual(['true', 'false']);
  });
});

describe('describeBlock', () => {
  it('should tell entry, exit, decision, code and empty join blocks apart', () => {
    const graph = loadVanGraph();
    graph.blocks.push(null);

    expect(describeBlock(graph, 0)).toMatchObject({ kind: 'entry', title: 'entry', lines: null });
    expect(describeBlock(graph, 6)).toMatchObject({ kind: 'exit', title: 'exit' });
    expect(describeBlock(graph, 2)).toMatchObject({
      kind: 'decision',
      decision: 0,
      title: 'ready',
      subtitle: 'line 3 · if',
      ariaLabel: 'Decision 1, if on line 3: ready',
      lines: { from: 3, to: 3 },
    });
    expect(describeBlock(graph, 4).ariaLabel).toBe('Decision 2, while loop on line 5: queue');
    expect(describeBlock(graph, 3)).toMatchObject({ kind: 'code', title: 'line 4', ariaLabel: 'Code block, line 4' });
    expect(describeBlock(graph, 7)).toMatchObject({ kind: 'join', title: '' });
  });

  it('should shorten a long condition inside the block and keep it whole in the label', () => {
    const graph = loadVanGraph();
    const text = 'order.parcels.every((parcel) => parcel.weightKg <= limits.bikeKg)';
    graph.decisions[0].text = text;
    const block = describeBlock(graph, 2);

    expect(block.title).toHaveLength(MAX_TITLE_CHARS);
    expect(block.title.endsWith('…')).toBe(true);
    expect(block.ariaLabel).toContain(text);
  });
});

describe('lineRange', () => {
  it('should name one line or a range', () => {
    expect(lineRange(4, 4)).toBe('line 4');
    expect(lineRange(4, 9)).toBe('lines 4–9');
  });
});

describe('svgPath', () => {
  it('should draw straight lines between two points and bend through inner points', () => {
    expect(svgPath([])).toBe('');
    expect(svgPath([{ x: 0, y: 0 }, { x: 10, y: 20 }])).toBe('M0,0 L10,20');
    expect(svgPath([{ x: 0, y: 0 }, { x: 10, y: 10 }, { x: 20, y: 30 }])).toBe('M0,0 Q10,10 15,20 L20,30');
  });
});
