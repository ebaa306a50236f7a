/**
 * A worker killed in the middle of a job does not lose the snapshot: another worker sees the
 * missing heartbeat, the queue retries the job, and the snapshot ends ready. Runs its own two
 * worker processes (the compiled ones `npm test` built) on the api tests' database, where no
 * other worker runs, with a short stale limit so the retry shows within a minute.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import * as path from 'node:path';
import type { DataSource } from 'typeorm';
import { buildDemoZip } from '../../api/src/demo/demo-zip';
import { jobSender, startJobQueue } from '../../api/src/jobs/job-queue';
import { queueSnapshot } from '../../api/src/services/snapshot-intake';
import { Snapshot } from '../../api/src/db/entities';
import { createTestWorkspace, openTestDataSource, testConfig, testDatabaseUrl } from '../../api/src/testing/test-database';

const workerScript = path.join(__dirname, '../../dist/test-server/api/src/worker/main.js');

describe('a worker killed mid-job', () => {
  let dataSource: DataSource;
  const workers: ChildProcess[] = [];
  const config = testConfig({ SEAMLINE_JOB_STALE_SECONDS: '5' });

  const startWorker = () => {
    const child = spawn(process.execPath, [workerScript], {
      env: { ...process.env, SEAMLINE_ENV: 'test', SEAMLINE_DATABASE_URL: testDatabaseUrl(), SEAMLINE_SESSION_SECRET: 'x'.repeat(40),
        SEAMLINE_DATA_DIR: config.dataDir, SEAMLINE_JOB_STALE_SECONDS: '5', SEAMLINE_LOG_LEVEL: 'warn' },
      stdio: 'ignore',
    });
    workers.push(child);
    return child;
  };

  beforeAll(async () => {
    dataSource = await openTestDataSource();
  });
  afterAll(async () => {
    for (const w of workers) w.kill('SIGKILL');
    await dataSource.destroy();
  });

  it('should be retried by another worker and end ready', async () => {
    const { workspace, members } = await createTestWorkspace(dataSource, ['architect']);
    const viewer = { user: members[0].user, workspace, role: 'architect' as const };
    const boss = await startJobQueue(testDatabaseUrl(), () => undefined);
    const zip = path.join(config.dataDir, `retry-${Date.now()}.zip`);
    await buildDemoZip('before', zip);
    const codebase = await dataSource.getRepository('Codebase').save({ workspaceId: workspace.id, name: `retry-${Date.now()}` });
    const first = startWorker();
    const snapshot = await queueSnapshot({ dataSource, config, jobs: jobSender(boss, config.jobs) }, viewer, codebase as never, { file: zip, source: 'upload' });
    await boss.stop({ graceful: false, wait: true });

    const rowOf = () => dataSource.getRepository(Snapshot).findOneByOrFail({ id: snapshot.id });
    const until = async (done: (s: Snapshot) => boolean, ms: number) => {
      const deadline = Date.now() + ms;
      let row = await rowOf();
      while (!done(row) && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 50));
        row = await rowOf();
      }
      return row;
    };
    const running = await until((s) => s.status === 'running', 30_000);
    expect(running.status).toBe('running');
    first.kill('SIGKILL');
    startWorker();
    const started = Date.now();
    const ended = await until((s) => s.status === 'ready' || s.status === 'failed', 60_000);
    expect(ended).toMatchObject({ status: 'ready', attempts: 2 });
    expect(Date.now() - started).toBeLessThan(60_000);
  }, 120_000);
});
