import 'reflect-metadata';
import * as os from 'node:os';
import { loadConfig } from '../config';
import { QUEUES, startJobQueue, type ProbeResult } from '../jobs/job-queue';
import { createLogger } from '../logger';
import { onShutdown } from '../process/shutdown';

/** Worker process: takes jobs from the PostgreSQL-backed queue. Several may run at once. */
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger('worker', config.logLevel);
  const name = `${os.hostname()}:${process.pid}`;
  const boss = await startJobQueue(config.databaseUrl, (err) => logger.error({ err }, 'job queue error'));
  await boss.work<Record<string, never>>(QUEUES.workerProbe, { pollingIntervalSeconds: 1 }, async (): Promise<ProbeResult> => {
    return { worker: name, answeredAt: new Date().toISOString() };
  });
  logger.info({ worker: name, queues: Object.values(QUEUES) }, 'worker connected to the job queue');
  onShutdown(logger, () => boss.stop({ graceful: true, wait: true, timeout: 8000 }));
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
