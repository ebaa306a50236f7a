import fc from 'fast-check';
import type { FlowGraph } from '../model';
import { actualComplexity } from './actualComplexity';
import { testGraph } from './testGraph';

const v = (g: FlowGraph) => g.edges.length - g.blocks.length + 2;

// if-else followed by a while loop: V = 3 (McCabe 1976: V = decisions + 1 for a structured graph).
const IF_THEN_LOOP = testGraph('0>1; 1?2:3 if 2:1-2:5; 2>4; 3>4; 4?5:6 while 5:1-5:5; 5>4; 6>7');

describe('actualComplexity', () => {
  it('is V(G) when every outcome ran (McCabe 1976: V = e − n + 2)', () => {
    expect(actualComplexity(IF_THEN_LOOP, [[true, true], [true, true]], true)).toBe(v(IF_THEN_LOOP));
    expect(v(IF_THEN_LOOP)).toBe(3);
  });

  it('counts one path per decision covered both ways, plus one', () => {
    expect(actualComplexity(IF_THEN_LOOP, [[true, false], [true, true]], true)).toBe(2);
    expect(actualComplexity(IF_THEN_LOOP, [[true, true], [false, true]], true)).toBe(2);
    expect(actualComplexity(IF_THEN_LOOP, [[false, true], [false, true]], true)).toBe(1);
  });

  it('ignores outcomes behind an outcome that never ran', () => {
    // The loop is only reached through the if; with neither if outcome covered nothing beyond it counts.
    expect(actualComplexity(IF_THEN_LOOP, [[false, false], [true, true]], true)).toBe(1);
  });

  it('gives 0 for a unit that never ran and at least 1 for one that did', () => {
    expect(actualComplexity(IF_THEN_LOOP, [[false, false], [false, false]], false)).toBe(0);
    expect(actualComplexity(IF_THEN_LOOP, [[false, false], [false, false]], true)).toBe(1);
  });

  it('adds no virtual edge when the exit was not reached', () => {
    // A loop whose body ran but whose exit was never seen: one cycle, no way out → 1 path.
    const loop = testGraph('0>1; 1?2:3 while 2:1-2:5; 2>1');
    expect(actualComplexity(loop, [[true, false]], true)).toBe(1);
  });

  it('stays within 0…V and grows with the covered outcomes (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.boolean(), fc.boolean()), { minLength: 2, maxLength: 2 }), fc.boolean(), (outcomes, more) => {
        const ac = actualComplexity(IF_THEN_LOOP, outcomes, true);
        expect(ac).toBeGreaterThanOrEqual(1);
        expect(ac).toBeLessThanOrEqual(v(IF_THEN_LOOP));
        const widened = outcomes.map(([t, f], i) => (i === 0 ? [t || more, f] : [t, f || more]) as [boolean, boolean]);
        expect(actualComplexity(IF_THEN_LOOP, widened, true)).toBeGreaterThanOrEqual(ac);
      }),
      { numRuns: 300 },
    );
  });
});
