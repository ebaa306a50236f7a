import type { ModuleGraph, ModuleRecord } from './module-graph';

/** Test data only: invented modules of Otterbay Parcel Co.'s dispatch monolith. */

/** A folder module; override any field. */
export function moduleRecord(path: string, overrides: Partial<ModuleRecord> = {}): ModuleRecord {
  return {
    id: `folder:${path}`,
    level: 'folder',
    path,
    name: null,
    functions: 10,
    cyclomatic: 20,
    decisions: 10,
    maxCyclomatic: 5,
    fanIn: 1,
    fanOut: 1,
    instability: 0.5,
    designComplexity: 12,
    integrationComplexity: 3,
    cluster: 'c1',
    gravity: 10,
    gravityRank: 3,
    reasons: [],
    ...overrides,
  };
}

/** Four folders in two clusters: dispatch-core (the heavy one), routing, billing, shared. */
export function demoModuleGraph(): ModuleGraph {
  return {
    level: 'folder',
    nodes: [
      moduleRecord('src/routing', { cyclomatic: 100, cluster: 'c1', gravity: 30, gravityRank: 2 }),
      moduleRecord('src/dispatch-core', {
        functions: 99,
        cyclomatic: 400,
        decisions: 204,
        maxCyclomatic: 41,
        designComplexity: 220,
        integrationComplexity: 122,
        fanIn: 33,
        fanOut: 120,
        instability: 0.47,
        cluster: 'c1',
        gravity: 79.5,
        gravityRank: 1,
        reasons: ['called from 3 of 3 other clusters', 'ΣV 303, 15× the median module'],
      }),
      moduleRecord('src/billing', { cyclomatic: 100, cluster: 'c2', gravity: 20, gravityRank: 4 }),
      moduleRecord('src/shared', { cyclomatic: 4, cluster: null, gravity: 5, gravityRank: 5, instability: null }),
    ],
    edges: [
      { from: 'folder:src/routing', to: 'folder:src/dispatch-core', weight: 40, calls: 30, imports: 10 },
      { from: 'folder:src/dispatch-core', to: 'folder:src/billing', weight: 10, calls: 8, imports: 2 },
      { from: 'folder:src/billing', to: 'folder:src/shared', weight: 2, calls: 1, imports: 1 },
      // Left out: a self-loop and a link to a module that is not in the answer.
      { from: 'folder:src/shared', to: 'folder:src/shared', weight: 9, calls: 9, imports: 0 },
      { from: 'folder:src/shared', to: 'folder:src/gone', weight: 9, calls: 9, imports: 0 },
    ],
    clusters: [
      { id: 'c2', members: ['folder:src/billing'], functions: 10, cyclomatic: 100, decisions: 10, internalWeight: 0, externalWeight: 12 },
      {
        id: 'c1',
        members: ['folder:src/routing', 'folder:src/dispatch-core'],
        functions: 109,
        cyclomatic: 500,
        decisions: 214,
        internalWeight: 40,
        externalWeight: 10,
      },
    ],
  };
}
