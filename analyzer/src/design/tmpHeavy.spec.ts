import fc from 'fast-check';
import { constructArbitrary, constructGraph, reachableCyclomatic, rewire } from '../testing/graphs';
import { designComplexity } from './designComplexity';
it('heavy', () => {
  const moves = fc.array(fc.tuple(fc.nat(), fc.nat()), { maxLength: 6 });
  fc.assert(
    fc.property(constructArbitrary(4), moves, fc.array(fc.nat(), { maxLength: 6 }), fc.nat(), (tree, move, picks, extra) => {
      const graph = rewire(constructGraph(tree), move);
      const n = graph.blocks.length;
      const calls = new Set(picks.map((p) => p % n));
      const iv = designComplexity(graph, calls);
      expect(iv).toBeGreaterThanOrEqual(1);
      expect(iv).toBeLessThanOrEqual(Math.max(1, reachableCyclomatic(graph)));
      expect(designComplexity(graph, new Set([...calls, extra % n]))).toBeGreaterThanOrEqual(iv);
    }),
    { numRuns: 200000 },
  );
}, 600000);
