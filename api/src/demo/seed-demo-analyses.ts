import * as fs from 'node:fs';
import * as path from 'node:path';
import type { DataSource } from 'typeorm';
import type { Viewer } from '../auth/session-data';
import type { Config } from '../config';
import { CarvePlanRow, Codebase, Membership, Snapshot, Workspace } from '../db/entities';
import type { JobSender } from '../jobs/job-queue';
import type { Logger } from '../logger';
import { CarvePlanService } from '../services/carve-plans';
import { SnapshotCache } from '../services/snapshot-cache';
import { importCoverageReport } from '../services/snapshot-files';
import { queueSnapshot } from '../services/snapshot-intake';
import { buildDemoZip, DEMO_ROOT, DEMO_VERSIONS, type DemoVersion } from './demo-zip';
import { DEMO_PEOPLE, DEMO_WORKSPACE } from './demo-people';

export const DEMO_CODEBASE = 'otterbay-dispatch';
const DEMO_COMMITS: Record<DemoVersion, { commit: string; branch: string }> = {
  before: { commit: 'v3.14.0', branch: 'main' },
  after: { commit: 'v4.0.0', branch: 'main' },
};
export const DEMO_PLAN_NAME = 'Dispatch split — first cut from the clusters';

export interface SeedDeps {
  dataSource: DataSource;
  config: Config;
  jobs: JobSender;
  logger: Logger;
}

/**
 * Gives a fresh demo workspace content through the same pipeline users get: the invented
 * Otterbay codebase's two versions are uploaded as zips and analysed by the workers, the
 * committed lcov report is imported onto the first, and a carve plan is made from its Louvain
 * clusters. Does nothing once the demo codebase has snapshots (a restart keeps what is there).
 */
export async function seedDemoAnalyses(deps: SeedDeps, timeoutMs = 180_000): Promise<'seeded' | 'present'> {
  const { dataSource } = deps;
  const workspace = await dataSource.getRepository(Workspace).findOneByOrFail({ slug: DEMO_WORKSPACE.slug });
  const viewer = await demoArchitect(dataSource, workspace);
  let codebase = await dataSource.getRepository(Codebase).findOneBy({ workspaceId: workspace.id, name: DEMO_CODEBASE });
  if (codebase && (await dataSource.getRepository(Snapshot).countBy({ codebaseId: codebase.id })) > 0) return 'present';
  codebase ??= await dataSource.getRepository(Codebase).save({
    workspaceId: workspace.id, name: DEMO_CODEBASE,
    description: 'Invented demo: the Otterbay Parcel Co. dispatch monolith (3.14) and the version after its first split (4.0).',
  });
  const ids: Record<string, string> = {};
  for (const version of DEMO_VERSIONS) {
    const zip = path.join(deps.config.inboxDir, 'incoming', `demo-${version}-${Date.now()}.zip`);
    await fs.promises.mkdir(path.dirname(zip), { recursive: true });
    await buildDemoZip(version, zip);
    ids[version] = (await queueSnapshot(deps, viewer, codebase, { file: zip, source: 'upload', ...DEMO_COMMITS[version] })).id;
  }
  const before = await waitUntilReady(dataSource, ids['before'], timeoutMs);
  await waitUntilReady(dataSource, ids['after'], timeoutMs);
  const lcov = await fs.promises.readFile(path.join(DEMO_ROOT, 'before', 'coverage', 'lcov.info'), 'utf8');
  await importCoverageReport(dataSource, viewer, before, lcov, 'lcov.info');
  const exists = await dataSource.getRepository(CarvePlanRow).findOneBy({ snapshotId: before.id, name: DEMO_PLAN_NAME });
  if (!exists) await new CarvePlanService(dataSource, new SnapshotCache(dataSource)).create(viewer, { snapshotId: before.id, name: DEMO_PLAN_NAME, level: 'folder', from: 'clusters' });
  return 'seeded';
}

async function demoArchitect(dataSource: DataSource, workspace: Workspace): Promise<Viewer> {
  const email = DEMO_PEOPLE.find((p) => p.role === 'architect')!.email;
  const membership = await dataSource.getRepository(Membership).findOneOrFail({ where: { workspaceId: workspace.id, user: { email } }, relations: { user: true } });
  return { user: membership.user!, workspace, role: membership.role };
}

async function waitUntilReady(dataSource: DataSource, snapshotId: string, timeoutMs: number): Promise<Snapshot> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const row = await dataSource.getRepository(Snapshot).findOneByOrFail({ id: snapshotId });
    if (row.status === 'ready') return row;
    if (row.status === 'failed') throw new Error(`The demo analysis ${snapshotId} failed: ${row.error}`);
    if (Date.now() > deadline) throw new Error(`The demo analysis ${snapshotId} was not ready after ${timeoutMs / 1000} s (status ${row.status}, ${row.progress} %); is a worker running?`);
    await new Promise((r) => setTimeout(r, 500));
  }
}
