import 'reflect-metadata';
import { loadConfig } from '../config';
import { createDataSource } from '../db/data-source';
import { jobSender, startJobQueue } from '../jobs/job-queue';
import { createLogger } from '../logger';
import { seedDemoAnalyses } from './seed-demo-analyses';

/** Process entry (npm start, after the workers are up): the demo's snapshots and carve plan. */
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger('seed', config.logLevel);
  const dataSource = await createDataSource(config.databaseUrl).initialize();
  const boss = await startJobQueue(config.databaseUrl, (err) => logger.error({ err }, 'job queue error'));
  try {
    const outcome = await seedDemoAnalyses({ dataSource, config, logger, jobs: jobSender(boss, config.jobs) });
    logger.info({ outcome }, outcome === 'seeded' ? 'demo snapshots analysed and a carve plan made' : 'demo snapshots already present');
  } finally {
    await boss.stop({ graceful: false, wait: true, timeout: 3000 });
    await dataSource.destroy();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
