import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { shiftPlan, shiftSnapshots } from '../../analyzer-lib';
import { BadRequestError } from '../../errors';
import type { CarvePlanService } from '../../services/carve-plans';
import { readySnapshot } from '../../services/snapshot-access';
import type { SnapshotCache } from '../../services/snapshot-cache';
import { allow } from '../policy';
import { validate } from '../validate';
import { viewerOf } from '../viewer';

const shiftQuery = z.object({ before: z.uuid(), after: z.uuid(), plan: z.uuid().optional() }).strict();

/**
 * GET /api/shift?before=&after=[&plan=] — what changed between two ready snapshots of the
 * workspace; with a carve plan of the before snapshot, the figures per proposed service too.
 */
export function shiftRoutes(dataSource: DataSource, cache: SnapshotCache, plans: CarvePlanService): Router {
  const router = Router();
  router.get('/', allow('snapshot.read'), async (req, res) => {
    const q = validate(shiftQuery, req.query, 'query');
    if (q.before === q.after) throw new BadRequestError('Pick two different snapshots to compare.');
    const workspaceId = viewerOf(req).workspace.id;
    const [before, after] = await Promise.all([readySnapshot(dataSource, workspaceId, q.before), readySnapshot(dataSource, workspaceId, q.after)]);
    const [b, a] = await Promise.all([cache.snapshot(before.id), cache.snapshot(after.id)]);
    try {
      const shift = shiftSnapshots(b, a);
      const plan = q.plan ? await plans.asCarvePlan(workspaceId, q.plan) : null;
      if (plan && plan.row.snapshotId !== before.id) throw new BadRequestError('The carve plan belongs to another snapshot than `before`.');
      res.json({ before: before.id, after: after.id, shift, plan: plan ? { id: plan.row.id, name: plan.row.name, shift: shiftPlan(b, a, plan.plan) } : null });
    } catch (err) {
      if (err instanceof Error && err.name === 'IncomparableShiftError') throw new BadRequestError(err.message);
      throw err;
    }
  });
  return router;
}
