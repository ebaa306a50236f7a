import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { listCodebases } from '../../services/codebase-listing';

/** GET /api/codebases — any member: the workspace's codebases with their snapshots. */
export function codebaseRoutes(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json({ items: await listCodebases(dataSource, req.viewer!.workspace.id) });
  });
  return router;
}
