import type { FlowGraph } from '../model';
import { flowGraph } from '../testing/graphs';
import { basisPaths } from './basisPaths';
import { describePath } from './describePath';

/** Gives the decisions of a hand-built graph real kinds, lines and condition text. */
function named(graph: FlowGraph, texts: [string, number][]): FlowGraph {
  graph.decisions.forEach((d, k) => {
    d.text = texts[k][0];
    d.span = { ...d.span, line: texts[k][1], endLine: texts[k][1] };
  });
  return graph;
}

describe('describePath', () => {
  it('should write one line per decision with its line, condition and outcome', () => {
    // for (const o of orders) { if (o.isExpress) ship(o); }
    const graph = named(flowGraph('0>1; 1?2:5@for-of; 2?3:4; 3>4; 4>1; 5>6'), [['const o of orders', 11], ['o.isExpress', 12]]);
    const lines = basisPaths(graph).map((p) => describePath(graph, p));
    expect(lines).toEqual([
      ['line 11: for (const o of orders) → leave loop'],
      ['line 11: for (const o of orders) → enter loop', 'line 12: if (o.isExpress) → false', 'line 11: for (const o of orders) → leave loop'],
      ['line 11: for (const o of orders) → enter loop', 'line 12: if (o.isExpress) → true', 'line 11: for (const o of orders) → leave loop'],
    ]);
  });

  it('should word case, catch, do-while and operators', () => {
    const graph = named(flowGraph('0?1:1@case; 1?2:2@catch; 2?3:3@do-while; 3?4:4@and; 4?5:5@nullish; 5?6:6@conditional'), [
      ["'air'", 3], ['e', 4], ['more()', 5], ['a && b', 6], ["b ?? ''", 7], ['ready', 8],
    ]);
    const steps = graph.decisions.flatMap((d) => [{ decision: d.id, outcome: 'true' as const }, { decision: d.id, outcome: 'false' as const }]);
    expect(describePath(graph, { steps })).toEqual([
      "line 3: case 'air' → matches",
      "line 3: case 'air' → does not match",
      'line 4: try … catch (e) → throws',
      'line 4: try … catch (e) → completes',
      'line 5: do … while (more()) → loop again',
      'line 5: do … while (more()) → leave loop',
      'line 6: a && b, left side → truthy',
      'line 6: a && b, left side → falsy',
      "line 7: b ?? '', left side → null or undefined",
      "line 7: b ?? '', left side → has a value",
      'line 8: ready ? … : … → true',
      'line 8: ready ? … : … → false',
    ]);
  });

  it('should keep a keyword the condition text already has', () => {
    const graph = named(flowGraph('0?1:1@case; 1?2:2@catch'), [["case 'air'", 3], ['catch (e)', 4]]);
    expect(describePath(graph, { steps: [{ decision: 0, outcome: 'true' }, { decision: 1, outcome: 'false' }] })).toEqual([
      "line 3: case 'air' → matches",
      'line 4: try … catch (e) → completes',
    ]);
  });

  it('should refuse a decision the graph does not have', () => {
    expect(() => describePath(flowGraph('0>1'), { steps: [{ decision: 3, outcome: 'true' }] })).toThrow(/^analyzer\/paths: decision 3/);
  });
});
