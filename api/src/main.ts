import 'reflect-metadata';
import type { Server } from 'node:http';
import { Pool } from 'pg';
import { createApp } from './app';
import { loadConfig } from './config';
import { createDataSource } from './db/data-source';
import { jobSender, startJobQueue } from './jobs/job-queue';
import { createLogger } from './logger';
import { onShutdown } from './process/shutdown';

/** API process: the REST API, the SAML service provider and the built web app on one port. */
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger('api', config.logLevel);
  const dataSource = await createDataSource(config.databaseUrl).initialize();
  const sessionPool = new Pool({ connectionString: config.databaseUrl, max: 5 });
  const boss = await startJobQueue(config.databaseUrl, (err) => logger.error({ err }, 'job queue error'));
  const app = createApp({ config, dataSource, sessionPool, logger, jobs: jobSender(boss, config.jobs) });
  const server: Server = app.listen(config.apiPort, config.host, () => {
    logger.info({ url: config.publicUrl }, 'api listening');
  });
  server.on('error', (err) => {
    logger.fatal({ err }, `api could not listen on ${config.host}:${config.apiPort}`);
    process.exit(1);
  });
  onShutdown(logger, async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await boss.stop({ graceful: false, wait: true, timeout: 3000 });
    await sessionPool.end();
    await dataSource.destroy();
  });
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
