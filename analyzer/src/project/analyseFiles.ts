import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import { analyseFile, type FileJob, type FileResult } from './analyseFile';

/** Below this many files, starting threads costs more than it saves. */
const MIN_FILES_FOR_THREADS = 24;
/** Deep nesting needs more stack than a worker's default (stack.md: the checker and parser recurse). */
const WORKER_STACK_MB = 64;

/**
 * Measures `files` on `threads` worker threads (one file at a time per thread, so a big file
 * does not hold up a whole batch), or in this thread for small scans and when running from
 * TypeScript sources (tests). Results arrive in completion order through `onResult`.
 */
export async function analyseFiles(job: FileJob, files: string[], threads: number, onResult: (r: FileResult) => void): Promise<void> {
  const workerScript = path.join(__dirname, 'scanWorker.js');
  const count = Math.max(1, Math.min(threads, files.length));
  if (count === 1 || files.length < MIN_FILES_FOR_THREADS || !fs.existsSync(workerScript)) {
    for (const file of files) onResult(analyseFile(job, file));
    return;
  }
  let next = 0;
  await Promise.all(Array.from({ length: count }, () => runWorker()));

  function runWorker(): Promise<void> {
    return new Promise((resolve) => {
      const worker = new Worker(workerScript, { workerData: job, resourceLimits: { stackSizeMb: WORKER_STACK_MB } });
      let current: string | undefined;
      const feed = () => {
        if (next >= files.length) {
          current = undefined;
          void worker.terminate();
          return;
        }
        current = files[next++];
        worker.postMessage(current);
      };
      worker.on('message', (result: FileResult) => {
        onResult(result);
        feed();
      });
      // A thread that dies (out of memory, say) loses only the file it held; a fresh one goes on.
      worker.on('error', (err) => {
        if (current) onResult({ file: current, skipped: { file: current, reason: 'analysis-failed', detail: err.message } });
        current = undefined;
      });
      worker.on('exit', () => {
        if (current) onResult({ file: current, skipped: { file: current, reason: 'analysis-failed', detail: 'the analysis thread stopped' } });
        if (next < files.length) runWorker().then(resolve);
        else resolve();
      });
      feed();
    });
  }
}

/** Threads to use by default: one per core. */
export function defaultThreads(): number {
  return typeof os.availableParallelism === 'function' ? os.availableParallelism() : os.cpus().length;
}
