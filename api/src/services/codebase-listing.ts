import type { DataSource } from 'typeorm';
import { Codebase } from '../db/entities';
import { toSnapshotSummary, type SnapshotSummary } from './snapshot-summary';

/** One row of the Overview: a codebase and its snapshots, newest first. */
export interface CodebaseSummary {
  id: string;
  name: string;
  description: string;
  createdAt: string;
  snapshots: SnapshotSummary[];
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
    snapshots: (c.snapshots ?? []).map(toSnapshotSummary),
  }));
}
