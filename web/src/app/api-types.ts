/** Response and error shapes of the Seamline REST API (`/api`), as the server sends them. */

/** A person's role in a workspace, from most to least powerful. */
export type Role = 'owner' | 'architect' | 'reviewer' | 'viewer';

/** Every role, for routes and navigation entries open to anyone signed in. */
export const ALL_ROLES: readonly Role[] = ['owner', 'architect', 'reviewer', 'viewer'];

/** The signed-in person. */
export interface User {
  id: string;
  email: string;
  displayName: string;
}

/** The workspace the session belongs to. */
export interface Workspace {
  id: string;
  slug: string;
  name: string;
}

/** `GET /api/me` → 200. */
export interface MeResponse {
  user: User;
  workspace: Workspace;
  role: Role;
}

/** Where a snapshot's analysis stands. */
export type SnapshotStatus = 'queued' | 'running' | 'ready' | 'failed';

/** Whole-snapshot sums; null until the analysis is ready (the optional ones need the call graph). */
export interface SnapshotTotals {
  functions: number;
  cyclomatic: number;
  decisions: number;
  files?: number;
  cyclomaticStrict?: number;
  overLimit?: number;
  loc?: number;
  modularity?: number;
  designComplexity?: number;
  integrationComplexity?: number;
}

/** The counting settings an analysis used (see docs/metrics.md). */
export interface CountingSettings {
  switch: 'cases' | 'one';
  optionalChaining: boolean;
  defaultValues: boolean;
  /** V(G) above this is over the limit (10 by default). */
  limit: number;
}

/** One analysed (or queued) version of a codebase. */
export interface Snapshot {
  id: string;
  status: SnapshotStatus;
  progress: number;
  error: string | null;
  commit: string | null;
  branch: string | null;
  createdAt: string;
  finishedAt: string | null;
  totals: SnapshotTotals | null;
  /** The fields below come with every snapshot the server sends; optional for older test data. */
  codebaseId?: string;
  /** What the analysis is doing while it runs (`extract`, `analyse`, `calls`, `store`…). */
  phase?: string | null;
  source?: 'upload' | 'push';
  attempts?: number;
  settings?: Partial<CountingSettings>;
  root?: string | null;
  filesScanned?: number | null;
  skippedFiles?: number | null;
  /** False for a snapshot made without the call graph: no modules, clusters or gravity. */
  hasModuleMap?: boolean;
}

/** `GET /api/snapshots/:id` → 200. */
export interface SnapshotResponse {
  snapshot: Snapshot;
}

/** A codebase with its snapshots, newest first. */
export interface Codebase {
  id: string;
  name: string;
  description: string;
  createdAt: string;
  snapshots: Snapshot[];
}

/** `GET /api/codebases` → 200. */
export interface CodebaseListResponse {
  items: Codebase[];
}

/** Body of every error response. */
export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    details?: unknown;
  };
}
