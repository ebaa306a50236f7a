import PgBoss from 'pg-boss';

/** Queue names, one per kind of job the workers take. */
export const QUEUES = {
  /** Answered by any live worker; lets health checks and tests prove a worker takes jobs. */
  workerProbe: 'worker-probe',
} as const;

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
