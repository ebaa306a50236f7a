import * as fs from 'node:fs';
import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import type { Snapshot as AnalyzedSnapshot } from '../analyzer-lib';
import { analyseInput } from './analyse-input';
import { AnalysisFailedError, type AnalysisFailure, type AnalysisProgress, type AnalysisRequest } from './analysis-request';

export interface AnalysisLimits {
  timeoutSeconds: number;
  memoryMb: number;
}

type ThreadMessage =
  | { type: 'progress'; progress: AnalysisProgress }
  | { type: 'done'; snapshot: AnalyzedSnapshot }
  | { type: 'failed'; failure: AnalysisFailure };

/**
 * Runs one analysis in its own thread with a heap limit and a deadline; a job over either fails
 * with that reason (kind `limit`) and the worker process carries on. Running from the TypeScript
 * sources (unit tests) there is no compiled thread script, so it runs in this thread, unlimited.
 */
export function runAnalysis(request: AnalysisRequest, limits: AnalysisLimits, onProgress: (p: AnalysisProgress) => void): Promise<AnalyzedSnapshot> {
  const script = path.join(__dirname, 'analysis-thread.js');
  if (!fs.existsSync(script)) return analyseInput(request, onProgress);
  return new Promise((resolve, reject) => {
    let settled = false;
    const finish = (outcome: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(deadline);
      outcome();
    };
    const worker = new Worker(script, {
      workerData: request,
      resourceLimits: { maxOldGenerationSizeMb: limits.memoryMb, stackSizeMb: 64 },
    });
    const deadline = setTimeout(() => {
      finish(() => reject(limitFailure(`The analysis took longer than its limit of ${formatSeconds(limits.timeoutSeconds)} and was stopped.`)));
      void worker.terminate();
      void fs.promises.rm(request.workDir, { recursive: true, force: true });
    }, limits.timeoutSeconds * 1000);
    worker.on('message', (message: ThreadMessage) => {
      if (message.type === 'progress') onProgress(message.progress);
      else if (message.type === 'done') finish(() => resolve(message.snapshot));
      else finish(() => reject(new AnalysisFailedError(message.failure)));
    });
    worker.on('error', (err: Error & { code?: string }) => {
      const failure = err.code === 'ERR_WORKER_OUT_OF_MEMORY'
        ? limitFailure(`The analysis needed more memory than its limit of ${limits.memoryMb} MB and was stopped.`)
        : new AnalysisFailedError({ kind: 'crash', message: err.message });
      finish(() => reject(failure));
      void fs.promises.rm(request.workDir, { recursive: true, force: true });
    });
    worker.on('exit', (code) => finish(() => reject(new AnalysisFailedError({ kind: 'crash', message: `The analysis thread stopped (exit code ${code}).` }))));
  });
}

function limitFailure(message: string): AnalysisFailedError {
  return new AnalysisFailedError({ kind: 'limit', message });
}

function formatSeconds(s: number): string {
  return s % 60 === 0 ? `${s / 60} min` : `${s} s`;
}
