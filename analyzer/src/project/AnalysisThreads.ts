/**
 * Analysis threads
 * ================
 * Worker threads that measure files alongside the calling thread, which keeps measuring while
 * the threads load their own TypeScript compilers (half a second to a second each). This module
 * imports no compiler itself. A thread that dies loses only the file it held; the others and
 * the caller go on.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import type { FileJob, FileResult } from './analyseFile';

/** Deep nesting needs more stack than a worker's default (stack.md: the parser and checker recurse). */
const WORKER_STACK_MB = 64;

/** Messages from a worker: it is ready, or here is a file's result. */
export type WorkerMessage = { ready: true } | { result: FileResult };

interface Lane {
  worker: Worker;
  ready: boolean;
  current?: string;
  dead: boolean;
}

/** Threads to use by default: one per core. */
export function defaultThreads(): number {
  return typeof os.availableParallelism === 'function' ? os.availableParallelism() : os.cpus().length;
}

export class AnalysisThreads {
  private readonly lanes: Lane[] = [];
  private onIdle: (lane: Lane) => void = () => {};
  private onFailure: (file: string, reason: string) => void = () => {};

  /** Starts `count` threads (none when the compiled worker is absent, as when running from sources). */
  static start(count: number): AnalysisThreads {
    const threads = new AnalysisThreads();
    const script = path.join(__dirname, 'scanWorker.js');
    if (count > 0 && fs.existsSync(script)) {
      for (let i = 0; i < count; i++) threads.spawn(script);
    }
    return threads;
  }

  /** How many threads were started. */
  get size(): number {
    return this.lanes.length;
  }

  /**
   * Hands out `files` to the threads and to `measureHere` (the calling thread), one file at a
   * time, until all are measured; then stops the threads.
   */
  run(job: FileJob, files: string[], measureHere: (file: string) => FileResult, onResult: (r: FileResult) => void): Promise<void> {
    let next = 0;
    return new Promise((resolve) => {
      let resolved = false;
      const busy = () => this.lanes.some((l) => l.current !== undefined && !l.dead);
      const finishIfDone = () => {
        if (!resolved && next >= files.length && !busy()) {
          resolved = true;
          this.close();
          resolve();
        }
      };
      this.onIdle = (lane) => {
        if (next < files.length) {
          lane.current = files[next++];
          lane.worker.postMessage({ file: lane.current });
        } else finishIfDone();
      };
      this.onFailure = (file, reason) => {
        onResult({ file, skipped: { file, reason: 'analysis-failed', detail: reason } });
        finishIfDone();
      };
      for (const lane of this.lanes) {
        lane.worker.postMessage({ job });
        if (lane.ready && !lane.dead) this.onIdle(lane);
      }
      // The calling thread takes a file, then lets the threads' messages in, and so on.
      const step = () => {
        if (next >= files.length) return finishIfDone();
        onResult(measureHere(files[next++]));
        setImmediate(step);
      };
      step();
      this.receive = (lane, message) => {
        if ('result' in message) {
          lane.current = undefined;
          onResult(message.result);
        }
        this.onIdle(lane);
      };
    });
  }

  /** Stops every thread. */
  close(): void {
    for (const lane of this.lanes) if (!lane.dead) void lane.worker.terminate();
  }

  private receive: (lane: Lane, message: WorkerMessage) => void = (lane, message) => {
    // Before `run`, readiness is only noted.
    if ('ready' in message) lane.ready = true;
  };

  private spawn(script: string): void {
    const worker = new Worker(script, { resourceLimits: { stackSizeMb: WORKER_STACK_MB } });
    const lane: Lane = { worker, ready: false, dead: false };
    worker.unref();
    worker.on('message', (message: WorkerMessage) => {
      if ('ready' in message) lane.ready = true;
      this.receive(lane, message);
    });
    const fail = (reason: string) => {
      if (lane.dead) return;
      lane.dead = true;
      const file = lane.current;
      lane.current = undefined;
      if (file) this.onFailure(file, reason);
    };
    worker.on('error', (err) => fail(err.message));
    worker.on('exit', () => fail('the analysis thread stopped'));
    this.lanes.push(lane);
  }
}
