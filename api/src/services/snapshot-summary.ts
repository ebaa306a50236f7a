import type { Snapshot, SnapshotSource, SnapshotStatus, SnapshotTotals } from '../db/entities';

/** A snapshot as the API shows it: its state while it runs, its headline figures once ready. */
export interface SnapshotSummary {
  id: string;
  codebaseId: string;
  status: SnapshotStatus;
  phase: string | null;
  progress: number;
  error: string | null;
  source: SnapshotSource;
  attempts: number;
  commit: string | null;
  branch: string | null;
  createdAt: string;
  finishedAt: string | null;
  settings: Record<string, unknown>;
  totals: SnapshotTotals | null;
  root: string | null;
  filesScanned: number | null;
  skippedFiles: number | null;
  hasModuleMap: boolean;
  coverage: Record<string, unknown> | null;
}

export function toSnapshotSummary(s: Snapshot): SnapshotSummary {
  return {
    id: s.id,
    codebaseId: s.codebaseId,
    status: s.status,
    phase: s.phase,
    progress: s.progress,
    error: s.error,
    source: s.source,
    attempts: s.attempts,
    commit: s.commit,
    branch: s.branch,
    createdAt: s.createdAt.toISOString(),
    finishedAt: s.finishedAt?.toISOString() ?? null,
    settings: s.settings,
    totals: s.totals,
    root: s.root,
    filesScanned: s.filesScanned,
    skippedFiles: s.skipped ? s.skipped.length : null,
    hasModuleMap: s.mapSettings !== null,
    coverage: s.coverage,
  };
}
