import fc from 'fast-check';
import { clusterModules } from '../clusters/clusterModules';
import { moduleEdge, moduleRecord } from '../clusters/fixtures/moduleMaps';
import { DEFAULT_MAP_SETTINGS } from '../model';
import { bigIsolated, plantedHub, separateClusters, workedExample, type GravityMap } from './fixtures/gravityMaps';
import { GravityInputError } from './GravityInputError';
import { STRONG_CANDIDATE } from './gravityScore';
import { rankGravity, type GravityResult } from './rankGravity';

const rank = (map: GravityMap) => rankGravity(map.modules, map.edges, map.assignment, 'file');
const byRank = (result: Map<string, GravityResult>) => [...result].sort((a, b) => a[1].rank - b[1].rank).map(([id]) => id);
const CALM = /^(keeps \d+ % of its call weight in its cluster|no calls to or from other modules at this level)$/;

describe('rankGravity', () => {
  // Worked by hand in docs/metrics/gravity.md ("Worked example"): medians ΣV 7.5, functions 3,
  // lines 85, callers 1, callees 1, weight 4.5; 4 other active clusters.
  it('should score the worked example as computed by hand', () => {
    const result = rank(workedExample());
    expect(result.get('file:core.ts')).toEqual({
      gravity: 85.6, // 25 + 7.5 + 15 + 6 + 7.14 + 15 + 10
      rank: 1,
      reasons: [
        'called from 4 of 4 other clusters',
        'called by 5 other modules, 5× the median module',
        'ΣV 60, 8× the median module',
        '20 functions, 900 lines',
        'calls into 2 of 4 other clusters',
        'only 29 % of its call weight stays in its cluster',
        'calls 3 other modules, 3× the median module',
      ],
      spread: 4,
      cohesion: 4 / 14,
    });
    // 6.25 + 3.75 + 6 + 2 + 4.29 + 3.6 + 2.59
    expect(result.get('file:users.ts')).toMatchObject({ gravity: 28.5, reasons: ['called by 2 other modules, 2× the median module', 'only 57 % of its call weight stays in its cluster'] });
    // 0 + 0 + 3 + 2 + 0 + 3.2 + 2.12: everything stays inside cluster A.
    expect(result.get('file:routes.ts')).toMatchObject({ gravity: 10.3, reasons: ['keeps 100 % of its call weight in its cluster'], spread: 0, cohesion: 1 });
  });

  it('should rank a planted god module first, with the reasons that make it one', () => {
    const result = rank(plantedHub(6));
    expect(byRank(result)[0]).toBe('file:dispatch-core.ts');
    const core = result.get('file:dispatch-core.ts')!;
    expect(core.gravity).toBeGreaterThanOrEqual(STRONG_CANDIDATE);
    // The fixture: every one of the 6 feature clusters calls it; it calls into features 1–5.
    expect(core.reasons).toEqual(expect.arrayContaining(['called from 6 of 6 other clusters', 'calls into 5 of 6 other clusters', '40 functions, 1,900 lines']));
    expect(core.reasons.some((r) => /^ΣV 140, \d+× the median module$/.test(r))).toBe(true);
    expect(core.spread).toBe(6);
    for (const [id, g] of result) if (id !== 'file:dispatch-core.ts') expect(g.gravity).toBeLessThan(STRONG_CANDIDATE);
  });

  it('should still rank the planted god module first with the clusters Louvain finds', () => {
    const map = plantedHub(8);
    const { assignment } = clusterModules(map.modules, map.edges, 'file', DEFAULT_MAP_SETTINGS);
    expect(byRank(rankGravity(map.modules, map.edges, assignment, 'file'))[0]).toBe('file:dispatch-core.ts');
  });

  it('should find no strong candidate and say nothing alarming in a map of well-separated clusters', () => {
    const map = separateClusters();
    for (const assignment of [map.assignment, clusterModules(map.modules, map.edges, 'file', DEFAULT_MAP_SETTINGS).assignment]) {
      for (const g of rankGravity(map.modules, map.edges, assignment, 'file').values()) {
        expect(g.gravity).toBeLessThan(STRONG_CANDIDATE);
        for (const reason of g.reasons) expect(reason).toMatch(CALM);
      }
    }
  });

  it('should not rank a big isolated module first when a moderate hub exists', () => {
    const map = bigIsolated();
    const result = rank(map);
    const sizes = map.modules.map((m) => m.cyclomatic);
    expect(map.modules.find((m) => m.path === 'legacy/report.ts')!.cyclomatic).toBe(Math.max(...sizes));
    expect(byRank(result)[0]).toBe('file:shared/events.ts');
    expect(result.get('file:legacy/report.ts')!.rank).toBeGreaterThan(1);
    // Its one caller in another cluster does not change that.
    const moved = new Map(map.assignment).set('file:legacy/report.ts', 'shared');
    expect(byRank(rankGravity(map.modules, map.edges, moved, 'file'))[0]).toBe('file:shared/events.ts');
  });

  it('should break ties by path and give ranks 1..n', () => {
    const modules = ['b.ts', 'a.ts', 'c.ts'].map((p) => moduleRecord(p));
    const result = rankGravity(modules, [], new Map(), 'file');
    expect(byRank(result)).toEqual(['file:a.ts', 'file:b.ts', 'file:c.ts']);
    expect([...result.values()].map((g) => g.reasons)).toEqual([0, 1, 2].map(() => ['no calls to or from other modules at this level']));
  });

  it('should only score the given level and refuse edges to unknown modules', () => {
    const map = workedExample();
    const folder = moduleRecord('src', { cyclomatic: 500 }, 'folder');
    expect(rankGravity([...map.modules, folder], map.edges, map.assignment, 'file').has('folder:src')).toBe(false);
    expect(() => rankGravity(map.modules, [...map.edges, moduleEdge('api.ts', 'nowhere.ts')], map.assignment, 'file')).toThrow(GravityInputError);
    expect(() => rankGravity([...map.modules, map.modules[0]], map.edges, map.assignment, 'file')).toThrow(/analyzer\/gravity: .*listed twice/);
  });

  it('should give the same result whatever the order of modules and edges', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 20 }).chain((n) =>
        fc.record({
          sizes: fc.array(fc.integer({ min: 1, max: 200 }), { minLength: n, maxLength: n }),
          clusterOf: fc.array(fc.nat(4), { minLength: n, maxLength: n }),
          raw: fc.array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1), fc.integer({ min: 0, max: 5 })), { maxLength: 50 }),
          order: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: n + 50, maxLength: n + 50 }),
        }),
      ), ({ sizes, clusterOf, raw, order }) => {
        const modules = sizes.map((v, i) => moduleRecord(`m${i}.ts`, { cyclomatic: v, functions: 1 + (v % 7), lines: 10 * v }));
        const edges = raw.map(([a, b, w]) => moduleEdge(modules[a].id, modules[b].id, w));
        const assignment = new Map(modules.map((m, i) => [m.id, `k${clusterOf[i]}`]));
        const result = rankGravity(modules, edges, assignment, 'file');

        const shuffle = <T>(xs: T[], offset: number) => xs.map((x, i) => [order[offset + i], x] as const).sort((p, q) => p[0] - q[0]).map(([, x]) => x);
        expect(rankGravity(shuffle(modules, 0), shuffle(edges, sizes.length), assignment, 'file')).toEqual(result);

        const ranked = byRank(result).map((id) => result.get(id)!);
        expect(ranked.map((g) => g.rank)).toEqual(modules.map((_, i) => i + 1));
        for (let i = 1; i < ranked.length; i++) expect(ranked[i - 1].gravity).toBeGreaterThanOrEqual(ranked[i].gravity);
        for (const g of ranked) {
          expect(g.gravity).toBeGreaterThanOrEqual(0);
          expect(g.gravity).toBeLessThanOrEqual(100);
          expect(g.reasons.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 300 },
    );
  });
});
