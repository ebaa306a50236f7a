import PgBoss from 'pg-boss';

/** Queue names, one per kind of job the workers take. */
export const QUEUES = {
  /** Answered by any live worker; lets health checks and tests prove a worker takes jobs. */
  workerProbe: 'worker-probe',
  /** One uploaded zip or pushed snapshot to analyse and store (data: AnalyseJobData). */
  analyse: 'analyse-snapshot',
} as const;

export interface AnalyseJobData {
  snapshotId: string;
}

/** What the API needs of the queue: hand a snapshot to the workers. */
export interface JobSender {
  enqueueAnalysis(snapshotId: string): Promise<string>;
}

/** The job options an analysis is sent with: retries for crashes, expiry past the job's own time limit. */
export function analyseJobOptions(jobs: { timeoutSeconds: number; retries: number }): PgBoss.SendOptions {
  return { retryLimit: jobs.retries, retryDelay: 1, retryBackoff: false, expireInSeconds: jobs.timeoutSeconds + 120 };
}

/** Sends analysis jobs through pg-boss. */
export function jobSender(boss: PgBoss, jobs: { timeoutSeconds: number; retries: number }): JobSender {
  return {
    async enqueueAnalysis(snapshotId) {
      const id = await boss.send(QUEUES.analyse, { snapshotId } satisfies AnalyseJobData, analyseJobOptions(jobs));
      if (!id) throw new Error(`the job queue did not accept the analysis of snapshot ${snapshotId}`);
      return id;
    },
  };
}

/** What a worker answers to a probe. */
export interface ProbeResult {
  worker: string;
  answeredAt: string;
}

/**
 * Starts a pg-boss client on the application database (schema `pgboss`) and makes sure every
 * queue exists; pg-boss 10 refuses to send to or work on a queue that was not created.
 */
export async function startJobQueue(databaseUrl: string, onError: (err: Error) => void): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString: databaseUrl, max: 4, application_name: 'seamline-queue' });
  boss.on('error', onError);
  await boss.start();
  for (const name of Object.values(QUEUES)) {
    if (!(await boss.getQueue(name))) await boss.createQueue(name, { name, policy: 'standard', retentionMinutes: 60 });
  }
  return boss;
}
