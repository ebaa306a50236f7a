import * as path from 'node:path';
import express, { Router } from 'express';
import { apiNotFound } from '../error-handler';
import { loadOpenApiDocument, openApiFile } from './openapi-document';
import { REFERENCE_INITIALIZER, REFERENCE_PAGE, SWAGGER_UI_ASSETS } from './reference-page';

/** swagger-ui-dist's folder in node_modules (its files are served from there, never from a CDN). */
function swaggerUiFolder(): string {
  return path.dirname(require.resolve('swagger-ui-dist/package.json'));
}

/**
 * /api/docs — public: the API reference page, its script, swagger-ui's files, and
 * docs/openapi.yaml as JSON (read and parsed once, when the app is built).
 */
export function docsRoutes(documentFile: string = openApiFile()): Router {
  const { json } = loadOpenApiDocument(documentFile);
  const assets = express.static(swaggerUiFolder(), { index: false, maxAge: '1d', fallthrough: true });
  const router = Router();

  router.get('/', (_req, res) => {
    res.set('Cache-Control', 'no-cache').type('html').send(REFERENCE_PAGE);
  });
  router.get('/openapi.json', (_req, res) => {
    res.set('Cache-Control', 'no-cache').type('json').send(json);
  });
  router.get('/initializer.js', (_req, res) => {
    res.set('Cache-Control', 'no-cache').type('text/javascript').send(REFERENCE_INITIALIZER);
  });
  // Only the files the page names; the rest of the package (its demo page included) stays unserved.
  router.use((req, res, next) => (SWAGGER_UI_ASSETS.has(req.path.slice(1)) ? assets(req, res, next) : next()));
  // Anything else under the public /api/docs is a 404 here, not a sign-in demand further on.
  router.use(apiNotFound);
  return router;
}
