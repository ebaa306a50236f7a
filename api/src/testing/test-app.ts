import type { Express } from 'express';
import type { Pool } from 'pg';
import type { DataSource } from 'typeorm';
import { createApp } from '../app';
import type { Config } from '../config';
import { createLogger } from '../logger';
import { inlineJobs, type InlineJobs } from './inline-jobs';
import { openTestDataSource, openTestSessionPool, testConfig } from './test-database';

/** The real app on the real test database, for supertest. */
export interface TestApp {
  app: Express;
  dataSource: DataSource;
  sessionPool: Pool;
  config: Config;
  /** Jobs the app sent; they run in this process through the real job handler. */
  jobs: InlineJobs;
  close(): Promise<void>;
}

/** Builds the app with test settings; call `close()` in afterAll. */
export async function openTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const config = testConfig(env);
  const dataSource = await openTestDataSource();
  const sessionPool = openTestSessionPool();
  const jobs = inlineJobs(dataSource, config);
  const app = createApp({ config, dataSource, sessionPool, logger: createLogger('api-test', process.env['SEAMLINE_TEST_LOG_LEVEL'] ?? 'silent'), jobs });
  return {
    app,
    dataSource,
    sessionPool,
    config,
    jobs,
    async close() {
      await jobs.settled();
      await sessionPool.end();
      await dataSource.destroy();
    },
  };
}
