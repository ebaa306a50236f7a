import { GRAVITY_WEIGHTS, gravityComponents, gravityOf, gravityPoints, MIN_OTHER_CLUSTERS, RATIO_CAP, type GravityFacts, type LevelMedians } from './gravityScore';

const medians: LevelMedians = { callers: 2, callees: 2, weight: 10, cyclomatic: 20, functions: 5, lines: 200 };
const quiet: GravityFacts = { callers: 0, callees: 0, callerClusters: 0, calleeClusters: 0, cohesion: 1, weight: 0, cyclomatic: 0, functions: 0, lines: 0 };

describe('gravity score', () => {
  it('should have weights that add up to 100, so a module at every cap scores 100', () => {
    expect(Object.values(GRAVITY_WEIGHTS).reduce((s, w) => s + w, 0)).toBe(100);
    const everywhere: GravityFacts = { callers: 99, callees: 99, callerClusters: 9, calleeClusters: 9, cohesion: 0, weight: 999, cyclomatic: 999, functions: 99, lines: 9999 };
    expect(gravityOf(gravityPoints(gravityComponents(everywhere, medians, 9)))).toBe(100);
    expect(gravityOf(gravityPoints(gravityComponents(quiet, medians, 9)))).toBe(0);
  });

  it('should divide cluster reach by the other clusters, but by at least MIN_OTHER_CLUSTERS', () => {
    expect(gravityComponents({ ...quiet, callerClusters: 1 }, medians, 1).callerClusters).toBe(1 / MIN_OTHER_CLUSTERS);
    expect(gravityComponents({ ...quiet, calleeClusters: 3 }, medians, 6).calleeClusters).toBe(0.5);
  });

  it('should scale ratios to RATIO_CAP× the median module, floor medians at 1 and cap at 1', () => {
    const c = gravityComponents({ ...quiet, callers: 4, callees: 3, cyclomatic: 200, functions: 10, lines: 100 }, { ...medians, callees: 0 }, 4);
    expect(c.callers).toBe(4 / 2 / RATIO_CAP);
    expect(c.callees).toBe(3 / 1 / RATIO_CAP);
    expect(c.cyclomatic).toBe(1);
    // Size takes the larger of functions (2×) and lines (0.5×).
    expect(c.size).toBe(2 / RATIO_CAP);
  });

  it('should scale openness down for a module lighter than the median module', () => {
    expect(gravityComponents({ ...quiet, cohesion: 0, weight: 2 }, medians, 4).openness).toBe(0.2);
    expect(gravityComponents({ ...quiet, cohesion: 0.25, weight: 30 }, medians, 4).openness).toBe(0.75);
  });
});
