// Worker-thread entry for the module map: the type checker recurses deeply on large files,
// so it runs here, with the larger stack its parent gives this thread.
import { parentPort, workerData } from 'node:worker_threads';
import type { FunctionRecord } from '../model';
import { mapCodebase, type MapInput } from './mapCodebase';

const { input, functions } = workerData as { input: MapInput; functions: FunctionRecord[] };
try {
  parentPort!.postMessage({ result: mapCodebase(input, functions) });
} catch (err) {
  parentPort!.postMessage({ error: (err as Error)?.stack ?? String(err) });
}
