import fc from 'fast-check';
import { buildFlowGraph } from '../cfg/buildFlowGraph';
import { collectUnits } from '../cfg/fixtures/collectUnits';
import { programArbitraries } from '../cfg/fixtures/programArbitrary';
import { ProgramRenderer } from '../cfg/fixtures/renderProgram';
import { DEFAULT_SETTINGS, ESLINT_COMPARABLE_SETTINGS, type CountingSettings } from '../model/CountingSettings';
import type { FlowGraph } from '../model/FlowGraph';
import { cyclomaticOf, reportedCyclomatic } from './cyclomatic';

/** Graphs of every unit of a generated program. */
const graphsArbitrary = programArbitraries.block.map((body) => {
  const { sourceFile, units } = collectUnits(`function main(p) {\n${new ProgramRenderer().functionBody(body).join('\n')}\n}`);
  return units.map((unit) => buildFlowGraph(unit, sourceFile, ESLINT_COMPARABLE_SETTINGS));
});

function disjointUnion(graphs: readonly FlowGraph[]): FlowGraph {
  const union: FlowGraph = { blocks: [], edges: [], decisions: [], entry: 0, exit: 0 };
  for (const g of graphs) {
    const offset = union.blocks.length;
    for (const b of g.blocks) union.blocks.push({ id: b.id + offset, kind: b.kind });
    for (const e of g.edges) union.edges.push({ from: e.from + offset, to: e.to + offset });
  }
  return union;
}

describe('cyclomaticOf', () => {
  it('should compute e − n + 2p with weakly connected components', () => {
    // McCabe 1976, IEEE TSE SE-2(4): v(G) = e − n + 2p (reference-checks 1.1, SECONDARY).
    const g: FlowGraph = {
      blocks: [0, 1, 2, 3, 4].map((id) => ({ id, kind: 'code' as const })),
      edges: [{ from: 0, to: 1 }, { from: 1, to: 0 }, { from: 3, to: 4 }],
      decisions: [], entry: 0, exit: 1,
    };
    expect(cyclomaticOf(g)).toEqual({ nodes: 5, edges: 3, components: 3, strict: 3 - 5 + 6 });
  });

  it('should refuse an edge to a missing block', () => {
    const g: FlowGraph = { blocks: [{ id: 0, kind: 'entry' }], edges: [{ from: 0, to: 7 }], decisions: [], entry: 0, exit: 0 };
    expect(() => cyclomaticOf(g)).toThrow(/^analyzer\/cfg: edge 0 → 7/);
  });

  it('should reproduce the Pressman flow graph: 11 edges, 9 nodes, V = 4', () => {
    // Pressman, basis path testing (reference-checks 4.1): "11 edges − 9 nodes + 2 = 4" (VERIFIED-TEXT).
    const names = ['1', '2-3', '4-5', '6', '7', '8', '9', '10', '11'];
    const id = (n: string): number => names.indexOf(n);
    const edges = [['1', '2-3'], ['1', '11'], ['2-3', '4-5'], ['2-3', '6'], ['4-5', '10'], ['6', '7'], ['6', '8'], ['7', '9'], ['8', '9'], ['9', '10'], ['10', '1']];
    const g: FlowGraph = {
      blocks: names.map((_, i) => ({ id: i, kind: 'code' as const })),
      edges: edges.map(([a, b]) => ({ from: id(a), to: id(b) })),
      decisions: [], entry: 0, exit: id('11'),
    };
    expect(cyclomaticOf(g)).toMatchObject({ nodes: 9, edges: 11, strict: 4 });
  });

  describe('properties on generated graphs (reference-checks §9.3, DERIVED from McCabe 1976 §1.3)', () => {
    it('should keep v when an edge is split by a new node and add 1 per added edge', () => {
      fc.assert(
        fc.property(graphsArbitrary, fc.nat(), fc.nat(), fc.nat(), (graphs, pickEdge, a, b) => {
          const g = graphs[graphs.length - 1];
          const v = cyclomaticOf(g).strict;
          const e = g.edges[pickEdge % g.edges.length];
          const split: FlowGraph = {
            ...g,
            blocks: [...g.blocks, { id: g.blocks.length, kind: 'code' }],
            edges: [...g.edges.filter((x) => x !== e), { from: e.from, to: g.blocks.length }, { from: g.blocks.length, to: e.to }],
          };
          expect(cyclomaticOf(split).strict).toBe(v);
          const added: FlowGraph = { ...g, edges: [...g.edges, { from: a % g.blocks.length, to: b % g.blocks.length }] };
          expect(cyclomaticOf(added).strict).toBe(v + 1);
        }),
        { numRuns: 300 },
      );
    });

    it('should give a disjoint union v = Σ v_i', () => {
      fc.assert(
        fc.property(graphsArbitrary, graphsArbitrary, (first, second) => {
          const graphs = [...first, ...second];
          const union = cyclomaticOf(disjointUnion(graphs));
          expect(union.components).toBe(graphs.length);
          expect(union.strict).toBe(graphs.reduce((sum, g) => sum + cyclomaticOf(g).strict, 0));
        }),
        { numRuns: 200 },
      );
    });
  });
});

describe('reportedCyclomatic', () => {
  const ONE: CountingSettings = { ...DEFAULT_SETTINGS, switch: 'one' };

  it('should subtract (cases − 1) per switch with at least one case under switch: one', () => {
    // ESLint 9 complexity `variant: "modified"` (reference-checks §8, VERIFIED-RUN): 3 cases + default → 2.
    expect(reportedCyclomatic(4, [3], ONE)).toBe(2);
    expect(reportedCyclomatic(7, [3, 0, 1, 2], ONE)).toBe(7 - 2 - 0 - 0 - 1);
  });

  it('should report the strict value under switch: cases', () => {
    expect(reportedCyclomatic(4, [3], DEFAULT_SETTINGS)).toBe(4);
  });
});
