import * as fs from 'node:fs';
import * as path from 'node:path';
import { Router } from 'express';
import { QueryFailedError, type DataSource } from 'typeorm';
import { z } from 'zod';
import type { Config } from '../../config';
import { Codebase, Snapshot } from '../../db/entities';
import { AppError } from '../../errors';
import type { JobSender } from '../../jobs/job-queue';
import { audit } from '../../services/audit';
import { listCodebases } from '../../services/codebase-listing';
import { codebaseInWorkspace } from '../../services/snapshot-access';
import { queueSnapshot } from '../../services/snapshot-intake';
import { toSnapshotSummary } from '../../services/snapshot-summary';
import { receiveZipUpload } from '../../uploads/receive-upload';
import { DEFAULT_UPLOAD_LIMITS } from '../../uploads/upload-limits';
import { inspectZip } from '../../uploads/zip-inspection';
import { branchField, codebaseNameField, commitField } from '../fields';
import { allow } from '../policy';
import { validate } from '../validate';
import { memberOf, viewerOf } from '../viewer';

const idParams = z.object({ id: z.uuid('must be a codebase id') });
const newCodebase = z.object({ name: codebaseNameField, description: z.string().max(2000).default('') }).strict();
const uploadFields = z.object({ commit: commitField.optional(), branch: branchField.optional() }).strict();

export interface CodebaseRouteDeps {
  dataSource: DataSource;
  config: Config;
  jobs: JobSender;
}

/** /api/codebases — the workspace's codebases, their snapshots, and zip uploads that become snapshots. */
export function codebaseRoutes(deps: CodebaseRouteDeps): Router {
  const { dataSource, config } = deps;
  const router = Router();
  const limits = { ...DEFAULT_UPLOAD_LIMITS, maxUploadBytes: config.uploadMaxBytes };

  router.get('/', allow('codebase.read'), async (req, res) => {
    res.json({ items: await listCodebases(dataSource, viewerOf(req).workspace.id) });
  });
  router.post('/', allow('codebase.write'), async (req, res) => {
    const viewer = memberOf(req);
    const input = validate(newCodebase, req.body, 'body');
    const codebase = await dataSource.transaction(async (m) => {
      const saved = await m.getRepository(Codebase).save({ workspaceId: viewer.workspace.id, name: input.name, description: input.description })
        .catch((err: unknown) => {
          if (err instanceof QueryFailedError && /uq_codebase_workspace_name/.test(err.message)) {
            throw new AppError(409, 'conflict', `This workspace already has a codebase named "${input.name}".`);
          }
          throw err;
        });
      await audit(m, viewer, 'codebase.create', { type: 'codebase', id: saved.id }, { name: saved.name });
      return saved;
    });
    res.status(201).json({ codebase: { id: codebase.id, name: codebase.name, description: codebase.description, createdAt: codebase.createdAt.toISOString() } });
  });
  router.get('/:id', allow('codebase.read'), async (req, res) => {
    const c = await codebaseInWorkspace(dataSource, viewerOf(req).workspace.id, validate(idParams, req.params, 'params').id);
    res.json({ codebase: { id: c.id, name: c.name, description: c.description, createdAt: c.createdAt.toISOString() } });
  });
  router.delete('/:id', allow('codebase.write'), async (req, res) => {
    const viewer = memberOf(req);
    const c = await codebaseInWorkspace(dataSource, viewer.workspace.id, validate(idParams, req.params, 'params').id);
    await dataSource.transaction(async (m) => {
      await m.getRepository(Codebase).delete(c.id);
      await audit(m, viewer, 'codebase.delete', { type: 'codebase', id: c.id }, { name: c.name });
    });
    res.status(204).end();
  });
  router.get('/:id/snapshots', allow('snapshot.read'), async (req, res) => {
    const c = await codebaseInWorkspace(dataSource, viewerOf(req).workspace.id, validate(idParams, req.params, 'params').id);
    const rows = await dataSource.getRepository(Snapshot).find({ where: { codebaseId: c.id }, order: { createdAt: 'DESC' } });
    res.json({ items: rows.map(toSnapshotSummary) });
  });
  /** Multipart upload: a `file` part holding the zip, optional `commit` and `branch` fields. 202 with the queued snapshot. */
  router.post('/:id/snapshots', allow('snapshot.upload'), async (req, res) => {
    const viewer = memberOf(req);
    const c = await codebaseInWorkspace(dataSource, viewer.workspace.id, validate(idParams, req.params, 'params').id);
    const upload = await receiveZipUpload(req, { dir: path.join(config.inboxDir, 'incoming'), limits });
    try {
      const fields = validate(uploadFields, upload.fields, 'body');
      await inspectZip(upload.file, limits);
      const snapshot = await queueSnapshot(deps, viewer, c, { file: upload.file, source: 'upload', commit: fields.commit, branch: fields.branch });
      res.status(202).json({ snapshot, links: { status: `/api/snapshots/${snapshot.id}`, events: `/api/snapshots/${snapshot.id}/events` } });
    } finally {
      await fs.promises.rm(upload.file, { force: true });
    }
  });
  return router;
}
