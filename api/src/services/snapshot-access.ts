import type { DataSource } from 'typeorm';
import { Codebase, Snapshot } from '../db/entities';
import { entityRows } from '../db/entity-rows';
import { AppError, NotFoundError } from '../errors';

/** A codebase of the caller's workspace, or 404 (another workspace's ids are not even confirmed to exist). */
export async function codebaseInWorkspace(dataSource: DataSource, workspaceId: string, codebaseId: string): Promise<Codebase> {
  const codebase = await dataSource.getRepository(Codebase).findOneBy({ id: codebaseId, workspaceId });
  if (!codebase) throw new NotFoundError('No such codebase in this workspace.');
  return codebase;
}

/** A snapshot of one of the workspace's codebases, or 404. (Every snapshot route asks: plain SQL, see EntityRows.) */
export async function snapshotInWorkspace(dataSource: DataSource, workspaceId: string, snapshotId: string): Promise<Snapshot> {
  const rows = entityRows(dataSource, Snapshot);
  const [row] = await dataSource.query(
    `SELECT ${rows.select('s')} FROM snapshot s JOIN codebase c ON c.id = s.codebase_id WHERE s.id = $1 AND c.workspace_id = $2`,
    [snapshotId, workspaceId],
  );
  if (!row) throw new NotFoundError('No such snapshot in this workspace.');
  return rows.from(row);
}

/** The same, for reading its analysis: a snapshot that is not ready yet answers 409 with its state. */
export async function readySnapshot(dataSource: DataSource, workspaceId: string, snapshotId: string): Promise<Snapshot> {
  const snapshot = await snapshotInWorkspace(dataSource, workspaceId, snapshotId);
  if (snapshot.status !== 'ready') {
    throw new AppError(409, 'snapshot_not_ready', snapshot.status === 'failed'
      ? `This snapshot failed and has no results: ${snapshot.error ?? 'no reason recorded'}.`
      : `This snapshot is ${snapshot.status} (${snapshot.progress} %); its results appear when it is ready.`, { status: snapshot.status });
  }
  return snapshot;
}

/** Snapshot results without the module map (scanned with --no-calls) cannot answer module questions. */
export function requireModuleMap(snapshot: Snapshot): void {
  if (snapshot.mapSettings === null) {
    throw new AppError(409, 'no_module_map', 'This snapshot was made without the call graph (`seamline scan --no-calls`), so it has no modules, clusters or gravity.');
  }
}
