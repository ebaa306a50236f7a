import type { DataSource } from 'typeorm';
import {
  SNAPSHOT_SCHEMA, type CallKind, type CompactGraph, type CountingSettings, type FunctionKind, type FunctionRecord,
  type MapSettings, type ModuleLevel, type Snapshot as AnalyzedSnapshot,
} from '../analyzer-lib';
import { Snapshot } from '../db/entities';
import { NotFoundError } from '../errors';

/** Stands in for graphs a computation does not read (carve plans, shift); never shown or exported. */
const GRAPH_NOT_LOADED: CompactGraph = Object.freeze({ entry: 0, exit: 0, blocks: [], edges: [], decisions: [] }) as CompactGraph;

export interface LoadOptions {
  /** Load every function's graph, coverage outcomes and source (exports need them; carve and shift do not). */
  graphs: boolean;
}

/**
 * Rebuilds the analyzer's snapshot document from a ready snapshot's rows, so the analyzer's own
 * functions (exports, carve evaluation, shift) run on exactly what was stored.
 */
export async function loadSnapshot(dataSource: DataSource, snapshotId: string, options: LoadOptions): Promise<AnalyzedSnapshot> {
  const row = await dataSource.getRepository(Snapshot).findOneBy({ id: snapshotId });
  if (!row || row.status !== 'ready') throw new NotFoundError(`Snapshot ${snapshotId} is not ready.`);
  const q = (sql: string) => dataSource.query(sql, [snapshotId]);
  const [functions, details, modules, moduleEdges, calls, imports, clusters] = await Promise.all([
    q(`SELECT * FROM function_metric WHERE snapshot_id = $1 ORDER BY ordinal`),
    options.graphs ? q(`SELECT function_id, graph, coverage_outcomes, source FROM function_detail WHERE snapshot_id = $1`) : Promise.resolve([]),
    q(`SELECT * FROM module_metric WHERE snapshot_id = $1 ORDER BY module_id`),
    q(`SELECT * FROM module_edge WHERE snapshot_id = $1 ORDER BY from_module, to_module`),
    q(`SELECT * FROM call_edge WHERE snapshot_id = $1 ORDER BY ordinal`),
    q(`SELECT * FROM import_edge WHERE snapshot_id = $1 ORDER BY ordinal`),
    q(`SELECT * FROM cluster WHERE snapshot_id = $1 ORDER BY level, cluster_id`),
  ]);
  const detailById = new Map<string, { graph: CompactGraph; coverage_outcomes: [boolean, boolean][] | null; source: string | null }>();
  for (const d of details) detailById.set(d.function_id, d);
  const hasMap = modules.length > 0;
  const snapshot: AnalyzedSnapshot = {
    schema: SNAPSHOT_SCHEMA,
    generator: { name: 'seamline', version: row.generatorVersion ?? 'unknown' },
    createdAt: (row.finishedAt ?? row.createdAt).toISOString(),
    root: row.root ?? '',
    settings: row.settings as unknown as CountingSettings,
    files: { scanned: row.filesScanned ?? 0, skipped: (row.skipped ?? []) as AnalyzedSnapshot['files']['skipped'] },
    functions: functions.map((f: Record<string, never>) => toFunctionRecord(f, detailById.get(f['function_id']))),
    totals: row.totals as unknown as AnalyzedSnapshot['totals'],
  };
  if (row.coverage) snapshot.coverage = row.coverage as unknown as AnalyzedSnapshot['coverage'];
  if (!hasMap) return snapshot;
  snapshot.mapSettings = row.mapSettings as unknown as MapSettings;
  snapshot.calls = calls.map((c: Record<string, never>) => ({ from: c['from_function'], to: c['to_function'], count: c['count'], kind: c['kind'] as CallKind, certain: c['certain'] }));
  snapshot.imports = imports.map((i: Record<string, never>) => ({ from: i['from_file'], to: i['to_file'] }));
  snapshot.externals = (row.externals ?? []) as AnalyzedSnapshot['externals'];
  snapshot.modules = modules.map(toModuleRecord);
  snapshot.moduleEdges = moduleEdges.map((e: Record<string, never>) => ({ level: e['level'] as ModuleLevel, from: e['from_module'], to: e['to_module'], weight: e['weight'], calls: e['calls'], imports: e['imports'] }));
  snapshot.clusters = clusters.map((c: Record<string, never>) => ({
    id: c['cluster_id'], level: c['level'] as ModuleLevel, members: c['members'], functions: c['functions'], cyclomatic: c['cyclomatic'],
    decisions: c['decisions'], internalWeight: c['internal_weight'], externalWeight: c['external_weight'],
  }));
  return snapshot;
}

function toFunctionRecord(f: Record<string, never>, detail?: { graph: CompactGraph; coverage_outcomes: [boolean, boolean][] | null; source: string | null }): FunctionRecord {
  const record: FunctionRecord = {
    id: f['function_id'], name: f['name'], qualifiedName: f['qualified_name'], kind: f['kind'] as FunctionKind, file: f['file'],
    line: f['line'], endLine: f['end_line'], loc: f['loc'], cyclomatic: f['cyclomatic'], cyclomaticStrict: f['cyclomatic_strict'],
    decisions: f['decisions'], nodes: f['nodes'], edges: f['edges'], essential: f['essential'], fingerprint: f['fingerprint'],
    unresolvedCalls: f['unresolved_calls'], externalCalls: f['external_calls'],
    graph: detail?.graph ?? GRAPH_NOT_LOADED,
  };
  if (f['design_complexity'] !== null) record.designComplexity = f['design_complexity'];
  if (detail?.source) record.source = detail.source;
  if (f['outcomes_total'] !== null) {
    record.coverage = {
      outcomesCovered: f['outcomes_covered'], outcomesTotal: f['outcomes_total'], outcomes: detail?.coverage_outcomes ?? [],
      actualComplexity: f['actual_complexity'], untestedPaths: f['untested_paths'], crap: f['crap'],
    };
  }
  return record;
}

function toModuleRecord(m: Record<string, never>) {
  return {
    id: m['module_id'], path: m['path'], level: m['level'] as ModuleLevel, ...(m['name'] !== null ? { name: m['name'] as string } : {}),
    functions: m['functions'], cyclomatic: m['cyclomatic'], decisions: m['decisions'], nodes: m['nodes'], edges: m['edges'],
    maxCyclomatic: m['max_cyclomatic'], overLimit: m['over_limit'], lines: m['lines'], fanIn: m['fan_in'], fanOut: m['fan_out'],
    ca: m['ca'], ce: m['ce'], instability: m['instability'], abstractness: m['abstractness'], designComplexity: m['design_complexity'],
    integrationComplexity: m['integration_complexity'], unresolvedCalls: m['unresolved_calls'], externalCalls: m['external_calls'],
    cluster: m['cluster'], gravity: m['gravity'], gravityRank: m['gravity_rank'], reasons: m['reasons'],
  };
}
