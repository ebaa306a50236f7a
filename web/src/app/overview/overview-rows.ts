import type { Codebase, Snapshot } from '../api-types';

/** One table row: a snapshot of a codebase, or a codebase that has no snapshot yet. */
export interface OverviewRow {
  /** Unique per row, for tracking. */
  key: string;
  /** Name of the codebase the row belongs to. */
  codebaseName: string;
  /** Whether this is the codebase's first (newest) row; later rows belong to the same codebase. */
  isFirstOfCodebase: boolean;
  /** The snapshot, or null when the codebase has none yet. */
  snapshot: Snapshot | null;
}

/** Flattens codebases into rows, one per snapshot (newest first), keeping the server's order. */
export function overviewRows(codebases: readonly Codebase[]): OverviewRow[] {
  return codebases.flatMap((codebase): OverviewRow[] => {
    if (codebase.snapshots.length === 0) {
      return [{ key: codebase.id, codebaseName: codebase.name, isFirstOfCodebase: true, snapshot: null }];
    }
    return codebase.snapshots.map((snapshot, index) => ({
      key: `${codebase.id}/${snapshot.id}`,
      codebaseName: codebase.name,
      isFirstOfCodebase: index === 0,
      snapshot,
    }));
  });
}
