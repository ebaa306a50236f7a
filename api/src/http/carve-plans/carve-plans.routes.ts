import { Router } from 'express';
import { z } from 'zod';
import { createPlanSchema, duplicatePlanSchema, updatePlanSchema, type CarvePlanService } from '../../services/carve-plans';
import { allow } from '../policy';
import { validate } from '../validate';
import { memberOf } from '../viewer';

const idParams = z.object({ id: z.uuid('must be a carve plan id') });
const listQuery = z.object({ snapshot: z.uuid().optional() }).strict();

/** /api/carve-plans — what-if splits: from the clusters or empty, edited, evaluated, duplicated, deleted. */
export function carvePlanRoutes(plans: CarvePlanService): Router {
  const router = Router();
  router.get('/', allow('plan.read'), async (req, res) => {
    res.json({ items: await plans.list(memberOf(req).workspace.id, validate(listQuery, req.query, 'query').snapshot) });
  });
  router.post('/', allow('plan.write'), async (req, res) => {
    res.status(201).json(await plans.create(memberOf(req), validate(createPlanSchema, req.body, 'body')));
  });
  router.get('/:id', allow('plan.read'), async (req, res) => {
    res.json(await plans.get(memberOf(req).workspace.id, validate(idParams, req.params, 'params').id));
  });
  router.patch('/:id', allow('plan.write'), async (req, res) => {
    res.json(await plans.update(memberOf(req), validate(idParams, req.params, 'params').id, validate(updatePlanSchema, req.body, 'body')));
  });
  router.post('/:id/duplicate', allow('plan.write'), async (req, res) => {
    res.status(201).json(await plans.duplicate(memberOf(req), validate(idParams, req.params, 'params').id, validate(duplicatePlanSchema, req.body, 'body').name));
  });
  router.delete('/:id', allow('plan.write'), async (req, res) => {
    await plans.remove(memberOf(req), validate(idParams, req.params, 'params').id);
    res.status(204).end();
  });
  return router;
}
