import type { DataSource } from 'typeorm';
import { functionsCsv, importCoverage, toGraphml, toSarif, type ModuleLevel } from '../analyzer-lib';
import { loadSnapshot } from '../analysis/load-snapshot';
import { writeCoverage } from '../analysis/store-snapshot';
import type { Viewer } from '../auth/session-data';
import { CoverageImport, Snapshot } from '../db/entities';
import { BadRequestError } from '../errors';
import { audit } from './audit';

export type ExportFormat = 'json' | 'sarif' | 'csv' | 'graphml';

/** A snapshot as a file: the snapshot JSON, SARIF, the functions as CSV, or the module graph as GraphML. */
export async function exportSnapshot(dataSource: DataSource, snapshot: Snapshot, format: ExportFormat, level: ModuleLevel) {
  const analysed = await loadSnapshot(dataSource, snapshot.id, { graphs: format === 'json' || format === 'sarif' });
  const base = `${snapshot.root ?? 'snapshot'}-${snapshot.id.slice(0, 8)}`;
  switch (format) {
    case 'json': return { type: 'application/json', file: `${base}.json`, body: JSON.stringify(analysed) };
    case 'sarif': return { type: 'application/sarif+json', file: `${base}.sarif`, body: JSON.stringify(toSarif(analysed)) };
    case 'csv': return { type: 'text/csv; charset=utf-8', file: `${base}-functions.csv`, body: [...functionsCsv(analysed)].join('') };
    case 'graphml': return { type: 'application/graphml+xml', file: `${base}-${level}.graphml`, body: toGraphml(analysed, level) };
  }
}

/**
 * Maps a coverage report (lcov or Istanbul JSON) onto a ready snapshot's decisions and replaces
 * its coverage figures (covered outcomes, AC, V − AC, CRAP) and the import's record in one transaction.
 */
export async function importCoverageReport(dataSource: DataSource, viewer: Viewer, snapshot: Snapshot, text: string, fileName: string) {
  if (text.trim() === '') throw new BadRequestError('The coverage report is empty; send an lcov file or Istanbul\'s coverage JSON.');
  const analysed = await loadSnapshot(dataSource, snapshot.id, { graphs: true });
  let covered;
  try {
    covered = importCoverage(analysed, text);
  } catch (err) {
    throw new BadRequestError(`The coverage report could not be read: ${err instanceof Error ? err.message : String(err)}`);
  }
  const matched = covered.functions.filter((f) => f.coverage).length;
  const outcomesCovered = covered.functions.reduce((n, f) => n + (f.coverage?.outcomesCovered ?? 0), 0);
  const outcomesTotal = covered.functions.reduce((n, f) => n + (f.coverage?.outcomesTotal ?? 0), 0);
  const record = await dataSource.transaction(async (m) => {
    await writeCoverage(m, snapshot.id, covered.functions);
    await m.getRepository(Snapshot).update(snapshot.id, { coverage: { ...covered.coverage } });
    const saved = await m.getRepository(CoverageImport).save({
      snapshotId: snapshot.id, format: covered.coverage?.format ?? 'lcov', fileName: fileName.slice(0, 255), uploadedById: viewer.user?.id ?? null,
      matchedFunctions: matched, outcomesCovered, outcomesTotal, unmatchedFiles: covered.coverage?.unmatchedFiles ?? [],
    });
    await audit(m, viewer, 'coverage.import', { type: 'snapshot', id: snapshot.id }, { format: saved.format, matched });
    return saved;
  });
  return {
    id: record.id, format: record.format, fileName: record.fileName, matchedFunctions: matched, outcomesCovered, outcomesTotal,
    unmatchedFiles: record.unmatchedFiles, createdAt: record.createdAt.toISOString(),
  };
}
