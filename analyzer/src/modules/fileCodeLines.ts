/**
 * Lines of code of a file from its units' records
 * ===============================================
 * The top-level unit's `loc` holds the file's code lines outside every function; each other
 * unit's `loc` holds the code lines of its own line range. The file's code lines are the
 * top-level `loc` plus the code lines of the union of the units' ranges. That union is the
 * union of the outermost ranges; two outermost units can only share the one line where the
 * first ends and the next begins (their characters do not overlap), and that line holds code
 * of both, so it is counted once. The result equals the file's `loc` from analyzeSource.
 */
import type { FunctionRecord } from '../model';

/** Code lines of one file, given all of that file's function records. */
export function fileCodeLines(units: readonly Pick<FunctionRecord, 'kind' | 'line' | 'endLine' | 'loc'>[]): number {
  let lines = 0;
  const ranges = [];
  for (const u of units) {
    if (u.kind === 'top-level') lines += u.loc;
    else ranges.push(u);
  }
  ranges.sort((a, b) => a.line - b.line || b.endLine - a.endLine);
  let coveredUntil = 0;
  for (const u of ranges) {
    if (u.endLine <= coveredUntil) continue; // nested in (or on the last line of) an outer unit
    lines += u.loc - (u.line <= coveredUntil ? 1 : 0);
    coveredUntil = u.endLine;
  }
  return lines;
}
