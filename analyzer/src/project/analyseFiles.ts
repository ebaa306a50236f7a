import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import { analyseFile, type FileJob, type FileResult } from './analyseFile';

/**
 * Source bytes one extra thread must have to analyse before it pays for itself: each thread
 * loads its own TypeScript compiler (about half a second here), in which time one thread
 * analyses roughly this much code.
 */
export const BYTES_PER_THREAD = 2 * 1024 * 1024;
/** Deep nesting needs more stack than a worker's default (stack.md: the checker and parser recurse). */
const WORKER_STACK_MB = 64;

/**
 * Measures `files` on worker threads (one file at a time per thread, so a big file does not
 * hold up a whole batch), or in this thread when the code is too small for threads to pay off
 * (unless `threads` asks for them), and when running from TypeScript sources (tests). Results arrive in
 * completion order through `onResult`.
 */
export async function analyseFiles(job: FileJob, files: string[], threads: number | undefined, onResult: (r: FileResult) => void): Promise<void> {
  const workerScript = path.join(__dirname, 'scanWorker.js');
  // Threads asked for are used; by default, as many as the code's size pays for, up to one per core.
  const wanted = threads ?? Math.min(defaultThreads(), Math.floor(totalBytes(job.root, files) / BYTES_PER_THREAD));
  const count = Math.max(1, Math.min(wanted, files.length));
  if (count === 1 || !fs.existsSync(workerScript)) {
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

/** Threads to use by default: one per core. */
export function defaultThreads(): number {
  return typeof os.availableParallelism === 'function' ? os.availableParallelism() : os.cpus().length;
}
