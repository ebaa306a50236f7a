import * as fs from 'node:fs';
import * as path from 'node:path';
import { analyseFile, type FileJob, type FileResult } from './analyseFile';
import { AnalysisThreads, defaultThreads } from './AnalysisThreads';

export { defaultThreads } from './AnalysisThreads';

/**
 * Source bytes one extra thread must have to analyse before it pays for itself. Each thread
 * loads its own TypeScript compiler (half a second to a second here), and on two cores the
 * threads compete with the engine's own compiler and collector threads: measured on this
 * machine, a second thread made a 5 MB scan slower, even one started at the very beginning of
 * the process (docs/benchmarks.md).
 */
export const BYTES_PER_THREAD = 16 * 1024 * 1024;

/**
 * Measures `files` in this thread and on worker threads, one file at a time each (so a big
 * file does not hold up a batch). `threads` asks for a number (this one included); by default
 * as many as the code's size pays for, up to one per core. Results arrive through `onResult`.
 */
export async function analyseFiles(job: FileJob, files: string[], threads: number | undefined, onResult: (r: FileResult) => void): Promise<void> {
  const wanted = threads ?? Math.min(defaultThreads(), Math.floor(totalBytes(job.root, files) / BYTES_PER_THREAD));
  const pool = AnalysisThreads.start(Math.max(0, Math.min(wanted, files.length) - 1));
  if (pool.size === 0) {
    for (const file of files) onResult(analyseFile(job, file));
    return;
  }
  await pool.run(job, files, (file) => analyseFile(job, file), onResult);
}

function totalBytes(root: string, files: string[]): number {
  let bytes = 0;
  for (const file of files) {
    try {
      bytes += fs.statSync(path.join(root, file)).size;
    } catch {
      // A file that vanished is reported by its own analysis.
    }
  }
  return bytes;
}
