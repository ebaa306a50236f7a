import { randomUUID } from 'node:crypto';
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { DataSource } from 'typeorm';
import type { Viewer } from '../auth/session-data';
import type { Config } from '../config';
import { Codebase, Snapshot, Workspace } from '../db/entities';
import type { JobSender } from '../jobs/job-queue';
import { audit } from './audit';
import { toSnapshotSummary, type SnapshotSummary } from './snapshot-summary';
import { effectiveSettings } from './workspace-settings';

export interface IntakeDeps {
  dataSource: DataSource;
  config: Config;
  jobs: JobSender;
}

/**
 * Turns a received file (an uploaded zip or a pushed snapshot, already on disk in the inbox) into
 * a queued snapshot and its job. The file is moved into the inbox under the snapshot's id; if
 * anything fails before the job is queued, the file and the row are removed again.
 */
export async function queueSnapshot(
  deps: IntakeDeps,
  viewer: Viewer,
  codebase: Codebase,
  input: { file: string; source: 'upload' | 'push'; commit?: string | null; branch?: string | null },
): Promise<SnapshotSummary> {
  const { dataSource, config } = deps;
  await fs.promises.mkdir(config.inboxDir, { recursive: true });
  const workspace = await dataSource.getRepository(Workspace).findOneByOrFail({ id: viewer.workspace.id });
  const id = randomUUID();
  const inputFile = path.join(config.inboxDir, `${id}${input.source === 'upload' ? '.zip' : '.json'}`);
  await fs.promises.rename(input.file, inputFile);
  try {
    await dataSource.transaction(async (m) => {
      await m.getRepository(Snapshot).save({
        id, codebaseId: codebase.id, status: 'queued' as const, phase: 'queued', source: input.source, inputFile,
        commit: input.commit ?? null, branch: input.branch ?? null, createdById: viewer.user?.id ?? null,
        settings: { ...effectiveSettings(workspace.settings) },
      });
      await audit(m, viewer, input.source === 'upload' ? 'snapshot.upload' : 'snapshot.push', { type: 'snapshot', id }, { codebase: codebase.name, commit: input.commit ?? null });
    });
    const jobId = await deps.jobs.enqueueAnalysis(id).catch(async (err: unknown) => {
      await dataSource.getRepository(Snapshot).delete(id);
      throw err;
    });
    await dataSource.getRepository(Snapshot).update({ id, status: 'queued' }, { jobId });
    return toSnapshotSummary(await dataSource.getRepository(Snapshot).findOneByOrFail({ id }));
  } catch (err) {
    await fs.promises.rm(inputFile, { force: true });
    throw err;
  }
}

/** Finds the workspace's codebase by name, creating it for a first push (CI should not need a click first). */
export async function codebaseByName(dataSource: DataSource, viewer: Viewer, name: string): Promise<Codebase> {
  const existing = await dataSource.getRepository(Codebase).findOneBy({ workspaceId: viewer.workspace.id, name });
  if (existing) return existing;
  await dataSource.getRepository(Codebase).createQueryBuilder().insert().values({ workspaceId: viewer.workspace.id, name }).orIgnore().execute();
  return dataSource.getRepository(Codebase).findOneByOrFail({ workspaceId: viewer.workspace.id, name });
}
