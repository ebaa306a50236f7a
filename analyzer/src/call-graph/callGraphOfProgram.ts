/**
 * Call graph of a program
 * =======================
 * Resolves every call of the scanned files of an already built program: indexes the units of
 * each file (same ids as analyzeSource), walks each file once resolving its calls with the type
 * checker, then resolves dispatch through interfaces and abstract members over all classes.
 *
 * Edge cases: a file the checker cannot get through (a stack overflow on very deep or very
 * large code, or any other error) is reported in `failedFiles` and leaves nothing half-counted:
 * its calls are taken only when its whole walk succeeded. A scanned file missing from the
 * program is reported the same way.
 *
 * [Reference]: TypeScript compiler API, `TypeChecker.getResolvedSignature` (common practice).
 */
import * as path from 'node:path';
import type { ts } from '../compiler';
import type { CountingSettings } from '../model';
import { CallGraphCollector, messageOf } from './CallGraphCollector';
import { CallResolver } from './CallResolver';
import { collectFileCalls } from './collectFileCalls';
import type { CallGraphResult } from './buildCallGraph';
import { DispatchIndex } from './DispatchIndex';
import { UnitIndex } from './UnitIndex';

/** The scanned part of a program. */
export interface ScannedFiles {
  /** The scanned folder. */
  root: string;
  /** Posix paths relative to the root. */
  files: string[];
  settings: CountingSettings;
  /** Program file names (posix, absolute) that could not be parsed, with why (see createProgram). */
  unreadable?: ReadonlyMap<string, string>;
}

/** The call graph of `scan.files`, resolved with `program`'s type checker. */
export function callGraphOfProgram(program: ts.Program, scan: ScannedFiles): CallGraphResult {
  const checker = program.getTypeChecker();
  const root = toPosix(path.resolve(scan.root));
  const units = new UnitIndex(checker);
  const scanned = new Map<ts.SourceFile, string>();
  const unitIds = new Map<string, string[]>();
  const failedFiles: CallGraphResult['failedFiles'] = [];

  for (const file of scan.files) {
    const fileName = `${root}/${file}`;
    const sourceFile = program.getSourceFile(fileName);
    if (!sourceFile) {
      const why = scan.unreadable?.get(fileName) ?? 'the file is not in the program';
      failedFiles.push({ file, detail: `analyzer/call-graph: parsing failed: ${why}` });
      continue;
    }
    try {
      unitIds.set(file, units.addFile(sourceFile, file, scan.settings).map((u) => u.unit.id));
      scanned.set(sourceFile, file);
    } catch (err) {
      failedFiles.push({ file, detail: `analyzer/call-graph: finding units failed: ${messageOf(err)}` });
    }
  }

  const resolver = new CallResolver(program, checker, units, scanned, root);
  const dispatch = new DispatchIndex(checker, units);
  const collector = new CallGraphCollector();
  for (const [sourceFile, file] of scanned) {
    try {
      const calls = collectFileCalls(sourceFile, file, units, resolver);
      collector.addFile(file, unitIds.get(file)!, calls);
      for (const owner of calls.owners) dispatch.addOwner(owner);
    } catch (err) {
      failedFiles.push({ file, detail: `analyzer/call-graph: resolving calls failed: ${messageOf(err)}` });
    }
  }
  failedFiles.push(...collector.resolveDispatch(dispatch, resolver));
  return { ...collector.result(), perFunction: collector.perFunction, failedFiles: failedFiles.sort((a, b) => a.file.localeCompare(b.file)) };
}

function toPosix(p: string): string {
  return p.split(path.sep).join('/');
}
