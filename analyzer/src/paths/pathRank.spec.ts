import { constructGraph, flowGraph } from '../testing/graphs';
import { pathRank } from './pathRank';

describe('pathRank', () => {
  // Two ifs in a row: 0>1; 1?2:3; 2>3; 3?4:5; 4>5; 5>6 — edges 0..7, V = 3.
  const graph = flowGraph('0>1; 1?2:3; 2>3; 3?4:5; 4>5; 5>6');
  const [tt, tf, ft, ff] = [[0, 1, 3, 4, 6, 7], [0, 1, 3, 5, 7], [0, 2, 4, 6, 7], [0, 2, 5, 7]].map((edges) => ({ edges }));

  it('should find the four paths through two ifs dependent, any three of them independent', () => {
    // McCabe 1976 (reference-checks 1.3 b): v = 3 is the largest number of independent paths;
    // here TT − TF − FT + FF = 0.
    expect(pathRank(graph, [tt, tf, ft, ff])).toBe(3);
    expect(pathRank(graph, [tt, tf, ft])).toBe(3);
    expect(pathRank(graph, [tf, ft, ff])).toBe(3);
  });

  it('should count a repeated path once', () => {
    expect(pathRank(graph, [tt, tt])).toBe(1);
    expect(pathRank(graph, [])).toBe(0);
  });

  it('should tell paths apart by how often they go round a loop', () => {
    // while: 0>1; 1?2:3; 2>1; 3>4 — once round and twice round differ by one circuit.
    const loop = constructGraph({ t: 'while', body: { t: 'stmt' } });
    const round = (times: number): { edges: number[] } => {
      const body = loop.edges.findIndex((e) => e.outcome === 'true');
      const leave = loop.edges.findIndex((e) => e.outcome === 'false');
      const start = loop.edges.findIndex((e) => e.from === loop.entry);
      const back = loop.edges.filter((e, i) => e.to === loop.edges[start].to && i !== start).map((e) => loop.edges.indexOf(e));
      const inner = loop.edges.findIndex((e) => e.from === loop.edges[body].to);
      const after = loop.edges.findIndex((e) => e.from === loop.edges[leave].to);
      const edges = [start];
      for (let k = 0; k < times; k++) edges.push(body, inner, ...back);
      return { edges: [...edges, leave, after] };
    };
    expect(pathRank(loop, [round(0), round(1)])).toBe(2);
    // Twice round = 2 × once round − never round: dependent.
    expect(pathRank(loop, [round(0), round(1), round(2)])).toBe(2);
  });

  it('should refuse an edge the graph does not have', () => {
    expect(() => pathRank(graph, [{ edges: [0, 99] }])).toThrow(/^analyzer\/paths: edge 99/);
  });
});
