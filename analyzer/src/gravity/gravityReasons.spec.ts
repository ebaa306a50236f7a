import { gravityReasons } from './gravityReasons';
import type { GravityFacts, LevelMedians } from './gravityScore';

const facts: GravityFacts = { callers: 0, callees: 2, callerClusters: 0, calleeClusters: 1, cohesion: 0.5, weight: 4, cyclomatic: 10, functions: 3, lines: 40 };
const zeroMedians: LevelMedians = { callers: 0, callees: 0, weight: 0, cyclomatic: 10, functions: 3, lines: 40 };

describe('gravityReasons', () => {
  it('should say plainly when the median module has none, instead of a ratio to zero', () => {
    const components = { callerClusters: 0, calleeClusters: 0, callers: 0, callees: 1, openness: 0, cyclomatic: 0, size: 0 };
    const points = { callerClusters: 0, calleeClusters: 0, callers: 0, callees: 10, openness: 0, cyclomatic: 0, size: 0 };
    expect(gravityReasons(facts, components, points, zeroMedians, 3)).toEqual(['calls 2 other modules, where the median module has none']);
  });
});
