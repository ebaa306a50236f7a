import type { DataSource, EntityManager } from 'typeorm';
import { moduleMembership, severityBand, type FunctionRecord, type Snapshot as AnalyzedSnapshot } from '../analyzer-lib';
import { Snapshot } from '../db/entities';
import { bulkInsert, type BulkColumn } from './bulk-insert';

type FunctionRow = { f: FunctionRecord; ordinal: number; folder: string | null; pkg: string | null; cluster: string | null };

const functionColumns = (snapshotId: string, limit: number): BulkColumn<FunctionRow>[] => [
  { name: 'snapshot_id', type: 'uuid', value: () => snapshotId },
  { name: 'function_id', type: 'text', value: (r) => r.f.id },
  { name: 'ordinal', type: 'integer', value: (r) => r.ordinal },
  { name: 'name', type: 'text', value: (r) => r.f.name },
  { name: 'qualified_name', type: 'text', value: (r) => r.f.qualifiedName },
  { name: 'kind', type: 'text', value: (r) => r.f.kind },
  { name: 'file', type: 'text', value: (r) => r.f.file },
  { name: 'folder', type: 'text', value: (r) => r.folder },
  { name: 'package', type: 'text', value: (r) => r.pkg },
  { name: 'cluster', type: 'text', value: (r) => r.cluster },
  { name: 'line', type: 'integer', value: (r) => r.f.line },
  { name: 'end_line', type: 'integer', value: (r) => r.f.endLine },
  { name: 'loc', type: 'integer', value: (r) => r.f.loc },
  { name: 'cyclomatic', type: 'integer', value: (r) => r.f.cyclomatic },
  { name: 'cyclomatic_strict', type: 'integer', value: (r) => r.f.cyclomaticStrict },
  { name: 'decisions', type: 'integer', value: (r) => r.f.decisions },
  { name: 'nodes', type: 'integer', value: (r) => r.f.nodes },
  { name: 'edges', type: 'integer', value: (r) => r.f.edges },
  { name: 'essential', type: 'integer', value: (r) => r.f.essential },
  { name: 'design_complexity', type: 'integer', value: (r) => r.f.designComplexity },
  { name: 'fingerprint', type: 'text', value: (r) => r.f.fingerprint },
  { name: 'unresolved_calls', type: 'integer', value: (r) => r.f.unresolvedCalls },
  { name: 'external_calls', type: 'integer', value: (r) => r.f.externalCalls },
  { name: 'band', type: 'text', value: (r) => severityBand(r.f.cyclomatic) },
  { name: 'over_limit', type: 'boolean', value: (r) => r.f.cyclomatic > limit },
  ...coverageColumns,
];

const coverageColumns: BulkColumn<FunctionRow>[] = [
  { name: 'outcomes_covered', type: 'integer', value: (r) => r.f.coverage?.outcomesCovered },
  { name: 'outcomes_total', type: 'integer', value: (r) => r.f.coverage?.outcomesTotal },
  { name: 'actual_complexity', type: 'integer', value: (r) => r.f.coverage?.actualComplexity },
  { name: 'untested_paths', type: 'integer', value: (r) => r.f.coverage?.untestedPaths },
  { name: 'crap', type: 'double precision', value: (r) => r.f.coverage?.crap },
];

const detailColumns = (snapshotId: string): BulkColumn<FunctionRow>[] => [
  { name: 'snapshot_id', type: 'uuid', value: () => snapshotId },
  { name: 'function_id', type: 'text', value: (r) => r.f.id },
  { name: 'graph', type: 'jsonb', value: (r) => r.f.graph },
  { name: 'coverage_outcomes', type: 'jsonb', value: (r) => r.f.coverage?.outcomes },
  { name: 'source', type: 'text', value: (r) => r.f.source },
];

/** Where the function sits at the folder and package levels and which file-level cluster holds its file. */
function placeFunctions(snapshot: AnalyzedSnapshot): FunctionRow[] {
  const modules = snapshot.modules ?? [];
  const folderOf = moduleMembership(modules, 'folder');
  const packageOf = moduleMembership(modules, 'package');
  const clusterOfFile = new Map<string, string | null>();
  for (const m of modules) if (m.level === 'file') clusterOfFile.set(m.path, m.cluster);
  return snapshot.functions.map((f, ordinal) => ({
    f,
    ordinal,
    folder: folderOf(f.file) ?? null,
    pkg: packageOf(f.file) ?? null,
    cluster: clusterOfFile.get(f.file) ?? null,
  }));
}

/**
 * Writes an analysed snapshot into its row and the per-snapshot tables in one transaction, so a
 * reader sees all of it or none. Idempotent for a retried job: a snapshot already `ready` is
 * left as it is (the row is locked first, so two workers cannot both write it).
 * Returns false when there was nothing to do.
 */
export async function storeSnapshot(dataSource: DataSource, snapshotId: string, analysed: AnalyzedSnapshot): Promise<boolean> {
  return dataSource.transaction(async (manager) => {
    const [row] = await manager.query(`SELECT status FROM snapshot WHERE id = $1 FOR UPDATE`, [snapshotId]);
    if (!row) throw new Error(`snapshot ${snapshotId} no longer exists`);
    if (row.status === 'ready') return false;
    await writeRows(manager, snapshotId, analysed);
    await manager.getRepository(Snapshot).update(snapshotId, {
      status: 'ready',
      progress: 100,
      phase: null,
      error: null,
      inputFile: null,
      settings: { ...analysed.settings },
      totals: { ...analysed.totals },
      root: analysed.root,
      generatorVersion: analysed.generator.version,
      filesScanned: analysed.files.scanned,
      skipped: analysed.files.skipped,
      mapSettings: analysed.mapSettings ? { ...analysed.mapSettings } : null,
      externals: analysed.externals ?? null,
      coverage: analysed.coverage ? { ...analysed.coverage } : null,
      finishedAt: new Date(),
    });
    return true;
  });
}

async function writeRows(manager: EntityManager, snapshotId: string, s: AnalyzedSnapshot): Promise<void> {
  const id = (): string => snapshotId;
  const placed = placeFunctions(s);
  await bulkInsert(manager, 'function_metric', functionColumns(snapshotId, s.settings.limit), placed);
  await bulkInsert(manager, 'function_detail', detailColumns(snapshotId), placed);
  await bulkInsert(manager, 'module_metric', [
    { name: 'snapshot_id', type: 'uuid', value: id },
    { name: 'module_id', type: 'text', value: (m) => m.id },
    { name: 'level', type: 'text', value: (m) => m.level },
    { name: 'path', type: 'text', value: (m) => m.path },
    { name: 'name', type: 'text', value: (m) => m.name },
    { name: 'functions', type: 'integer', value: (m) => m.functions },
    { name: 'cyclomatic', type: 'integer', value: (m) => m.cyclomatic },
    { name: 'decisions', type: 'integer', value: (m) => m.decisions },
    { name: 'nodes', type: 'integer', value: (m) => m.nodes },
    { name: 'edges', type: 'integer', value: (m) => m.edges },
    { name: 'max_cyclomatic', type: 'integer', value: (m) => m.maxCyclomatic },
    { name: 'over_limit', type: 'integer', value: (m) => m.overLimit },
    { name: 'lines', type: 'integer', value: (m) => m.lines },
    { name: 'fan_in', type: 'integer', value: (m) => m.fanIn },
    { name: 'fan_out', type: 'integer', value: (m) => m.fanOut },
    { name: 'ca', type: 'integer', value: (m) => m.ca },
    { name: 'ce', type: 'integer', value: (m) => m.ce },
    { name: 'instability', type: 'double precision', value: (m) => m.instability },
    { name: 'abstractness', type: 'double precision', value: (m) => m.abstractness },
    { name: 'design_complexity', type: 'integer', value: (m) => m.designComplexity },
    { name: 'integration_complexity', type: 'integer', value: (m) => m.integrationComplexity },
    { name: 'unresolved_calls', type: 'integer', value: (m) => m.unresolvedCalls },
    { name: 'external_calls', type: 'integer', value: (m) => m.externalCalls },
    { name: 'cluster', type: 'text', value: (m) => m.cluster },
    { name: 'gravity', type: 'double precision', value: (m) => m.gravity },
    { name: 'gravity_rank', type: 'integer', value: (m) => m.gravityRank },
    { name: 'reasons', type: 'jsonb', value: (m) => m.reasons },
  ], s.modules ?? []);
  await bulkInsert(manager, 'module_edge', [
    { name: 'snapshot_id', type: 'uuid', value: id },
    { name: 'from_module', type: 'text', value: (e) => e.from },
    { name: 'to_module', type: 'text', value: (e) => e.to },
    { name: 'level', type: 'text', value: (e) => e.level },
    { name: 'weight', type: 'integer', value: (e) => e.weight },
    { name: 'calls', type: 'integer', value: (e) => e.calls },
    { name: 'imports', type: 'integer', value: (e) => e.imports },
  ], s.moduleEdges ?? []);
  await bulkInsert(manager, 'call_edge', [
    { name: 'snapshot_id', type: 'uuid', value: id },
    { name: 'ordinal', type: 'integer', value: (e) => e.ordinal },
    { name: 'from_function', type: 'text', value: (e) => e.edge.from },
    { name: 'to_function', type: 'text', value: (e) => e.edge.to },
    { name: 'count', type: 'integer', value: (e) => e.edge.count },
    { name: 'kind', type: 'text', value: (e) => e.edge.kind },
    { name: 'certain', type: 'boolean', value: (e) => e.edge.certain },
  ], (s.calls ?? []).map((edge, ordinal) => ({ edge, ordinal })));
  await bulkInsert(manager, 'import_edge', [
    { name: 'snapshot_id', type: 'uuid', value: id },
    { name: 'ordinal', type: 'integer', value: (e) => e.ordinal },
    { name: 'from_file', type: 'text', value: (e) => e.edge.from },
    { name: 'to_file', type: 'text', value: (e) => e.edge.to },
  ], (s.imports ?? []).map((edge, ordinal) => ({ edge, ordinal })));
  await bulkInsert(manager, 'cluster', [
    { name: 'snapshot_id', type: 'uuid', value: id },
    { name: 'level', type: 'text', value: (c) => c.level },
    { name: 'cluster_id', type: 'text', value: (c) => c.id },
    { name: 'members', type: 'jsonb', value: (c) => c.members },
    { name: 'functions', type: 'integer', value: (c) => c.functions },
    { name: 'cyclomatic', type: 'integer', value: (c) => c.cyclomatic },
    { name: 'decisions', type: 'integer', value: (c) => c.decisions },
    { name: 'internal_weight', type: 'integer', value: (c) => c.internalWeight },
    { name: 'external_weight', type: 'integer', value: (c) => c.externalWeight },
  ], s.clusters ?? []);
}

/** Replaces a ready snapshot's coverage figures (after a coverage import), in one transaction with the import's own row. */
export async function writeCoverage(manager: EntityManager, snapshotId: string, functions: readonly FunctionRecord[]): Promise<void> {
  const rows = functions.map((f, ordinal) => ({ f, ordinal, folder: null, pkg: null, cluster: null }));
  await manager.query(
    `UPDATE function_metric m SET outcomes_covered = t.oc, outcomes_total = t.ot, actual_complexity = t.ac, untested_paths = t.up, crap = t.crap
       FROM unnest($2::text[], $3::integer[], $4::integer[], $5::integer[], $6::integer[], $7::double precision[]) AS t(id, oc, ot, ac, up, crap)
      WHERE m.snapshot_id = $1 AND m.function_id = t.id`,
    [snapshotId, ...[(r: FunctionRow) => r.f.id, ...coverageColumns.map((c) => c.value)].map((value) => rows.map((r) => value(r) ?? null))],
  );
  await manager.query(
    `UPDATE function_detail d SET coverage_outcomes = t.o::json
       FROM unnest($2::text[], $3::text[]) AS t(id, o)
      WHERE d.snapshot_id = $1 AND d.function_id = t.id`,
    [snapshotId, rows.map((r) => r.f.id), rows.map((r) => (r.f.coverage ? JSON.stringify(r.f.coverage.outcomes) : null))],
  );
}
