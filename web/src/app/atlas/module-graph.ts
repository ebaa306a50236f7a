/** Shapes of `GET /api/snapshots/:id/module-graph` and `…/modules/:moduleId` (docs/openapi.yaml: ModuleGraph, Module). */

/** The three module levels of the map. */
export type ModuleLevel = 'file' | 'folder' | 'package';

/** Every level, finest first (the order of the level switch). */
export const MODULE_LEVELS: readonly ModuleLevel[] = ['file', 'folder', 'package'];

/** The level the map opens on when the URL names none (the API's default too). */
export const DEFAULT_LEVEL: ModuleLevel = 'folder';

/** What the map draws and lists of one module (a node of `GET …/module-graph`). */
export interface ModuleNode {
  id: string;
  path: string;
  name: string | null;
  /** P: functions (connected components). */
  functions: number;
  /** ΣV. */
  cyclomatic: number;
  /** Σπ. */
  decisions: number;
  cluster: string | null;
  gravityRank: number;
}

/** One module with all its figures (`GET /api/snapshots/:id/modules/:moduleId`). */
export interface ModuleRecord extends ModuleNode {
  level?: ModuleLevel;
  /** The largest V(G) of one function in the module. */
  maxCyclomatic: number;
  overLimit?: number;
  lines?: number;
  fanIn: number;
  fanOut: number;
  ca?: number;
  ce?: number;
  /** I = Ce/(Ca+Ce); null without couplings. */
  instability: number | null;
  /** S0. */
  designComplexity: number;
  /** S1 = S0 − n + 1. */
  integrationComplexity: number;
  unresolvedCalls?: number;
  externalCalls?: number;
  gravity: number;
  reasons: string[];
}

/** A weighted link between two modules: indexes into the answer's nodes, and call sites plus imports. */
export type MapLink = readonly [from: number, to: number, weight: number];

/** One Louvain cluster with its sums. */
export interface ModuleCluster {
  id: string;
  /** Member modules. */
  size: number;
  functions: number;
  cyclomatic: number;
  decisions: number;
  internalWeight: number;
  externalWeight: number;
}

/** `GET /api/snapshots/:id/module-graph` → 200. */
export interface ModuleGraph {
  level: ModuleLevel;
  nodes: ModuleNode[];
  links: MapLink[];
  clusters: ModuleCluster[];
}

/** The level named in a URL, or the default one for anything else. */
export function parseLevel(value: string | null | undefined): ModuleLevel {
  return MODULE_LEVELS.includes(value as ModuleLevel) ? (value as ModuleLevel) : DEFAULT_LEVEL;
}

/** How a module is named on the map and in lists. */
export function moduleLabel(module: Pick<ModuleNode, 'name' | 'path'>): string {
  return module.name || module.path;
}
