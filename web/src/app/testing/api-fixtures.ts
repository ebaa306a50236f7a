import type { ApiErrorBody, Codebase, MeResponse, Role, Snapshot } from '../api-types';

/** Test data only: invented people and codebases of Otterbay Parcel Co. */

/** A `GET /api/me` answer for Ada with the given role. */
export function meResponse(role: Role = 'architect'): MeResponse {
  return {
    user: { id: 'u-1', email: 'ada@otterbay.example', displayName: 'Ada Lovelace' },
    workspace: { id: 'w-1', slug: 'otterbay', name: 'Otterbay Parcel Co.' },
    role,
  };
}

/** A ready snapshot; override any field. */
export function snapshot(overrides: Partial<Snapshot> = {}): Snapshot {
  return {
    id: 's-1',
    status: 'ready',
    progress: 100,
    error: null,
    commit: 'abc1234def5678',
    branch: 'main',
    createdAt: '2026-11-28T12:00:00Z',
    finishedAt: '2026-11-28T12:03:00Z',
    totals: { functions: 412, cyclomatic: 1290, decisions: 878 },
    ...overrides,
  };
}

/** A codebase with the given snapshots (newest first). */
export function codebase(name: string, snapshots: Snapshot[], id = name): Codebase {
  return { id, name, description: '', createdAt: '2026-11-01T09:00:00Z', snapshots };
}

/** The body of an API error. */
export function errorBody(code: string, message: string): ApiErrorBody {
  return { error: { code, message } };
}

/** The 401 the API answers without a session. */
export const UNAUTHENTICATED = {
  status: 401,
  statusText: 'Unauthorized',
} as const;

