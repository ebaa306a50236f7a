/**
 * Importing a coverage report into a snapshot
 * ===========================================
 * Reads an lcov or Istanbul JSON report, matches its files to the snapshot's, and gives every
 * function of a matched file its covered outcomes, actual complexity AC, untested paths and
 * CRAP. Functions of files the report does not name get no coverage (not "0 %": unknown); the
 * report's files that match nothing scanned are listed in `coverage.unmatchedFiles`.
 */
import { fromCompactGraph } from '../cfg/compactGraph';
import type { FunctionRecord, Snapshot } from '../model';
import { applyCoverage } from './applyCoverage';
import { assignReportFiles } from './assignReportFiles';
import { parseCoverageReport } from './parseCoverageReport';

/** A copy of `snapshot` with coverage from `reportText`; throws CoverageFormatError on a malformed report. */
export function importCoverage(snapshot: Snapshot, reportText: string): Snapshot {
  const report = parseCoverageReport(reportText);
  const byFileFunctions = new Map<string, FunctionRecord[]>();
  for (const f of snapshot.functions) {
    const list = byFileFunctions.get(f.file) ?? [];
    list.push(f);
    byFileFunctions.set(f.file, list);
  }
  const { byFile, unmatchedFiles } = assignReportFiles(report, [...byFileFunctions.keys()]);
  const functions = snapshot.functions.map((f) => {
    const file = byFile.get(f.file);
    if (!file) return f;
    const nested = byFileFunctions
      .get(f.file)!
      .filter((other) => other !== f && (f.kind === 'top-level' || (other.line >= f.line && other.endLine <= f.endLine)))
      .map((other) => ({ line: other.line, endLine: other.endLine }));
    const coverage = applyCoverage({ graph: fromCompactGraph(f.graph), kind: f.kind, line: f.line, endLine: f.endLine, nested }, file);
    return { ...f, coverage };
  });
  return { ...snapshot, functions, coverage: { format: report.format, unmatchedFiles } };
}
