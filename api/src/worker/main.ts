import 'reflect-metadata';
import * as fs from 'node:fs';
import * as os from 'node:os';
import { loadConfig } from '../config';
import { createDataSource } from '../db/data-source';
import { QUEUES, analyseJobOptions, startJobQueue, type AnalyseJobData, type ProbeResult } from '../jobs/job-queue';
import { createLogger } from '../logger';
import { onShutdown } from '../process/shutdown';
import { lowerPriority } from './priority';
import { runAnalysisJob } from './analysis-job';
import { recoverStaleJobs } from './stale-jobs';

/** Worker process: takes jobs from the PostgreSQL-backed queue. Several may run at once, on several machines. */
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger('worker', config.logLevel);
  // Before any thread starts: analyses run behind the API's readers (see priority.ts).
  const nice = lowerPriority(config.jobs.nice);
  const name = `${os.hostname()}:${process.pid}`;
  fs.mkdirSync(config.workDir, { recursive: true });
  const dataSource = await createDataSource(config.databaseUrl).initialize();
  const boss = await startJobQueue(config.databaseUrl, (err) => logger.error({ err }, 'job queue error'));
  await boss.work<Record<string, never>>(QUEUES.workerProbe, { pollingIntervalSeconds: 1 }, async (): Promise<ProbeResult> => {
    return { worker: name, answeredAt: new Date().toISOString() };
  });
  const deps = { dataSource, config, logger };
  const retry = analyseJobOptions(config.jobs);
  for (let lane = 0; lane < config.jobs.concurrency; lane++) {
    await boss.work<AnalyseJobData>(QUEUES.analyse, { pollingIntervalSeconds: 1, batchSize: 1, includeMetadata: true }, async ([job]) => {
      await runAnalysisJob(deps, { id: job.id, data: job.data, retryCount: job.retryCount, retryLimit: job.retryLimit ?? retry.retryLimit ?? 0 });
    });
  }
  const reaper = setInterval(() => {
    recoverStaleJobs(dataSource, boss, config.jobs.staleSeconds, logger).catch((err: Error) => logger.error({ err }, 'stale job check failed'));
  }, Math.max(2000, (config.jobs.staleSeconds * 1000) / 2));
  logger.info({ worker: name, queues: Object.values(QUEUES), concurrency: config.jobs.concurrency, nice }, 'worker connected to the job queue');
  onShutdown(logger, async () => {
    clearInterval(reaper);
    await boss.stop({ graceful: true, wait: true, timeout: 8000 });
    await dataSource.destroy();
  });
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
