import type { CountingSettings } from './CountingSettings';
import type { FunctionRecord } from './FunctionRecord';
import type { CallEdge, ClusterRecord, ExternalPackageCalls, ImportEdge, MapSettings, ModuleEdge, ModuleRecord } from './ModuleMap';

export const SNAPSHOT_SCHEMA = 'seamline/snapshot@1';

/** A file the scan did not analyse, and why. */
export interface SkippedFile {
  file: string;
  reason: 'declaration' | 'node_modules' | 'generated' | 'minified' | 'syntax-error' | 'too-large' | 'analysis-failed';
  /** Human detail: the syntax error and its line, the marker found, the failure. */
  detail?: string;
}

/** Sums over every function of the snapshot; ΣV beside Σ decisions and P shows what decomposition does. */
export interface SnapshotTotals {
  files: number;
  /** P: number of function units (each is one connected component). */
  functions: number;
  /** ΣV as reported under the counting settings. */
  cyclomatic: number;
  /** Σ E − N + 2P of the graphs. */
  cyclomaticStrict: number;
  /** Σ decisions counted on the syntax tree. */
  decisions: number;
  /** Functions whose reported V(G) is above the limit. */
  overLimit: number;
  loc: number;
  /** Modularity Q of the file-level clustering (with the call graph). */
  modularity?: number;
  /** S0 = Σ iv(G) over all functions (with the call graph). */
  designComplexity?: number;
  /** S1 = S0 − n + 1 over all functions (with the call graph). */
  integrationComplexity?: number;
}

/** The snapshot file `seamline scan` writes (JSON Schema: docs/snapshot.schema.json). */
export interface Snapshot {
  schema: typeof SNAPSHOT_SCHEMA;
  generator: { name: 'seamline'; version: string };
  createdAt: string;
  /** The scanned folder's name (never an absolute path). */
  root: string;
  settings: CountingSettings;
  files: { scanned: number; skipped: SkippedFile[] };
  functions: FunctionRecord[];
  totals: SnapshotTotals;
  /** Present when a coverage report was imported: which report format, and files it named that the scan did not find. */
  coverage?: { format: 'lcov' | 'istanbul'; unmatchedFiles: string[] };
  /** The module map's settings (with the call graph). */
  mapSettings?: MapSettings;
  calls?: CallEdge[];
  imports?: ImportEdge[];
  externals?: ExternalPackageCalls[];
  modules?: ModuleRecord[];
  moduleEdges?: ModuleEdge[];
  clusters?: ClusterRecord[];
}
