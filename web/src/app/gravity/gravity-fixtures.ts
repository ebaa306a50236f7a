import type { GravityModule, GravityTrendPoint } from './gravity-types';

/** Test data only: an invented module of the Otterbay dispatch monolith; override any field. */
export function gravityModule(overrides: Partial<GravityModule> = {}): GravityModule {
  return {
    id: 'folder:src/dispatch-core',
    level: 'folder',
    path: 'src/dispatch-core',
    name: null,
    functions: 99,
    cyclomatic: 303,
    decisions: 204,
    maxCyclomatic: 41,
    overLimit: 5,
    lines: 774,
    fanIn: 33,
    fanOut: 120,
    ca: 8,
    ce: 7,
    instability: 0.4666666666666667,
    designComplexity: 220,
    integrationComplexity: 122,
    cluster: 'c1',
    gravity: 79.5,
    gravityRank: 1,
    reasons: ['called from 3 of 3 other clusters', 'ΣV 303, 15× the median module'],
    trend: [{ snapshotId: 's-1', createdAt: null, gravity: 79.5 }],
    ...overrides,
  };
}

/** A trend from earlier gravities (null: the module was absent) ending with `current` in view. */
export function trend(earlier: (number | null)[], current: number): GravityTrendPoint[] {
  return [
    ...earlier.map((gravity, i) => ({ snapshotId: `s-old-${i}`, createdAt: `2026-11-0${i + 1}T10:00:00Z`, gravity })),
    { snapshotId: 's-1', createdAt: null, gravity: current },
  ];
}
