import { parentPort, workerData } from 'node:worker_threads';
import { analyseInput } from './analyse-input';
import { AnalysisFailedError, type AnalysisRequest } from './analysis-request';

/**
 * Entry of the thread one analysis runs in, so its heap has its own limit and a job over its
 * time can be stopped without stopping the worker process. Posts progress, then the snapshot
 * or the failure.
 */
if (parentPort) {
  const port = parentPort;
  analyseInput(workerData as AnalysisRequest, (progress) => port.postMessage({ type: 'progress', progress }))
    .then((snapshot) => port.postMessage({ type: 'done', snapshot }))
    .catch((err: unknown) => {
      const failure = err instanceof AnalysisFailedError ? err.failure : { kind: 'crash', message: String(err) };
      port.postMessage({ type: 'failed', failure });
    });
}
