// Worker-thread entry: measures the files the pool hands it, one at a time.
import { parentPort, workerData } from 'node:worker_threads';
import { analyseFile, type FileJob } from './analyseFile';

const job = workerData as FileJob;
parentPort!.on('message', (file: string) => {
  parentPort!.postMessage(analyseFile(job, file));
});
