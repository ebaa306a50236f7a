/**
 * Functions over the limit
 * ========================
 * Lists the functions whose reported V(G) is above the limit. With a baseline (an earlier
 * snapshot counted under the same settings) it lists only what got worse: functions that are new
 * and over the limit, functions that rose above the limit, and functions already above it whose
 * V(G) rose further. A function is matched to the baseline by id; failing that, by fingerprint
 * among the baseline functions whose id disappeared, so a function that moved (renamed file or
 * class) is not reported as new. Sorted by V(G), largest first, then file and line.
 *
 * [Reference]: McCabe 1976, IEEE TSE SE-2(4): 10 is "a reasonable, but not magical, upper limit".
 */
import type { FunctionRecord } from '../model/FunctionRecord';
import type { Snapshot } from '../model/Snapshot';
import { countingDifferences } from './countingDifferences';
import { IncomparableSnapshotsError } from './IncomparableSnapshotsError';

/** Why a function is reported. */
export type BreachReason =
  /** Over the limit (no baseline given). */
  | 'over-limit'
  /** Over the limit and not in the baseline, by id or by fingerprint. */
  | 'new'
  /** At or under the limit in the baseline, over it now. */
  | 'rose-above'
  /** Already over the limit in the baseline, and V(G) grew. */
  | 'rose-further';

/** One reported function. */
export interface Breach {
  function: FunctionRecord;
  reason: BreachReason;
  /** The baseline's V(G) for this function, when it was matched. */
  previousCyclomatic?: number;
  /** The baseline id, when the function was matched by fingerprint after moving. */
  movedFrom?: string;
}

/** What to check a snapshot against. */
export interface BreachOptions {
  /** V(G) above this is a breach. */
  limit: number;
  /** An earlier snapshot: report only new or worsened functions. */
  baseline?: Snapshot;
}

/** The result of a check: the breaches, and how many over-limit functions the baseline already had and kept. */
export interface BreachReport {
  breaches: Breach[];
  /** With a baseline: functions over the limit that are not new and not worse. */
  tolerated: number;
}

function byWorstFirst(a: Breach, b: Breach): number {
  const fa = a.function;
  const fb = b.function;
  return fb.cyclomatic - fa.cyclomatic || (fa.file < fb.file ? -1 : fa.file > fb.file ? 1 : 0) || fa.line - fb.line;
}

function judge(fn: FunctionRecord, before: FunctionRecord | undefined, limit: number): Breach | undefined {
  if (!before) return { function: fn, reason: 'new' };
  if (before.cyclomatic <= limit) return { function: fn, reason: 'rose-above', previousCyclomatic: before.cyclomatic };
  if (fn.cyclomatic > before.cyclomatic) return { function: fn, reason: 'rose-further', previousCyclomatic: before.cyclomatic };
  return undefined;
}

function baselineMatcher(current: Snapshot, baseline: Snapshot): (fn: FunctionRecord) => FunctionRecord | undefined {
  const byId = new Map(baseline.functions.map((fn) => [fn.id, fn]));
  const currentIds = new Set(current.functions.map((fn) => fn.id));
  // Only functions whose id is gone can have moved; each is claimed at most once.
  const goneByFingerprint = new Map<string, FunctionRecord[]>();
  for (const fn of baseline.functions) {
    if (currentIds.has(fn.id)) continue;
    const list = goneByFingerprint.get(fn.fingerprint);
    if (list) list.push(fn);
    else goneByFingerprint.set(fn.fingerprint, [fn]);
  }
  return (fn) => byId.get(fn.id) ?? goneByFingerprint.get(fn.fingerprint)?.shift();
}

/** The functions over the limit (with a baseline: only the new or worsened ones). Throws IncomparableSnapshotsError when the settings differ. */
export function findBreaches(snapshot: Snapshot, options: BreachOptions): BreachReport {
  const { limit, baseline } = options;
  if (!baseline) {
    const over = snapshot.functions.filter((fn) => fn.cyclomatic > limit);
    return { breaches: over.map((fn): Breach => ({ function: fn, reason: 'over-limit' })).sort(byWorstFirst), tolerated: 0 };
  }
  const differences = countingDifferences(baseline.settings, snapshot.settings);
  if (differences.length > 0) throw new IncomparableSnapshotsError(differences);
  const match = baselineMatcher(snapshot, baseline);
  const breaches: Breach[] = [];
  let tolerated = 0;
  // Every function claims its match in snapshot order, not only those over the limit, so which
  // baseline twin pairs with which function does not depend on the limit.
  for (const fn of snapshot.functions) {
    const before = match(fn);
    if (fn.cyclomatic <= limit) continue;
    const breach = judge(fn, before, limit);
    if (!breach) tolerated++;
    else breaches.push(before && before.id !== fn.id ? { ...breach, movedFrom: before.id } : breach);
  }
  return { breaches: breaches.sort(byWorstFirst), tolerated };
}
