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
 * queue exists; pg-boss 10 refuses to send to or work on a queue that was not created. The API,
 * the workers and the demo seed start at the same moment and may all create the schema and the
 * queues at once; PostgreSQL can then end one of them with a deadlock, which is retried.
 */
export async function startJobQueue(databaseUrl: string, onError: (err: Error) => void, schema = 'pgboss'): Promise<PgBoss> {
  for (let attempt = 1; ; attempt++) {
    const boss = new PgBoss({ connectionString: databaseUrl, schema, max: 4, application_name: 'seamline-queue' });
    boss.on('error', onError);
    try {
      await boss.start();
      for (const name of Object.values(QUEUES)) {
        if (!(await boss.getQueue(name))) await boss.createQueue(name, { name, policy: 'standard', retentionMinutes: 60 });
      }
      return boss;
    } catch (err) {
      await boss.stop({ graceful: false, wait: true }).catch(() => undefined);
      if (attempt >= START_ATTEMPTS || !isConcurrentSetupConflict(err)) throw err;
      await new Promise((resolve) => setTimeout(resolve, 200 * attempt + Math.random() * 300));
    }
  }
}

const START_ATTEMPTS = 6;

/** Deadlocks and unique violations are what two processes creating the same schema or queue run into. */
export function isConcurrentSetupConflict(err: unknown): boolean {
  const code = (err as { code?: string } | null)?.code;
  return code === '40P01' || code === '23505' || /deadlock detected|duplicate key/i.test(err instanceof Error ? err.message : String(err));
}
