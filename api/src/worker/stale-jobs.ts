import type PgBoss from 'pg-boss';
import type { DataSource } from 'typeorm';
import { QUEUES } from '../jobs/job-queue';
import type { Logger } from '../logger';
import { markFailed } from './analysis-job';

/**
 * Hands the job of a snapshot whose worker stopped beating its heart (killed, machine gone) back
 * to the queue: the job is failed in pg-boss, which retries it on any live worker while retries
 * remain; after the last one the snapshot fails with the reason. Any worker may run this; two
 * doing it at once only fail the job once (pg-boss ignores a fail of a job no longer active).
 */
export async function recoverStaleJobs(dataSource: DataSource, boss: PgBoss, staleSeconds: number, logger: Logger): Promise<number> {
  const stale: { id: string; job_id: string }[] = await dataSource.query(
    `SELECT id, job_id FROM snapshot WHERE status = 'running' AND job_id IS NOT NULL AND heartbeat_at < now() - make_interval(secs => $1)`,
    [staleSeconds],
  );
  for (const { id, job_id: jobId } of stale) {
    const reason = `the worker analysing it sent no sign of life for ${staleSeconds} s`;
    await boss.fail(QUEUES.analyse, jobId, { reason });
    const job = await boss.getJobById(QUEUES.analyse, jobId);
    if (job?.state === 'retry' || job?.state === 'created') {
      await dataSource.query(`UPDATE snapshot SET status = 'queued', phase = 'retrying', error = $2 WHERE id = $1 AND status = 'running' AND job_id = $3`, [id, `Retrying: ${reason}.`, jobId]);
      logger.warn({ snapshotId: id, jobId }, 'stale analysis handed back to the queue');
    } else {
      await markFailed(dataSource, id, `The analysis stopped: ${reason}, and no retries were left.`);
      logger.warn({ snapshotId: id, jobId, state: job?.state }, 'stale analysis failed for good');
    }
  }
  return stale.length;
}
