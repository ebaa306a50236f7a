import { Router } from 'express';
import { allow } from '../policy';
import { MailStore } from '../../fakes/mail/mail-store';

/** GET /api/outbox — owners, development and test only: what the mail fake received, newest first. */
export function outboxRoutes(storeDir: string): Router {
  const router = Router();
  const store = new MailStore(storeDir);
  router.get('/', allow('outbox.read'), async (_req, res) => {
    res.json({ items: await store.list() });
  });
  return router;
}
