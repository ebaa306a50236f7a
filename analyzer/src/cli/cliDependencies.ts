/**
 * What the CLI calls into
 * =======================
 * The scan, the coverage import and the clock, gathered so tests can replace them. Both are
 * loaded on first use, so `--help`, `--version` and `check` start without loading the compiler.
 * The coverage importer lives in analyzer/src/coverage/ and may be missing from a build, in which
 * case `--coverage` fails with a clear message instead of the whole CLI.
 */
import type { ScanOptions, ScanProgress } from '../project/scanDirectory';
import type { Snapshot } from '../model/Snapshot';
import { preloadCompiler } from '../startup/compilerCodeCache';

/** The parts of the analyzer the CLI uses. */
export interface CliDependencies {
  scanDirectory(dir: string, options: ScanOptions, onProgress?: (p: ScanProgress) => void): Promise<Snapshot>;
  /** Whether an error thrown by `scanDirectory` is about the user's input (exit 2) rather than a failure (exit 3). */
  isScanInputError(error: unknown): boolean;
  /** Maps a coverage report (lcov or Istanbul JSON text) onto a snapshot's decisions. */
  importCoverage(snapshot: Snapshot, reportText: string): Snapshot;
  /** Milliseconds, for progress throttling. */
  now(): number;
}

/** The coverage importer is not part of this build. */
export class CoverageUnavailableError extends Error {
  override readonly name = 'CoverageUnavailableError';
  constructor() {
    super('analyzer/cli: coverage import is not part of this build of Seamline (analyzer/src/coverage/importCoverage is missing)');
  }
}

type ScanModule = typeof import('../project/scanDirectory');
let scanModule: ScanModule | undefined;

function loadScanModule(): ScanModule {
  if (!scanModule) preloadCompiler();
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  scanModule ??= require('../project/scanDirectory') as ScanModule;
  return scanModule;
}

type ImportCoverage = (snapshot: Snapshot, reportText: string) => Snapshot;

function loadImportCoverage(): ImportCoverage {
  let loaded: { importCoverage?: ImportCoverage };
  try {
    // A runtime require: the module is written in parallel with the CLI and may not exist yet.
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    loaded = require('../coverage/importCoverage') as { importCoverage?: ImportCoverage };
  } catch (error) {
    const missing = (error as NodeJS.ErrnoException).code === 'MODULE_NOT_FOUND' && /importCoverage/.test((error as Error).message);
    if (missing) throw new CoverageUnavailableError();
    throw error;
  }
  if (typeof loaded.importCoverage !== 'function') throw new CoverageUnavailableError();
  return loaded.importCoverage;
}

/** The real analyzer. */
export const DEFAULT_DEPENDENCIES: CliDependencies = {
  scanDirectory: (dir, options, onProgress) => loadScanModule().scanDirectory(dir, options, onProgress),
  // By name: the class may come from another realm under test runners, and only the scanner uses it.
  isScanInputError: (error) => (error as Error | undefined)?.name === 'ScanInputError',
  importCoverage: (snapshot, reportText) => loadImportCoverage()(snapshot, reportText),
  now: () => Date.now(),
};
