/** Shapes of the Functions screen's API answers (see docs/openapi.yaml: FunctionPage, Cluster). */

/** The V(G) bands, in order: calm 1–10, busy 11–20, tangled 21–50, knotted > 50. */
export const SEVERITY_BANDS = ['calm', 'busy', 'tangled', 'knotted'] as const;

/** One V(G) band. */
export type SeverityBand = (typeof SEVERITY_BANDS)[number];

/** Columns the server can sort the functions by. */
export const SORTABLE_COLUMNS = [
  'cyclomatic',
  'essential',
  'decisions',
  'loc',
  'name',
  'file',
  'line',
  'crap',
  'untestedPaths',
  'coverage',
  'designComplexity',
  'nodes',
] as const;

/** A column the server can sort by. */
export type SortColumn = (typeof SORTABLE_COLUMNS)[number];

/** Sort direction. */
export type SortOrder = 'asc' | 'desc';

/** One function's figures, as `GET /api/snapshots/:id/functions` sends them. */
export interface FunctionRow {
  id: string;
  name: string;
  qualifiedName: string;
  kind: string;
  file: string;
  folder: string | null;
  package: string | null;
  /** File-level cluster id, or null without a module map. */
  cluster: string | null;
  line: number;
  endLine: number;
  loc: number;
  /** V(G) as reported under the counting settings. */
  cyclomatic: number;
  cyclomaticStrict: number;
  /** π, counted on the syntax tree. */
  decisions: number;
  nodes: number;
  edges: number;
  /** ev(G). */
  essential: number;
  /** iv(G). */
  designComplexity: number | null;
  fingerprint: string;
  unresolvedCalls: number;
  externalCalls: number;
  band: SeverityBand;
  overLimit: boolean;
  outcomesCovered: number | null;
  outcomesTotal: number | null;
  actualComplexity: number | null;
  untestedPaths: number | null;
  crap: number | null;
}

/** `GET /api/snapshots/:id/functions` → 200: one page and the snapshot's limit. */
export interface FunctionPage {
  items: FunctionRow[];
  total: number;
  page: number;
  pageSize: number;
  sort: SortColumn;
  order: SortOrder;
  /** V(G) above this is over the limit. */
  limit: number;
}

/** Filters of the functions list (no sort or page). */
export interface FunctionFilter {
  /** Text found in the qualified name or the file. */
  q?: string;
  /** Module id, e.g. `folder:src/orders` or `file:src/orders/order.ts`. */
  module?: string;
  /** File-level cluster id. */
  cluster?: string;
  band?: SeverityBand;
  /** true: only over the limit; false: only within it. */
  overLimit?: boolean;
}

/** Everything the functions list is asked for: filters, sort and page. */
export interface FunctionQuery extends FunctionFilter {
  sort: SortColumn;
  order: SortOrder;
  /** 1-based. */
  page: number;
  pageSize: number;
}

/** Module levels of the module map. */
export type ModuleLevel = 'file' | 'folder' | 'package';

/** The part of a module the filter needs (`GET /api/snapshots/:id/modules`). */
export interface ModuleOption {
  id: string;
  level: ModuleLevel;
  path: string;
  functions: number;
}

/** `GET /api/snapshots/:id/modules?level=…` → 200. */
export interface ModuleListResponse {
  level: ModuleLevel;
  items: ModuleOption[];
}

/** One Louvain cluster of files (`GET /api/snapshots/:id/clusters?level=file`). */
export interface ClusterSummary {
  id: string;
  /** Module ids of its files, e.g. `file:src/orders/order.ts`. */
  members: string[];
  functions: number;
  cyclomatic: number;
}

/** `GET /api/snapshots/:id/clusters?level=file` → 200 (the part the filter needs). */
export interface ClusterListResponse {
  items: ClusterSummary[];
}

/** The coverage report imported into a snapshot, as the snapshot summary carries it. */
export interface SnapshotCoverage {
  format: string;
  unmatchedFiles?: string[];
}
