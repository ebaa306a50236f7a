/**
 * The architecture-level half of a snapshot: calls between functions, modules at three levels,
 * the edges between modules, clusters and gravity. All optional in a snapshot (additive to
 * `seamline/snapshot@1`): a scan with `--no-calls` has functions only.
 */

/** How a function reaches another. */
export type CallKind = 'call' | 'new' | 'reference';

/** Calls from one function unit to another (ids of FunctionRecord), merged per kind and certainty. */
export interface CallEdge {
  from: string;
  to: string;
  /** How many call sites. */
  count: number;
  kind: CallKind;
  /** False for dispatch through an interface or an abstract method (one edge per implementation). */
  certain: boolean;
}

/** An import of one scanned file by another (module edges count imports beside calls). */
export interface ImportEdge {
  from: string;
  to: string;
}

/** Calls into one external package (node_modules), summed over the codebase. */
export interface ExternalPackageCalls {
  package: string;
  calls: number;
}

export type ModuleLevel = 'file' | 'folder' | 'package';

/** One module at one level, with its aggregated metrics (see docs/metrics/modules.md). */
export interface ModuleRecord {
  /** `<level>:<path>`, e.g. `folder:src/orders`. */
  id: string;
  /** Posix path relative to the scanned root: a file, a folder, or a package's folder. */
  path: string;
  level: ModuleLevel;
  /** For packages: the package name from its package.json. */
  name?: string;
  /** P: function units in the module (each a connected component). */
  functions: number;
  /** ΣV over its functions, as reported. */
  cyclomatic: number;
  /** Σ decisions over its functions. */
  decisions: number;
  /** Σ N and Σ E over its functions' graphs; ΣV(strict) = E − N + 2P. */
  nodes: number;
  edges: number;
  maxCyclomatic: number;
  overLimit: number;
  lines: number;
  /** Call sites from functions in other modules into this one / from this one to others. */
  fanIn: number;
  fanOut: number;
  /** Martin's afferent / efferent coupling: distinct other modules depending on it / it depends on. */
  ca: number;
  ce: number;
  /** I = Ce / (Ca + Ce); null for a module with no coupling at all (0/0). */
  instability: number | null;
  /** Abstract classes and interfaces over all classes and interfaces; null when it has none. */
  abstractness: number | null;
  /** S0 = Σ iv(G) over its functions (McCabe & Butler 1989). */
  designComplexity: number;
  /** S1 = S0 − n + 1, n = its functions. */
  integrationComplexity: number;
  unresolvedCalls: number;
  externalCalls: number;
  /** The cluster (id) the module falls in at its level; null when not clustered. */
  cluster: string | null;
  /** God-module score, 0–100 (see docs/metrics/gravity.md). */
  gravity: number;
  /** 1 = the strongest god-module candidate at its level. */
  gravityRank: number;
  /** The gravity score's reasons, in words. */
  reasons: string[];
}

/** Calls and imports between two modules of one level. */
export interface ModuleEdge {
  level: ModuleLevel;
  from: string;
  to: string;
  /** Call sites plus imports: what clustering and the map weigh. */
  weight: number;
  calls: number;
  imports: number;
}

/** A candidate service boundary: modules Louvain grouped together at one level. */
export interface ClusterRecord {
  id: string;
  level: ModuleLevel;
  /** Module ids. */
  members: string[];
  functions: number;
  cyclomatic: number;
  decisions: number;
  /** Edge weight between members / between members and other clusters. */
  internalWeight: number;
  externalWeight: number;
}

/** Settings of the module map, carried by the snapshot so results can be reproduced. */
export interface MapSettings {
  /** Folder modules are the first `folderDepth` folders of each file's path. */
  folderDepth: number;
  /** Louvain resolution (1 = classic modularity). */
  resolution: number;
  /** Seed of Louvain's random order, so a snapshot always gives the same clusters. */
  seed: string;
}

export const DEFAULT_MAP_SETTINGS: Readonly<MapSettings> = Object.freeze({ folderDepth: 2, resolution: 1, seed: 'seamline' });
