import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { createToken, listTokens, revokeToken } from '../../services/api-token-service';
import { allow } from '../policy';
import { validate } from '../validate';
import { memberOf } from '../viewer';

const newToken = z.object({ name: z.string().trim().min(1).max(100) }).strict();
const tokenParams = z.object({ id: z.uuid('must be a token id') });

/** /api/tokens — owners: API tokens for CI pushes (the secret is shown once, on creation). */
export function tokenRoutes(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', allow('tokens.manage'), async (req, res) => {
    res.json({ items: await listTokens(dataSource, memberOf(req).workspace.id) });
  });
  router.post('/', allow('tokens.manage'), async (req, res) => {
    const { token, secret } = await createToken(dataSource, memberOf(req), validate(newToken, req.body, 'body').name);
    res.status(201).json({ token, secret, note: 'Copy the secret now: Seamline keeps only its hash and cannot show it again.' });
  });
  router.delete('/:id', allow('tokens.manage'), async (req, res) => {
    await revokeToken(dataSource, memberOf(req), validate(tokenParams, req.params, 'params').id);
    res.status(204).end();
  });
  return router;
}
