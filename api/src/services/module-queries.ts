import type { DataSource } from 'typeorm';
import { z } from 'zod';

export const levelSchema = z.enum(['file', 'folder', 'package']);

export const moduleGraphQuerySchema = z.object({
  level: levelSchema.default('folder'),
  /** Leave out edges lighter than this (call sites plus imports). */
  minWeight: z.coerce.number().int().min(0).default(0),
}).strict();

export const gravityQuerySchema = z.object({
  level: levelSchema.default('folder'),
  limit: z.coerce.number().int().min(1).max(500).default(20),
}).strict();

const MODULE_COLUMNS = `module_id AS id, level, path, name, functions, cyclomatic, decisions, nodes, edges, max_cyclomatic AS "maxCyclomatic",
  over_limit AS "overLimit", lines, fan_in AS "fanIn", fan_out AS "fanOut", ca, ce, instability, abstractness,
  design_complexity AS "designComplexity", integration_complexity AS "integrationComplexity", unresolved_calls AS "unresolvedCalls",
  external_calls AS "externalCalls", cluster, gravity, gravity_rank AS "gravityRank", reasons`;

/** Every module of one level with its figures, strongest god-module candidate first. */
export async function listModules(dataSource: DataSource, snapshotId: string, level: string) {
  return dataSource.query(`SELECT ${MODULE_COLUMNS} FROM module_metric WHERE snapshot_id = $1 AND level = $2 ORDER BY gravity_rank`, [snapshotId, level]);
}

/** The module map at one level in the shape the Atlas draws: nodes, weighted edges and clusters. */
export async function moduleGraph(dataSource: DataSource, snapshotId: string, level: string, minWeight: number) {
  const [nodes, edges, clusters] = await Promise.all([
    dataSource.query(`SELECT ${MODULE_COLUMNS} FROM module_metric WHERE snapshot_id = $1 AND level = $2 ORDER BY module_id`, [snapshotId, level]),
    dataSource.query(`SELECT from_module AS "from", to_module AS "to", weight, calls, imports FROM module_edge WHERE snapshot_id = $1 AND level = $2 AND weight >= $3 ORDER BY from_module, to_module`, [snapshotId, level, minWeight]),
    dataSource.query(`SELECT cluster_id AS id, members, functions, cyclomatic, decisions, internal_weight AS "internalWeight", external_weight AS "externalWeight" FROM cluster WHERE snapshot_id = $1 AND level = $2 ORDER BY cyclomatic DESC, cluster_id`, [snapshotId, level]),
  ]);
  return { level, nodes, edges, clusters };
}

/**
 * The god-module ranking at one level, each with its reasons in words, and — where the codebase
 * has earlier ready snapshots — the module's gravity in up to five of them (oldest first).
 */
export async function gravityRanking(dataSource: DataSource, snapshotId: string, codebaseId: string, level: string, limit: number) {
  const modules = await dataSource.query(`SELECT ${MODULE_COLUMNS} FROM module_metric WHERE snapshot_id = $1 AND level = $2 ORDER BY gravity_rank LIMIT $3`, [snapshotId, level, limit]);
  const earlier: { id: string; created_at: Date }[] = await dataSource.query(
    `SELECT id, created_at FROM snapshot WHERE codebase_id = $1 AND status = 'ready' AND created_at < (SELECT created_at FROM snapshot WHERE id = $2) ORDER BY created_at DESC LIMIT 5`,
    [codebaseId, snapshotId],
  );
  const trendRows: { snapshot_id: string; module_id: string; gravity: number }[] = earlier.length === 0 ? [] : await dataSource.query(
    `SELECT snapshot_id, module_id, gravity FROM module_metric WHERE snapshot_id = ANY($1::uuid[]) AND module_id = ANY($2::text[])`,
    [earlier.map((e) => e.id), modules.map((m: { id: string }) => m.id)],
  );
  const order = [...earlier].reverse();
  return {
    level,
    modules: modules.map((m: { id: string; gravity: number }) => ({
      ...m,
      trend: [
        ...order.map((e) => ({ snapshotId: e.id, createdAt: e.created_at.toISOString(), gravity: trendRows.find((t) => t.snapshot_id === e.id && t.module_id === m.id)?.gravity ?? null })),
        { snapshotId, createdAt: null, gravity: m.gravity },
      ],
    })),
  };
}
