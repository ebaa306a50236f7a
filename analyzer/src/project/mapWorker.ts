// Worker-thread entry for the module map: the type checker recurses deeply on large files,
// so it runs here, with the larger stack its parent gives this thread.
import { parentPort, workerData } from 'node:worker_threads';
import type { FunctionRecord } from '../model';
import { preloadCompilerInThread } from '../startup/compilerCodeCache';
import type { MapInput } from './mapCodebase';

const { input, functions, codeCacheDir } = workerData as { input: MapInput; functions: FunctionRecord[]; codeCacheDir?: string };
// The compiler through the parent's code cache, before the map's modules import it.
preloadCompilerInThread(codeCacheDir);
const { mapCodebase } = require('./mapCodebase') as typeof import('./mapCodebase');
try {
  parentPort!.postMessage({ result: mapCodebase(input, functions) });
} catch (err) {
  parentPort!.postMessage({ error: (err as Error)?.stack ?? String(err) });
}
