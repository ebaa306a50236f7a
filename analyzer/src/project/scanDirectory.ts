import * as path from 'node:path';
import { computeTotals } from '../metrics/computeTotals';
import { SNAPSHOT_SCHEMA, type CountingSettings, type FunctionRecord, type SkippedFile, type Snapshot } from '../model';
import { analyseFiles } from './analyseFiles';
import type { AnalysisThreads } from './AnalysisThreads';
import { listSourceFiles } from './listSourceFiles';
import { MAX_LINE_LENGTH } from './classifySource';
import { analyzerVersion } from './analyzerVersion';

export { ScanInputError } from './ScanInputError';

export interface ScanOptions {
  settings: CountingSettings;
  /** A tsconfig to take the file list from (default: `<dir>/tsconfig.json` when present). */
  tsconfig?: string;
  /** Include each function's source text. */
  embedSource?: boolean;
  /** Files with a line longer than this are skipped as minified (default 1,000; 0 turns the check off). */
  maxLineLength?: number;
  /** Threads, this one included (default: as many as the code's size pays for, up to one per core). */
  threads?: number;
  /** Threads the caller started early (see AnalysisThreads); used instead of starting new ones. */
  startedThreads?: AnalysisThreads;
}

export interface ScanProgress {
  phase: 'discover' | 'analyse';
  done: number;
  total: number;
  file?: string;
}

/**
 * Scans a folder into a snapshot: lists the files, measures them in parallel, and sums the
 * totals. Throws ScanInputError when the scan cannot start; problems with single files are
 * reported in `files.skipped` and never stop the scan.
 */
export async function scanDirectory(dir: string, options: ScanOptions, onProgress?: (p: ScanProgress) => void): Promise<Snapshot> {
  const root = path.resolve(dir);
  let listed: ReturnType<typeof listSourceFiles>;
  try {
    listed = listSourceFiles(root, options.tsconfig);
  } catch (err) {
    options.startedThreads?.close();
    throw err;
  }
  onProgress?.({ phase: 'discover', done: listed.files.length, total: listed.files.length });

  const functions: FunctionRecord[] = [];
  const skipped: SkippedFile[] = [...listed.skipped];
  let done = 0;
  let loc = 0;
  const job = { root, settings: options.settings, embedSource: !!options.embedSource, maxLineLength: options.maxLineLength ?? MAX_LINE_LENGTH };
  await analyseFiles(job, listed.files, options.threads, (result) => {
    if ('functions' in result) {
      functions.push(...result.functions);
      loc += result.loc;
    }
    else skipped.push(result.skipped);
    onProgress?.({ phase: 'analyse', done: ++done, total: listed.files.length, file: result.file });
  }, options.startedThreads);

  // Completion order depends on the threads; the snapshot must not.
  functions.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : topLevelFirst(a, b) || a.line - b.line || a.id.localeCompare(b.id)));
  skipped.sort((a, b) => a.file.localeCompare(b.file));
  const listedFiles = new Set(listed.files);
  const analysedFiles = listed.files.length - skipped.filter((s) => listedFiles.has(s.file)).length;
  return {
    schema: SNAPSHOT_SCHEMA,
    generator: { name: 'seamline', version: analyzerVersion() },
    createdAt: new Date().toISOString(),
    root: path.basename(root),
    settings: { ...options.settings },
    files: { scanned: analysedFiles, skipped },
    functions,
    totals: computeTotals(functions, { files: analysedFiles, loc }, options.settings.limit),
  };
}

function topLevelFirst(a: FunctionRecord, b: FunctionRecord): number {
  return (a.kind === 'top-level' ? 0 : 1) - (b.kind === 'top-level' ? 0 : 1);
}
