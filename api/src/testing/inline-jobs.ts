import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { Config } from '../config';
import type { JobSender } from '../jobs/job-queue';
import { createLogger } from '../logger';
import { runAnalysisJob } from '../worker/analysis-job';

/** A JobSender for in-process API tests: each job runs at once in this process, through the real job handler. */
export interface InlineJobs extends JobSender {
  /** Resolves when every job sent so far has ended. */
  settled(): Promise<void>;
  sent: string[];
}

export function inlineJobs(dataSource: DataSource, config: Config): InlineJobs {
  const running: Promise<unknown>[] = [];
  const sent: string[] = [];
  const logger = createLogger('inline-jobs', 'silent');
  return {
    sent,
    async enqueueAnalysis(snapshotId) {
      const id = randomUUID();
      sent.push(snapshotId);
      // After the answer went out, as a queue would.
      running.push(new Promise((resolve) => setImmediate(resolve)).then(() =>
        runAnalysisJob({ dataSource, config, logger }, { id, data: { snapshotId }, retryCount: 0, retryLimit: 0 }).catch(() => undefined)));
      return id;
    },
    async settled() {
      while (running.length) await running.shift();
    },
  };
}
