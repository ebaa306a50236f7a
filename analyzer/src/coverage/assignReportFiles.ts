/**
 * Assigning a report's files to the scanned files
 * ===============================================
 * Runs `matchCoverageFile` over every file of a report. Report files that match nothing (or
 * match ambiguously) are listed, so the snapshot can say which ones were not used; two
 * report paths landing on one scanned file have their hits added up.
 */
import type { CoverageReport, FileCoverage } from './CoverageReport';
import { createCoverageFileMatcher } from './matchCoverageFile';
import { mergeFileCoverage } from './mergeFileCoverage';

/** Report coverage by scanned file, and the report paths that were not matched. */
export interface AssignedCoverage {
  byFile: Map<string, FileCoverage>;
  unmatchedFiles: string[];
}

/** Matches each file of the report to a scanned file (posix paths relative to the scan root). */
export function assignReportFiles(report: CoverageReport, scannedFiles: readonly string[]): AssignedCoverage {
  const match = createCoverageFileMatcher(scannedFiles);
  const byFile = new Map<string, FileCoverage>();
  const unmatchedFiles: string[] = [];
  for (const [path, coverage] of report.files) {
    const file = match(path);
    if (file === null) {
      unmatchedFiles.push(path);
      continue;
    }
    const earlier = byFile.get(file);
    byFile.set(file, earlier ? mergeFileCoverage(earlier, coverage) : coverage);
  }
  return { byFile, unmatchedFiles };
}
