import * as fs from 'node:fs';
import * as path from 'node:path';
import express, { Router } from 'express';

/**
 * Serves the built Angular app. Any GET outside /api that is not a file falls back to
 * index.html so deep links (a reload on /overview) keep the place.
 */
export function staticWeb(webDist: string): Router {
  const router = Router();
  const index = path.join(webDist, 'index.html');
  router.use(express.static(webDist, { index: false, maxAge: '1h', fallthrough: true }));
  router.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/api/') || req.path === '/api') return next();
    if (!fs.existsSync(index)) {
      res.status(503).type('text/plain').send(`The web app is not built (no ${index}). Run \`npm run build\` or \`npm start\`.`);
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return router;
}
