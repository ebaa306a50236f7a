import * as fs from 'node:fs';
import { Router, text } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { Snapshot } from '../../db/entities';
import { audit } from '../../services/audit';
import { FunctionCounts, functionDetail, functionQuerySchema, listFunctions } from '../../services/function-queries';
import {
  gravityQuerySchema, gravityRanking, levelSchema, listClusters, listModules, moduleDetail, moduleGraph, moduleGraphQuerySchema,
} from '../../services/module-queries';
import { readySnapshot, requireModuleMap, snapshotInWorkspace } from '../../services/snapshot-access';
import type { SnapshotCache } from '../../services/snapshot-cache';
import { exportSnapshot, importCoverageReport } from '../../services/snapshot-files';
import { ResponseCache } from '../../services/response-cache';
import { sendCachedJson } from '../send-cached-json';
import { toSnapshotSummary } from '../../services/snapshot-summary';
import { allow } from '../policy';
import { validate } from '../validate';
import { memberOf, viewerOf } from '../viewer';
import { streamSnapshotEvents } from './snapshot-events';

const idParams = z.object({ id: z.uuid('must be a snapshot id') });
const functionParams = idParams.extend({ functionId: z.string().min(1).max(200) });
const moduleParams = idParams.extend({ moduleId: z.string().regex(/^(file|folder|package):/, 'must be a module id such as folder:src/orders').max(1000) });
const levelQuery = z.object({ level: levelSchema.default('folder') }).strict();
const exportQuery = z.object({ format: z.enum(['json', 'sarif', 'csv', 'graphml']), level: levelSchema.default('folder') }).strict();
const coverageQuery = z.object({ fileName: z.string().max(255).default('coverage') }).strict();

/** Module graphs kept as finished JSON: a few large maps, bounded by bytes. */
const GRAPH_CACHE_ENTRIES = 16;
const GRAPH_CACHE_BYTES = 64 * 1024 * 1024;

/** Coverage reports are text; a big monorepo's lcov stays well under this. */
const COVERAGE_LIMIT = '100mb';

/** /api/snapshots/:id — one snapshot: state, live progress, its analysis read back, coverage, exports. */
export function snapshotRoutes(dataSource: DataSource, cache: SnapshotCache): Router {
  const router = Router();
  const graphCache = new ResponseCache(GRAPH_CACHE_ENTRIES, GRAPH_CACHE_BYTES);
  const functionCounts = new FunctionCounts();
  const ready = async (req: import('express').Request) => readySnapshot(dataSource, viewerOf(req).workspace.id, validate(idParams, req.params, 'params').id);

  router.get('/:id', allow('snapshot.status'), async (req, res) => {
    const s = await snapshotInWorkspace(dataSource, viewerOf(req).workspace.id, validate(idParams, req.params, 'params').id);
    res.json({ snapshot: { ...toSnapshotSummary(s), skipped: s.skipped, externals: s.externals, mapSettings: s.mapSettings } });
  });
  router.delete('/:id', allow('snapshot.delete'), async (req, res) => {
    const viewer = memberOf(req);
    const s = await snapshotInWorkspace(dataSource, viewer.workspace.id, validate(idParams, req.params, 'params').id);
    await dataSource.transaction(async (m) => {
      await m.getRepository(Snapshot).delete(s.id);
      await audit(m, viewer, 'snapshot.delete', { type: 'snapshot', id: s.id }, { status: s.status });
    });
    if (s.inputFile) await fs.promises.rm(s.inputFile, { force: true });
    cache.forget(s.id);
    res.status(204).end();
  });
  router.get('/:id/events', allow('snapshot.status'), async (req, res) => {
    const s = await snapshotInWorkspace(dataSource, viewerOf(req).workspace.id, validate(idParams, req.params, 'params').id);
    streamSnapshotEvents(dataSource, s.id, req, res);
  });
  router.get('/:id/functions', allow('snapshot.read'), async (req, res) => {
    const s = await ready(req);
    const page = await listFunctions(dataSource, s.id, validate(functionQuerySchema, req.query, 'query'), functionCounts);
    res.json({ ...page, limit: (s.settings as { limit?: number }).limit ?? 10 });
  });
  router.get('/:id/functions/:functionId', allow('snapshot.read'), async (req, res) => {
    const { id, functionId } = validate(functionParams, req.params, 'params');
    const s = await readySnapshot(dataSource, viewerOf(req).workspace.id, id);
    res.json({ ...(await functionDetail(dataSource, s.id, functionId)), limit: (s.settings as { limit?: number }).limit ?? 10 });
  });
  router.get('/:id/modules', allow('snapshot.read'), async (req, res) => {
    const s = await ready(req);
    requireModuleMap(s);
    const { level } = validate(levelQuery, req.query, 'query');
    res.json({ level, items: await listModules(dataSource, s.id, level) });
  });
  router.get('/:id/modules/:moduleId', allow('snapshot.read'), async (req, res) => {
    const { id, moduleId } = validate(moduleParams, req.params, 'params');
    const s = await readySnapshot(dataSource, viewerOf(req).workspace.id, id);
    requireModuleMap(s);
    res.json({ module: await moduleDetail(dataSource, s.id, moduleId) });
  });
  router.get('/:id/clusters', allow('snapshot.read'), async (req, res) => {
    const s = await ready(req);
    requireModuleMap(s);
    const { level } = validate(levelQuery, req.query, 'query');
    res.json({ level, items: await listClusters(dataSource, s.id, level) });
  });
  router.get('/:id/module-graph', allow('snapshot.read'), async (req, res) => {
    const s = await ready(req);
    requireModuleMap(s);
    const q = validate(moduleGraphQuerySchema, req.query, 'query');
    // A ready snapshot's module graph never changes: build its JSON once.
    sendCachedJson(req, res, await graphCache.get(`${s.id}|${q.level}|${q.minWeight}`, () => moduleGraph(dataSource, s.id, q.level, q.minWeight)));
  });
  router.get('/:id/gravity', allow('snapshot.read'), async (req, res) => {
    const s = await ready(req);
    requireModuleMap(s);
    const q = validate(gravityQuerySchema, req.query, 'query');
    res.json(await gravityRanking(dataSource, s.id, s.codebaseId, q.level, q.limit));
  });
  /** The report is the raw body (lcov text or Istanbul JSON), any content type. */
  router.post('/:id/coverage', allow('coverage.upload'), text({ type: () => true, limit: COVERAGE_LIMIT }), async (req, res) => {
    const viewer = memberOf(req);
    const s = await ready(req);
    const { fileName } = validate(coverageQuery, req.query, 'query');
    const body = typeof req.body === 'string' ? req.body : '';
    const imported = await importCoverageReport(dataSource, viewer, s, body, fileName);
    cache.forget(s.id);
    res.status(201).json({ coverage: imported });
  });
  router.get('/:id/export', allow('snapshot.read'), async (req, res) => {
    const s = await ready(req);
    const q = validate(exportQuery, req.query, 'query');
    if (q.format === 'graphml') requireModuleMap(s);
    const file = await exportSnapshot(dataSource, s, q.format, q.level);
    res.type(file.type).attachment(file.file).send(file.body);
  });
  return router;
}
