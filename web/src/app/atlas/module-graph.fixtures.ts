import type { ModuleGraph, ModuleNode, ModuleRecord } from './module-graph';

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

/** What the map answer carries of a module record. */
export function moduleNode(record: ModuleRecord): ModuleNode {
  const { id, path, name, functions, cyclomatic, decisions, cluster, gravityRank } = record;
  return { id, path, name, functions, cyclomatic, decisions, cluster, gravityRank };
}

/** The four folders of `demoModuleGraph` with all their figures (what `…/modules/:moduleId` answers). */
export function demoModuleRecords(): ModuleRecord[] {
  return [
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
  ];
}

/** Four folders in two clusters: dispatch-core (the heavy one), routing, billing, shared. */
export function demoModuleGraph(): ModuleGraph {
  return {
    level: 'folder',
    // routing 0, dispatch-core 1, billing 2, shared 3
    nodes: demoModuleRecords().map(moduleNode),
    links: [
      [0, 1, 40],
      [1, 2, 10],
      [2, 3, 2],
      // Left out: a self-loop and a link to a node that is not in the answer.
      [3, 3, 9],
      [3, 7, 9],
    ],
    clusters: [
      { id: 'c2', size: 1, functions: 10, cyclomatic: 100, decisions: 10, internalWeight: 0, externalWeight: 12 },
      { id: 'c1', size: 2, functions: 109, cyclomatic: 500, decisions: 214, internalWeight: 40, externalWeight: 10 },
    ],
  };
}
