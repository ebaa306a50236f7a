import fc from 'fast-check';
import { moduleEdge } from './fixtures/moduleMaps';
import { mergeModuleEdges } from './mergeModuleEdges';

const ids = ['file:a', 'file:b', 'file:c', 'file:d'];
const pairsOf = (m: ReturnType<typeof mergeModuleEdges>) => Array.from({ length: m.size }, (_, k) => [m.lo[k], m.hi[k], m.weight[k]]);

describe('mergeModuleEdges', () => {
  it('should add up a→b, b→a and repeats, drop self-loops, zero weights and other levels, and sort the pairs', () => {
    const edges = [
      moduleEdge('c', 'a', 2), moduleEdge('a', 'c', 3), moduleEdge('b', 'a', 1), moduleEdge('a', 'b', 1), moduleEdge('a', 'b', 4),
      moduleEdge('d', 'd', 9), moduleEdge('d', 'c', 0), moduleEdge('folder:x', 'folder:y', 5, 'folder'),
    ];
    expect(pairsOf(mergeModuleEdges(ids, edges, 'file'))).toEqual([[0, 1, 6], [0, 2, 5]]);
  });

  it('should give the same pairs as a plain map of sums, for hubs with many neighbours too', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.nat(39), fc.nat(39), fc.integer({ min: 0, max: 9 })), { maxLength: 300 }), (raw) => {
        const names = Array.from({ length: 40 }, (_, i) => `file:m${String(i).padStart(2, '0')}`);
        // Module 0 calls everyone: its bucket is large enough for the non-insertion sort.
        const edges = [...raw.map(([a, b, w]) => moduleEdge(names[a], names[b], w)), ...names.slice(1).reverse().map((to, i) => moduleEdge(names[0], to, 1 + (i % 3)))];
        const sums = new Map<string, number>();
        for (const e of edges) {
          const [a, b] = [names.indexOf(e.from), names.indexOf(e.to)].sort((x, y) => x - y);
          if (a !== b && e.weight > 0) sums.set(`${a},${b}`, (sums.get(`${a},${b}`) ?? 0) + e.weight);
        }
        const expected = [...sums].map(([key, w]) => [...key.split(',').map(Number), w]).sort((x, y) => x[0] - y[0] || x[1] - y[1]);
        expect(pairsOf(mergeModuleEdges(names, edges, 'file'))).toEqual(expected);
      }),
      { numRuns: 200 },
    );
  });
});
