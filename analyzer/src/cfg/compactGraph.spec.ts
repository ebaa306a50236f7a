import { ESLINT_COMPARABLE_SETTINGS } from '../model/CountingSettings';
import type { FlowGraph } from '../model/FlowGraph';
import { fromCompactGraph, toCompactGraph } from './compactGraph';
import { unitOf } from './fixtures/analyzeSnippet';

const code = 'function f(a = 1) { switch (x) { case 1: if (a?.b && c) return; default: try { g(); } catch { h(); } } }';

describe('compact graph', () => {
  it('should round-trip a graph exactly', () => {
    const graph = unitOf(code, ESLINT_COMPARABLE_SETTINGS).graph;
    expect(graph.decisions.map((d) => d.kind).sort()).toEqual(['and', 'case', 'catch', 'default-value', 'if', 'optional-chain']);
    expect(fromCompactGraph(toCompactGraph(graph))).toStrictEqual(graph);
  });

  it('should store spans as tuples, null for entry, exit and empty joins, and outcomes as 1 / 0', () => {
    const graph = unitOf('function f() { if (a) {} }', ESLINT_COMPARABLE_SETTINGS).graph;
    const compact = toCompactGraph(graph);
    expect(compact.blocks).toEqual([null, [1, 20, 1, 21], null]);
    expect(compact.edges).toEqual([[0, 1], [1, 2, 0, 1], [1, 2, 0, 0]]);
    expect(compact.decisions).toEqual([{ kind: 'if', block: 1, span: { line: 1, column: 20, endLine: 1, endColumn: 21 }, text: 'a' }]);
  });

  it('should refuse a graph whose block kinds the compact form cannot imply', () => {
    const graph: FlowGraph = { blocks: [{ id: 0, kind: 'entry' }, { id: 1, kind: 'decision' }, { id: 2, kind: 'exit' }], edges: [], decisions: [], entry: 0, exit: 2 };
    expect(() => toCompactGraph(graph)).toThrow(/^analyzer\/cfg: block 1 is 'decision' but its role says 'code'$/);
  });
});
