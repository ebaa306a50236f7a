import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { listAuditEvents } from '../../services/audit';
import { allow } from '../policy';
import { validate } from '../validate';
import { memberOf } from '../viewer';

const auditQuery = z.object({ limit: z.coerce.number().int().min(1).max(500).default(100), before: z.iso.datetime().optional() }).strict();

/** GET /api/audit-events — owners: who did what, newest first (page back with `before`). */
export function auditRoutes(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', allow('audit.read'), async (req, res) => {
    const q = validate(auditQuery, req.query, 'query');
    res.json({ items: await listAuditEvents(dataSource.manager, memberOf(req).workspace.id, q.limit, q.before ? new Date(q.before) : undefined) });
  });
  return router;
}
