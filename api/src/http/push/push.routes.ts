import * as fs from 'node:fs';
import * as path from 'node:path';
import { Router } from 'express';
import { z } from 'zod';
import { BadRequestError } from '../../errors';
import { codebaseByName, queueSnapshot } from '../../services/snapshot-intake';
import type { CodebaseRouteDeps } from '../codebases/codebases.routes';
import { branchField, codebaseNameField, commitField } from '../fields';
import { allow } from '../policy';
import { validate } from '../validate';
import { viewerOf } from '../viewer';
import { receiveBody } from './receive-body';

const pushQuery = z.object({
  codebase: codebaseNameField,
  commit: commitField.optional(),
  branch: branchField.optional(),
}).strict();

/**
 * POST /api/push?codebase=NAME[&commit][&branch] — a snapshot JSON made by `seamline scan`, sent by
 * `seamline push` with a workspace API token (or by an architect's session). The codebase is
 * created on its first push. 202 with the queued snapshot; a worker validates and stores it.
 */
export function pushRoutes(deps: CodebaseRouteDeps): Router {
  const router = Router();
  router.post('/', allow('snapshot.push'), async (req, res) => {
    const query = validate(pushQuery, req.query, 'query');
    if (!req.is('application/json')) {
      req.resume();
      throw new BadRequestError('Send the snapshot as the request body with Content-Type: application/json.');
    }
    const viewer = viewerOf(req);
    const { file } = await receiveBody(req, path.join(deps.config.inboxDir, 'incoming'), deps.config.uploadMaxBytes);
    try {
      await assertLooksLikeJsonObject(file);
      const codebase = await codebaseByName(deps.dataSource, viewer, query.codebase);
      const snapshot = await queueSnapshot(deps, viewer, codebase, { file, source: 'push', commit: query.commit, branch: query.branch });
      res.status(202).json({ snapshot: { id: snapshot.id, status: snapshot.status, codebaseId: codebase.id }, links: { status: `/api/snapshots/${snapshot.id}` } });
    } finally {
      await fs.promises.rm(file, { force: true });
    }
  });
  return router;
}

/** A cheap early check (the worker validates the whole document against the schema). */
async function assertLooksLikeJsonObject(file: string): Promise<void> {
  const handle = await fs.promises.open(file, 'r');
  try {
    const { buffer, bytesRead } = await handle.read(Buffer.alloc(64), 0, 64, 0);
    const start = buffer.subarray(0, bytesRead).toString('utf8').replace(/^\uFEFF/, '').trimStart();
    if (!start.startsWith('{')) throw new BadRequestError('The body is not a JSON object; send the snapshot file made by `seamline scan`.');
  } finally {
    await handle.close();
  }
}
