/**
 * Module deltas
 * =============
 * Sums each side's functions per file and per folder (the module map's own folder rule: the first
 * `folderDepth` folders of the file's path, `.` for files at the root) and
 * gives ΔP, ΔΣV and ΔΣ decisions per module, with whether its largest V(G) crossed the limit.
 * A module present on one side only has zeros on the other. Sorted by level (file first), then path.
 */
import type { FunctionRecord } from '../model';
import { folderOf, PackageLocator } from '../modules/moduleOfFile';
import type { LimitCrossing, ModuleShift, ShiftFigures } from './Shift';

/** Zero figures: a module or codebase with no functions. */
export function emptyFigures(): ShiftFigures {
  return { functions: 0, cyclomatic: 0, cyclomaticStrict: 0, decisions: 0, overLimit: 0, maxCyclomatic: 0 };
}

/** Adds one function to figures counted against `limit`. */
export function addFunction(figures: ShiftFigures, fn: FunctionRecord, limit: number): void {
  figures.functions++;
  figures.cyclomatic += fn.cyclomatic;
  figures.cyclomaticStrict += fn.cyclomaticStrict;
  figures.decisions += fn.decisions;
  if (fn.cyclomatic > limit) figures.overLimit++;
  figures.maxCyclomatic = Math.max(figures.maxCyclomatic, fn.cyclomatic);
}

/** Whether something went over `limit` (up) or came back (down) between two values; absent sides count as within. */
export function crossing(before: number, after: number, limit: number): LimitCrossing {
  const wasOver = before > limit;
  const isOver = after > limit;
  return wasOver === isOver ? null : isOver ? 'up' : 'down';
}

/** Per-module deltas at the file and folder levels (see the file header). */
export function shiftModules(
  before: readonly FunctionRecord[],
  after: readonly FunctionRecord[],
  limit: number,
  folderDepth: number,
  packagesOf: { before: readonly string[]; after: readonly string[] } = { before: [], after: [] },
): ModuleShift[] {
  const modules = new Map<string, ModuleShift>();
  const locators = { before: new PackageLocator(packagesOf.before), after: new PackageLocator(packagesOf.after) };
  const add = (side: 'before' | 'after', fn: FunctionRecord) => {
    const folder = folderOf(fn.file, folderDepth, locators[side].packageOf(fn.file));
    for (const [level, path] of [['file', fn.file], ['folder', folder]] as const) {
      const id = `${level}:${path}`;
      let m = modules.get(id);
      if (m === undefined) {
        m = { level, id, path, before: emptyFigures(), after: emptyFigures(), deltaFunctions: 0, deltaCyclomatic: 0, deltaDecisions: 0, crossed: null };
        modules.set(id, m);
      }
      addFunction(m[side], fn, limit);
    }
  };
  for (const fn of before) add('before', fn);
  for (const fn of after) add('after', fn);
  const list = [...modules.values()];
  for (const m of list) {
    m.deltaFunctions = m.after.functions - m.before.functions;
    m.deltaCyclomatic = m.after.cyclomatic - m.before.cyclomatic;
    m.deltaDecisions = m.after.decisions - m.before.decisions;
    m.crossed = crossing(m.before.maxCyclomatic, m.after.maxCyclomatic, limit);
  }
  return list.sort((a, b) => (a.level === b.level ? (a.path < b.path ? -1 : a.path > b.path ? 1 : 0) : a.level === 'file' ? -1 : 1));
}
