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

/** Whole-snapshot sums; null until the analysis is ready. */
export interface SnapshotTotals {
  functions: number;
  cyclomatic: number;
  decisions: number;
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
