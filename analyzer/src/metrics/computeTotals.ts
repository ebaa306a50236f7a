import type { FunctionRecord, SnapshotTotals } from '../model';

/**
 * Sums over every function. ΣV stands beside Σ decisions and P (the number of functions, each
 * a connected component): ΣV = Σ decisions + P, so splitting code into more functions raises ΣV
 * by one per new function while the decisions stay the same.
 */
export function computeTotals(functions: FunctionRecord[], counts: { files: number; loc: number }, limit: number): SnapshotTotals {
  const totals: SnapshotTotals = { ...counts, functions: functions.length, cyclomatic: 0, cyclomaticStrict: 0, decisions: 0, overLimit: 0 };
  for (const f of functions) {
    totals.cyclomatic += f.cyclomatic;
    totals.cyclomaticStrict += f.cyclomaticStrict;
    totals.decisions += f.decisions;
    if (f.cyclomatic > limit) totals.overLimit++;
  }
  return totals;
}
