import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { NotFoundError } from '../errors';

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

/** What the map draws and lists of each module; everything else comes with one module (`moduleDetail`). */
const MAP_COLUMNS = `module_id AS id, path, name, functions, cyclomatic, decisions, cluster, gravity_rank AS "gravityRank"`;

/** A link of the map: indexes of its two modules in `nodes`, and its weight (call sites plus imports). */
export type MapLink = [from: number, to: number, weight: number];

/**
 * The module map at one level in the shape the Atlas draws: nodes with the figures the map and
 * its list show, links as index pairs into `nodes` with their weight, and the clusters with
 * their sizes. Lean on purpose: a 20,000-module map is sent and parsed whole, so each node
 * carries eight fields (one module's full figures are `moduleDetail`) and a link three numbers
 * rather than two module ids — about a third of the bytes of full records.
 */
export async function moduleGraph(dataSource: DataSource, snapshotId: string, level: string, minWeight: number) {
  const [nodes, edges, clusters] = await Promise.all([
    dataSource.query(`SELECT ${MAP_COLUMNS} FROM module_metric WHERE snapshot_id = $1 AND level = $2 ORDER BY module_id`, [snapshotId, level]) as Promise<{ id: string }[]>,
    dataSource.query(`SELECT from_module AS "from", to_module AS "to", weight FROM module_edge WHERE snapshot_id = $1 AND level = $2 AND weight >= $3 ORDER BY from_module, to_module`, [snapshotId, level, minWeight]) as Promise<{ from: string; to: string; weight: number }[]>,
    dataSource.query(`SELECT cluster_id AS id, jsonb_array_length(members) AS size, functions, cyclomatic, decisions, internal_weight AS "internalWeight", external_weight AS "externalWeight" FROM cluster WHERE snapshot_id = $1 AND level = $2 ORDER BY cyclomatic DESC, cluster_id`, [snapshotId, level]),
  ]);
  const index = new Map(nodes.map((node, i) => [node.id, i]));
  const links: MapLink[] = [];
  for (const edge of edges) {
    const from = index.get(edge.from);
    const to = index.get(edge.to);
    if (from !== undefined && to !== undefined) links.push([from, to, edge.weight]);
  }
  return { level, nodes, links, clusters };
}

/** One module with all its figures and gravity reasons; 404 when the snapshot has no such module. */
export async function moduleDetail(dataSource: DataSource, snapshotId: string, moduleId: string) {
  const [module] = await dataSource.query(`SELECT ${MODULE_COLUMNS} FROM module_metric WHERE snapshot_id = $1 AND module_id = $2`, [snapshotId, moduleId]);
  if (!module) throw new NotFoundError('No such module in this snapshot.');
  return module;
}

/** Each cluster of one level with its member module ids, largest ΣV first. */
export async function listClusters(dataSource: DataSource, snapshotId: string, level: string) {
  return dataSource.query(`SELECT cluster_id AS id, members, functions, cyclomatic, decisions, internal_weight AS "internalWeight", external_weight AS "externalWeight" FROM cluster WHERE snapshot_id = $1 AND level = $2 ORDER BY cyclomatic DESC, cluster_id`, [snapshotId, level]);
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
