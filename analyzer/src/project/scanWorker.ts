// Worker-thread entry: loads the compiler, says so, then measures the files it is handed.
import { parentPort } from 'node:worker_threads';
import { analyseFile, type FileJob } from './analyseFile';

let job: FileJob | undefined;
parentPort!.on('message', (message: { job: FileJob } | { file: string }) => {
  if ('job' in message) job = message.job;
  else parentPort!.postMessage({ result: analyseFile(job!, message.file) });
});
parentPort!.postMessage({ ready: true });
