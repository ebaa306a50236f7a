import type { DataSource } from 'typeorm';
import { Codebase } from '../db/entities';
import type { SnapshotStatus, SnapshotTotals } from '../db/entities';

/** One row of the Overview: a codebase and its snapshots, newest first. */
export interface CodebaseSummary {
  id: string;
  name: string;
  description: string;
  createdAt: string;
  snapshots: SnapshotSummary[];
}

export interface SnapshotSummary {
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

/** Lists a workspace's codebases (by name) with their snapshots (newest first). */
export async function listCodebases(dataSource: DataSource, workspaceId: string): Promise<CodebaseSummary[]> {
  const codebases = await dataSource.getRepository(Codebase).find({
    where: { workspaceId },
    relations: { snapshots: true },
    order: { name: 'ASC', snapshots: { createdAt: 'DESC' } },
  });
  return codebases.map((c) => ({
    id: c.id,
    name: c.name,
    description: c.description,
    createdAt: c.createdAt.toISOString(),
    snapshots: (c.snapshots ?? []).map((s) => ({
      id: s.id,
      status: s.status,
      progress: s.progress,
      error: s.error,
      commit: s.commit,
      branch: s.branch,
      createdAt: s.createdAt.toISOString(),
      finishedAt: s.finishedAt?.toISOString() ?? null,
      totals: s.totals,
    })),
  }));
}
