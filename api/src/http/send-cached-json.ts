import type { Request, Response } from 'express';
import type { CachedJson } from '../services/response-cache';

/** Sends a cached JSON answer, gzipped when the client accepts it (every browser does). */
export function sendCachedJson(req: Request, res: Response, answer: CachedJson): void {
  res.vary('Accept-Encoding').type('json');
  if (req.acceptsEncodings('gzip') === 'gzip') res.set('Content-Encoding', 'gzip').send(answer.gzipped);
  else res.send(answer.json);
}
