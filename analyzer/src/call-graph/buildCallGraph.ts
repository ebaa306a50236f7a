/**
 * Building the call graph of a scanned codebase
 * =============================================
 * The entry point: builds one TypeScript program over the scanned files (project/createProgram)
 * and resolves every call in it (callGraphOfProgram). Function ids are those analyzeSource
 * gives, so edges join the snapshot's functions directly.
 *
 * Run it where the stack is large (a worker with `resourceLimits.stackSizeMb`): the type checker
 * recurses deeply on some code; a file where it overflows anyway is reported in `failedFiles`.
 *
 * What counts as what:
 * - `call`: calls, `super(…)` (into the base constructor: no object is created), tagged
 *   templates, bare decorators, JSX components, `f.call(…)`/`f.apply(…)`, and reading or writing
 *   a property through a getter or setter of the scanned code. `new`: `new C(…)`, reaching C's
 *   constructor or, without one, the inherited constructor.
 * - A `new` (or `super()`) of a class of ours with no constructor anywhere in its chain reaches
 *   the scanned code but runs no unit: its call site has no target and it is counted as neither
 *   unresolved nor external.
 * - `reference`: an identifier or property access naming a function unit where its value is
 *   handed on (argument, initializer, `=`, return, object or array element, JSX attribute,
 *   `.bind` receiver). A function written inline is a unit of its own, not a reference.
 * - `certain: false`: one edge per declared implementation of an interface member or abstract
 *   method called through it.
 * - External: declarations outside the scanned files, per package (`typescript-lib` for the
 *   standard library, `@types/x` counted as `x`, other declaration files by their path).
 * - Unresolved: callees of type `any`, computed member calls, calls through function-typed values
 *   of the scanned code (callback parameters), unresolved imports.
 */
import type { CallEdge, CountingSettings, ExternalPackageCalls, ImportEdge } from '../model';
import { createProgram } from '../project/createProgram';
import type { FunctionCalls } from './CallGraphCollector';
import { callGraphOfProgram } from './callGraphOfProgram';

export type { CallSite } from './collectFileCalls';
export type { FunctionCalls } from './CallGraphCollector';
export { STANDARD_LIBRARY } from './externalPackage';

export interface CallGraphInput {
  /** The scanned folder. */
  root: string;
  /** The scanned files: posix paths relative to the root. */
  files: string[];
  /** A tsconfig whose compiler options to use (default: `<root>/tsconfig.json` when present). */
  tsconfig?: string;
  settings: CountingSettings;
}

export interface CallGraphResult {
  /** Merged per (from, to, kind, certain); `count` = call sites. */
  calls: CallEdge[];
  /** File → file, scanned files only, without duplicates. */
  imports: ImportEdge[];
  /** By caller function id: every unit of every file walked without error. */
  perFunction: Map<string, FunctionCalls>;
  /** Calls into code outside the scanned files, per package; most calls first. */
  externals: ExternalPackageCalls[];
  /** Files whose resolution failed (e.g. a stack overflow); contained to each file. */
  failedFiles: { file: string; detail: string }[];
}

/** Resolves every call of the scanned files with the TypeScript type checker. */
export function buildCallGraph(input: CallGraphInput): CallGraphResult {
  const { program, unreadable } = createProgram({ root: input.root, files: input.files, tsconfig: input.tsconfig });
  return callGraphOfProgram(program, { root: input.root, files: input.files, settings: input.settings, unreadable });
}
