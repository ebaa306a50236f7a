import * as fs from 'node:fs';
import * as path from 'node:path';
import type { DataSource } from 'typeorm';
import { DEFAULT_SETTINGS, type CountingSettings } from '../analyzer-lib';
import { storeSnapshot } from '../analysis/store-snapshot';
import type { Config } from '../config';
import { Snapshot } from '../db/entities';
import type { Logger } from '../logger';
import { DEFAULT_UPLOAD_LIMITS } from '../uploads/upload-limits';
import { AnalysisFailedError, type AnalysisProgress } from './analysis-request';
import { runAnalysis } from './run-analysis';

export interface AnalysisJobDeps {
  dataSource: DataSource;
  config: Config;
  logger: Logger;
}

/** The queue job as the handler sees it (pg-boss with metadata). */
export interface AnalysisJob {
  id: string;
  data: { snapshotId: string };
  retryCount: number;
  retryLimit: number;
}

/** How often progress reaches the database while a phase runs (phase changes go at once). */
const PROGRESS_EVERY_MS = 400;

/**
 * Takes one snapshot from queued to ready or failed: marks it running, beats its heart so
 * another worker can take over if this one dies, runs the analysis in its own thread, stores the
 * result in one transaction. A crash is thrown back to the queue for a retry while retries
 * remain; bad input and exceeded limits fail the snapshot at once with their reason.
 */
export async function runAnalysisJob(deps: AnalysisJobDeps, job: AnalysisJob): Promise<'stored' | 'failed' | 'skipped'> {
  const { dataSource, config, logger } = deps;
  const snapshots = dataSource.getRepository(Snapshot);
  const snapshotId = job.data.snapshotId;
  const row = await snapshots.findOneBy({ id: snapshotId });
  if (!row || row.status === 'ready' || row.status === 'failed' || !row.inputFile) return 'skipped';

  await snapshots.update(snapshotId, {
    status: 'running', phase: 'start', progress: 0, error: null, jobId: job.id,
    attempts: row.attempts + 1, heartbeatAt: new Date(), startedAt: row.startedAt ?? new Date(),
  });
  const heartbeat = setInterval(() => {
    void dataSource.query(`UPDATE snapshot SET heartbeat_at = now() WHERE id = $1 AND job_id = $2 AND status = 'running'`, [snapshotId, job.id])
      .catch((err: Error) => logger.warn({ err, snapshotId }, 'heartbeat not recorded'));
  }, Math.max(1000, (config.jobs.staleSeconds * 1000) / 3));
  const report = progressReporter(dataSource, snapshotId, job.id);
  const inputFile = row.inputFile;
  try {
    const analysed = await runAnalysis(
      {
        snapshotId,
        source: row.source,
        inputFile,
        workDir: path.join(config.workDir, `${snapshotId}-${job.id.slice(0, 8)}`),
        settings: { ...DEFAULT_SETTINGS, ...(row.settings as Partial<CountingSettings>) },
        uploadLimits: { ...DEFAULT_UPLOAD_LIMITS, maxUploadBytes: config.uploadMaxBytes },
      },
      { timeoutSeconds: config.jobs.timeoutSeconds, memoryMb: config.jobs.memoryMb },
      report,
    );
    report({ phase: 'store', percent: 95 }, true);
    await storeSnapshot(dataSource, snapshotId, analysed);
    await fs.promises.rm(inputFile, { force: true });
    logger.info({ snapshotId, functions: analysed.functions.length, attempt: job.retryCount + 1 }, 'snapshot stored');
    return 'stored';
  } catch (err) {
    const failure = err instanceof AnalysisFailedError ? err.failure : { kind: 'crash' as const, message: err instanceof Error ? err.message : String(err) };
    if (failure.kind === 'crash' && job.retryCount < job.retryLimit) {
      logger.warn({ snapshotId, attempt: job.retryCount + 1, reason: failure.message }, 'analysis crashed; the queue will retry it');
      await snapshots.update({ id: snapshotId, jobId: job.id }, { status: 'queued', phase: 'retrying', error: `Attempt ${job.retryCount + 1} failed (${failure.message}); trying again.` });
      throw err;
    }
    const reason = failure.kind === 'crash' ? `The analysis failed after ${job.retryCount + 1} attempt(s): ${failure.message}` : failure.message;
    await markFailed(dataSource, snapshotId, reason);
    logger.warn({ snapshotId, reason }, 'snapshot failed');
    return 'failed';
  } finally {
    clearInterval(heartbeat);
  }
}

/** Fails a snapshot with its reason and drops its input: nothing of it stays half-done. */
export async function markFailed(dataSource: DataSource, snapshotId: string, reason: string): Promise<void> {
  const row = await dataSource.getRepository(Snapshot).findOneBy({ id: snapshotId });
  if (!row || row.status === 'ready') return;
  await dataSource.getRepository(Snapshot).update(snapshotId, { status: 'failed', phase: null, error: reason, inputFile: null, finishedAt: new Date() });
  if (row.inputFile) await fs.promises.rm(row.inputFile, { force: true });
}

/** Writes progress at most every PROGRESS_EVERY_MS, and at once when the phase changes. */
function progressReporter(dataSource: DataSource, snapshotId: string, jobId: string) {
  let last = { phase: '', percent: -1, at: 0 };
  return (p: AnalysisProgress, force = false): void => {
    const now = Date.now();
    if (!force && p.phase === last.phase && (p.percent === last.percent || now - last.at < PROGRESS_EVERY_MS)) return;
    last = { phase: p.phase, percent: p.percent, at: now };
    void dataSource.query(`UPDATE snapshot SET phase = $3, progress = $4 WHERE id = $1 AND job_id = $2 AND status = 'running'`, [snapshotId, jobId, p.phase, Math.min(99, p.percent)])
      .catch(() => undefined);
  };
}
