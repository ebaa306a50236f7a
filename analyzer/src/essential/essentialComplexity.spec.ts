import { constructGraph, flowGraph, reachableCyclomatic } from '../testing/graphs';
import type { Construct } from '../testing/graphs';
import { essentialComplexity } from './essentialComplexity';

const stmt: Construct = { t: 'stmt' };
const ev = (spec: string): number => essentialComplexity(flowGraph(spec)).essential;

describe('essentialComplexity', () => {
  describe('structured programs reduce to one node', () => {
    // McCabe 1976, IEEE TSE SE-2(4) (reference-checks 1.12) and NIST SP 500-235 §10.2 (2.8):
    // a program built only from structured constructs reduces completely, ev = 1.
    const cases: [string, Construct][] = [
      ['a straight sequence', { t: 'seq', items: [stmt, stmt, stmt] }],
      ['if-then', { t: 'if', then: stmt }],
      ['if-then-else', { t: 'ifElse', then: stmt, else: stmt }],
      ['while', { t: 'while', body: stmt }],
      ['do-while', { t: 'doWhile', body: stmt }],
      ['switch with default', { t: 'switch', cases: [stmt, stmt, stmt], default: stmt }],
      ['switch without default', { t: 'switch', cases: [stmt, stmt] }],
      ['if (a && b) x()', { t: 'compound', op: 'and', then: stmt }],
      ['if (a && b) x() else y()', { t: 'compound', op: 'and', then: stmt, else: stmt }],
      ['if (a || b) x() else y()', { t: 'compound', op: 'or', then: stmt, else: stmt }],
      ['nested loops and branches', {
        t: 'while',
        body: { t: 'seq', items: [{ t: 'doWhile', body: { t: 'ifElse', then: stmt, else: { t: 'while', body: stmt } } }, { t: 'if', then: stmt }] },
      }],
    ];
    it.each(cases)('%s has ev = 1', (_name, tree) => {
      const graph = constructGraph(tree);
      const result = essentialComplexity(graph);
      expect(result).toEqual({ essential: 1, reducedNodes: 1, reducedEdges: 0, irreducibleDecisions: [] });
    });

    it('should reduce the Pressman flow graph (a loop around an if-else-if) to ev = 1', () => {
      // Pressman, Software Engineering (reference-checks 4.1, edge list from memory): nodes 1, 2-3, 4-5,
      // 6, 7, 8, 9, 10, 11 renumbered 0..8; e = 11, n = 9, V = 4. The program is structured (DERIVED).
      const graph = flowGraph('0?1:8@while; 1?2:3; 2>7; 3?4:5; 4>6; 5>6; 6>7; 7>0');
      expect(graph.edges).toHaveLength(11);
      expect(graph.blocks).toHaveLength(9);
      expect(essentialComplexity(graph).essential).toBe(1);
    });

    it('should treat an empty if as a decision whose outcomes meet at once', () => {
      // `if (c) {}`: both outcomes are parallel edges to one node.
      expect(ev('0>1; 1?2:2; 2>3')).toBe(1);
    });
  });

  describe('unstructured control flow stays', () => {
    it('should give while (c1) { if (c2) break; body(); } ev = 3', () => {
      // reference-checks 2.9 (DERIVED from NIST SP 500-235 §10.2): v = 3, ev = 3.
      const graph = flowGraph('0>1; 1?2:4@while; 2?4:3; 3>1; 4>5');
      expect(reachableCyclomatic(graph)).toBe(3);
      expect(essentialComplexity(graph)).toEqual({ essential: 3, reducedNodes: 4, reducedEdges: 5, irreducibleDecisions: [0, 1] });
    });

    it('should keep an early return inside a loop above 1', () => {
      // product definition: an early return inside a loop leaves irreducible structure.
      expect(ev('0>1; 1?2:4@while; 2?6:3; 3>1; 4>5; 5>6')).toBeGreaterThan(1);
    });

    // McCabe 1976 (reference-checks 1.11, pattern list from memory): the four unstructured patterns.
    it('(a) branching out of a loop', () => {
      expect(ev('0>1; 1?2:5@while; 2>3; 3?5:4; 4>1; 5>6')).toBeGreaterThan(1);
    });

    it('(b) branching into a loop', () => {
      // 1 jumps either to the loop test 2 or into the middle of its body (4).
      expect(ev('0>1; 1?4:2; 2?3:5@while; 3>4; 4>2; 5>6')).toBeGreaterThan(1);
    });

    it('(c) branching into a decision', () => {
      // 1's then-part (2) jumps into the then-part (4) of the decision at 3.
      expect(ev('0>1; 1?2:3; 2>4; 3?4:5; 4>6; 5>6; 6>7')).toBeGreaterThan(1);
    });

    it('(d) branching out of a decision', () => {
      // From inside 1's else-part, the decision at 3 jumps past the join (5) to 6.
      expect(ev('0>1; 1?2:3; 2>5; 3?6:4; 4>5; 5>6; 6>7')).toBeGreaterThan(1);
    });
  });

  describe('compound predicates', () => {
    it('should reduce if (a && b) x(); else y(); but not the same shape made of two ifs', () => {
      // NIST SP 500-235 treats a compound predicate as one structured condition (from memory);
      // without the operator the shape is "branching out of a decision" (reference-checks 1.11).
      expect(ev('0>1; 1?2:4@and; 2?3:4; 3>5; 4>5; 5>6')).toBe(1);
      expect(ev('0>1; 1?2:4; 2?3:4; 3>5; 4>5; 5>6')).toBe(3);
    });

    it('should reduce while (c1 && !c2) body(), whose graph matches the break example', () => {
      expect(ev('0>1; 1?2:4@and; 2?4:3@while; 3>1; 4>5')).toBe(1);
    });

    it('should reduce (a && b) || c and a && (b || c) chains', () => {
      expect(ev('0>1; 1?2:3@and; 2?4:3@or; 3?4:5; 4>6; 5>6; 6>7')).toBe(1);
      expect(ev('0>1; 1?2:5@and; 2?4:3@or; 3?4:5; 4>6; 5>6; 6>7')).toBe(1);
    });

    it('should still see the break when the if has a compound condition', () => {
      // while (c1) { if (a && b) break; body(); } — reference-checks 2.9 with a two-part condition.
      expect(ev('0>1; 1?2:5@while; 2?3:4@and; 3?5:4; 4>1; 5>6')).toBe(3);
    });
  });

  describe('switch', () => {
    it('should reduce labels sharing one body (case 1: case 2: body)', () => {
      expect(ev('0>1; 1?3:2@case; 2?3:4@case; 3>4; 4>5')).toBe(1);
    });

    it('should reduce shared labels when an empty block sits before the body', () => {
      const graph = flowGraph('0>1; 1?6:2@case; 6>3; 2?3:4@case; 3>4; 4>5', { exit: 5 });
      delete graph.blocks[6].span;
      expect(essentialComplexity(graph).essential).toBe(1);
    });

    it('should keep a case body falling through into the next body irreducible', () => {
      // case 1: a(); case 2: b(); break; — the first body jumps into another branch.
      const result = essentialComplexity(flowGraph('0>1; 1?2:3@case; 2>4; 3?4:5@case; 4>5; 5>6'));
      expect(result.essential).toBe(3);
      expect(result.irreducibleDecisions).toEqual([0, 1]);
    });
  });

  describe('dead code and bounds', () => {
    it('should ignore unstructured blocks the entry never reaches', () => {
      // Blocks 3..5 are dead: a loop with a jump out of it.
      const graph = flowGraph('0>1; 1>6; 3?4:6@while; 4?6:5; 5>3; 2>6', { exit: 6 });
      expect(essentialComplexity(graph).essential).toBe(1);
    });

    it('should stay within 1 ≤ ev ≤ V when dead code holds decisions', () => {
      const graph = flowGraph('0>1; 1?2:5@while; 2?5:3; 3>1; 4?1:2; 5>6');
      const v = graph.edges.length - graph.blocks.length + 2;
      const { essential } = essentialComplexity(graph);
      expect(essential).toBe(3);
      expect(essential).toBeLessThanOrEqual(v);
    });

    it('should give a function that never returns ev = 1', () => {
      // for (;;) { while (c1) { if (c2) break; body(); } } — no edge to the exit at all.
      const graph = flowGraph('0>1; 1?2:4@while; 2?4:3; 3>1; 4>1', { exit: 5 });
      graph.blocks.push({ id: 5, kind: 'exit' });
      expect(essentialComplexity(graph)).toEqual({ essential: 1, reducedNodes: 1, reducedEdges: 0, irreducibleDecisions: [] });
    });

    it('should treat an endless loop as an end of the function', () => {
      // while (c1) { if (c2) { for (;;) {} } body(); } — the endless loop ends the function like a
      // return would: a branch out of the while loop (reference-checks 2.9), ev = 3 ≤ V = 3.
      const graph = flowGraph('0>1; 1?2:5@while; 2?3:4; 3>6; 6>3; 4>1; 5>7');
      expect(graph.edges.length - graph.blocks.length + 2).toBe(3);
      expect(essentialComplexity(graph).essential).toBe(3);
    });

    it('should refuse a graph whose edges name missing blocks', () => {
      const graph = flowGraph('0>1; 1>2');
      graph.edges.push({ from: 1, to: 9 });
      expect(() => essentialComplexity(graph)).toThrow(/^analyzer\/essential: edge target 9/);
      expect(() => essentialComplexity({ ...flowGraph('0>1'), entry: -1 })).toThrow(RangeError);
    });
  });
});
