import * as fs from 'node:fs';
import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import type { FunctionRecord } from '../model';
import { compilerCodeCacheDir } from '../startup/compilerCodeCache';
import type { mapCodebase, MapInput } from './mapCodebase';

/** Stack for the module-map thread: the checker overflows Node's default on very large files (stack.md). */
const MAP_STACK_MB = 256;

/**
 * Runs `mapCodebase` on a thread of its own with a large stack when the analyzer runs compiled
 * (the CLI, the server's workers), and in this thread otherwise (tests from sources).
 */
export function mapInThread(input: MapInput, functions: FunctionRecord[]): Promise<ReturnType<typeof mapCodebase>> {
  const script = path.join(__dirname, 'mapWorker.js');
  if (!fs.existsSync(script)) {
    // Loaded here only: the map's modules (ts-morph, graphology) would slow every scan's start.
    const { mapCodebase: mapHere } = require('./mapCodebase') as typeof import('./mapCodebase');
    return Promise.resolve(mapHere(input, functions));
  }
  return new Promise((resolve, reject) => {
    const workerData = { input, functions, codeCacheDir: compilerCodeCacheDir() };
    const worker = new Worker(script, { workerData, resourceLimits: { stackSizeMb: MAP_STACK_MB } });
    let settled = false;
    worker.once('message', (message: { result?: ReturnType<typeof mapCodebase>; error?: string }) => {
      settled = true;
      if (message.result) resolve(message.result);
      else reject(new Error(`analyzer/map: the module map failed: ${message.error}`));
      void worker.terminate();
    });
    worker.once('error', (err) => {
      settled = true;
      reject(new Error(`analyzer/map: the module map thread failed: ${err.message}`));
    });
    worker.once('exit', (code) => {
      if (!settled) reject(new Error(`analyzer/map: the module map thread stopped (exit ${code})`));
    });
  });
}
