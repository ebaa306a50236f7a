import * as path from 'node:path';
import { computeTotals } from '../metrics/computeTotals';
import { DEFAULT_MAP_SETTINGS, SNAPSHOT_SCHEMA, type CountingSettings, type FunctionRecord, type MapSettings, type SkippedFile, type Snapshot } from '../model';
import { mapInThread } from './mapInThread';
import { analyseFiles } from './analyseFiles';
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
  /** Resolve calls and build the module map, clusters and gravity (default true; `--no-calls` turns it off). */
  calls?: boolean;
  /** Folder depth, Louvain resolution and seed of the module map. */
  mapSettings?: Partial<MapSettings>;
}

export interface ScanProgress {
  /** `calls`: the call graph and module map, one step for the whole codebase (done 0 of 1, then 1 of 1). */
  phase: 'discover' | 'analyse' | 'calls';
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
  const listed = listSourceFiles(root, options.tsconfig);
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
  });

  // Completion order depends on the threads; the snapshot must not.
  functions.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : topLevelFirst(a, b) || a.line - b.line || a.id.localeCompare(b.id)));
  const listedFiles = new Set(listed.files);
  const failedFiles = new Set(skipped.filter((s) => listedFiles.has(s.file)).map((s) => s.file));
  const analysedFiles = listed.files.filter((f) => !failedFiles.has(f));
  const snapshot: Snapshot = {
    schema: SNAPSHOT_SCHEMA,
    generator: { name: 'seamline', version: analyzerVersion() },
    createdAt: new Date().toISOString(),
    root: path.basename(root),
    settings: { ...options.settings },
    files: { scanned: analysedFiles.length, skipped },
    functions,
    totals: computeTotals(functions, { files: analysedFiles.length, loc }, options.settings.limit),
  };
  if (options.calls !== false && functions.length > 0) {
    onProgress?.({ phase: 'calls', done: 0, total: 1 });
    const mapSettings = { ...DEFAULT_MAP_SETTINGS, ...options.mapSettings };
    const tsconfig = listed.tsconfig === undefined ? undefined : path.join(root, listed.tsconfig);
    const map = await mapInThread({ root, files: analysedFiles, tsconfig, settings: options.settings, mapSettings }, functions);
    const s0 = map.functions.reduce((sum, f) => sum + (f.designComplexity ?? 1), 0);
    Object.assign(snapshot, {
      functions: map.functions,
      mapSettings: map.mapSettings,
      calls: map.calls,
      imports: map.imports,
      externals: map.externals,
      modules: map.modules,
      moduleEdges: map.moduleEdges,
      clusters: map.clusters,
    });
    snapshot.totals = { ...snapshot.totals, modularity: map.modularity, designComplexity: s0, integrationComplexity: s0 - map.functions.length + 1 };
    for (const failed of map.failedFiles) {
      skipped.push({ file: failed.file, reason: 'analysis-failed', detail: `its calls could not be resolved: ${failed.detail}` });
    }
    onProgress?.({ phase: 'calls', done: 1, total: 1 });
  }
  skipped.sort((a, b) => a.file.localeCompare(b.file));
  return snapshot;
}

function topLevelFirst(a: FunctionRecord, b: FunctionRecord): number {
  return (a.kind === 'top-level' ? 0 : 1) - (b.kind === 'top-level' ? 0 : 1);
}
