/**
 * Shift between two snapshots
 * ===========================
 * What changed from `before` to `after`: each function matched (see matchFunctions.ts) with
 * its status and ΔV(G), Δ decisions; each file and folder with ΔP, ΔΣV, ΔΣ decisions; and the
 * codebase's ΔΣV taken apart. Since every function is one connected component whose strict
 * V = E − N + 2 = decisions + 1, ΣV(strict) = Σ decisions + P, hence
 *   ΔΣV(strict) = ΔΣ decisions + ΔP:
 * the part that comes from changed decisions and the part that comes from functions added or
 * removed (extracting a function adds 1 to ΣV and 0 to the decisions). The reported ΣV differs
 * from the strict one only under `--switch one`; that difference is reported on its own, and
 * whatever the identity does not explain (0 unless a graph and its decision count disagree).
 * Functions and modules crossing the limit use the after snapshot's limit on both sides. Two
 * snapshots counted under different settings are refused with an IncomparableShiftError.
 * Definitions and a worked example: docs/metrics/shift.md.
 *
 * [Reference]: McCabe 1976, IEEE TSE SE-2(4) (v = e − n + 2p, additive over components);
 * Watson & McCabe, NIST SP 500-235 §4.1 (v = π + 1 for binary decisions).
 */
import { countingDifferences } from '../check/countingDifferences';
import { DEFAULT_MAP_SETTINGS, type Snapshot } from '../model';
import { IncomparableShiftError } from './IncomparableShiftError';
import { matchFunctions } from './matchFunctions';
import type { FunctionShift, FunctionShiftStatus, FunctionSide, Shift, ShiftTotals } from './Shift';
import { addFunction, crossing, emptyFigures, shiftModules } from './shiftModules';

/** Throws IncomparableShiftError when the two snapshots were counted under different settings. */
export function assertComparable(before: Snapshot, after: Snapshot): void {
  const differences = countingDifferences(before.settings, after.settings);
  if (differences.length > 0) throw new IncomparableShiftError(differences);
}

/** The shift from `before` to `after` (see the file header). */
export function shiftSnapshots(before: Snapshot, after: Snapshot): Shift {
  assertComparable(before, after);
  const limit = after.settings.limit;
  const folderDepth = after.mapSettings?.folderDepth ?? before.mapSettings?.folderDepth ?? DEFAULT_MAP_SETTINGS.folderDepth;
  const counts: Record<FunctionShiftStatus, number> = { same: 0, changed: 0, added: 0, removed: 0, moved: 0, renamed: 0 };
  const totals: ShiftTotals = {
    before: emptyFigures(),
    after: emptyFigures(),
    deltaFunctions: 0,
    deltaCyclomatic: 0,
    deltaCyclomaticStrict: 0,
    deltaDecisions: 0,
    decisionsFrom: { kept: 0, added: 0, removed: 0 },
    unexplained: 0,
    reportingDelta: 0,
  };

  const functions: FunctionShift[] = matchFunctions(before.functions, after.functions).map(({ status, before: b, after: a }) => {
    counts[status]++;
    if (b) addFunction(totals.before, b, limit);
    if (a) addFunction(totals.after, a, limit);
    const deltaDecisions = (a?.decisions ?? 0) - (b?.decisions ?? 0);
    totals.decisionsFrom[status === 'added' ? 'added' : status === 'removed' ? 'removed' : 'kept'] += deltaDecisions;
    return {
      status,
      before: b && side(b),
      after: a && side(a),
      deltaCyclomatic: (a?.cyclomatic ?? 0) - (b?.cyclomatic ?? 0),
      deltaDecisions,
      crossed: crossing(b?.cyclomatic ?? 0, a?.cyclomatic ?? 0, limit),
    };
  });

  totals.deltaFunctions = totals.after.functions - totals.before.functions;
  totals.deltaCyclomatic = totals.after.cyclomatic - totals.before.cyclomatic;
  totals.deltaCyclomaticStrict = totals.after.cyclomaticStrict - totals.before.cyclomaticStrict;
  totals.deltaDecisions = totals.after.decisions - totals.before.decisions;
  totals.unexplained = totals.deltaCyclomaticStrict - (totals.deltaDecisions + totals.deltaFunctions);
  totals.reportingDelta = totals.deltaCyclomaticStrict - totals.deltaCyclomatic;

  // Each side's folders count from its own packages, as its module map does.
  const packagesOf = (s: Snapshot) => (s.modules ?? []).filter((m) => m.level === 'package').map((m) => m.path);
  const modules = shiftModules(before.functions, after.functions, limit, folderDepth, { before: packagesOf(before), after: packagesOf(after) });
  return {
    limit,
    folderDepth,
    functions,
    modules,
    totals,
    counts,
    crossed: { functions: functions.filter((f) => f.crossed !== null), modules: modules.filter((m) => m.crossed !== null) },
  };
}

function side(fn: Snapshot['functions'][number]): FunctionSide {
  return { id: fn.id, file: fn.file, qualifiedName: fn.qualifiedName, line: fn.line, cyclomatic: fn.cyclomatic, cyclomaticStrict: fn.cyclomaticStrict, decisions: fn.decisions };
}
