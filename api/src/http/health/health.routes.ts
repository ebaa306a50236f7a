import { Router } from 'express';
import type { DataSource } from 'typeorm';

/** GET /api/health — public; 200 when the API and its database answer, 503 otherwise. */
export function healthRoutes(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await dataSource.query('SELECT 1');
      res.json({ status: 'ok', database: 'ok' });
    } catch (err) {
      // A down database is the answer we report, not an error of this route.
      res.status(503).json({ status: 'degraded', database: 'unreachable', message: (err as Error).message });
    }
  });
  return router;
}
