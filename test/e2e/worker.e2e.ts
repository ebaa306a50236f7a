import PgBoss from 'pg-boss';
import { QUEUES, type ProbeResult } from '../../api/src/jobs/job-queue';

describe('the worker process', () => {
  let boss: PgBoss;

  beforeAll(async () => {
    const url = process.env['SEAMLINE_E2E_DATABASE_URL'];
    if (!url) throw new Error('SEAMLINE_E2E_DATABASE_URL is not set: run the tests through `npm test`.');
    boss = new PgBoss({ connectionString: url, max: 2, supervise: false, schedule: false, migrate: false });
    await boss.start();
  });
  afterAll(() => boss?.stop({ graceful: false, wait: true }));

  it('should take a job from the PostgreSQL-backed queue and complete it', async () => {
    const id = await boss.send(QUEUES.workerProbe, {});
    expect(id).toBeTruthy();
    const deadline = Date.now() + 20_000;
    let job = await boss.getJobById<ProbeResult>(QUEUES.workerProbe, id!);
    while (job?.state !== 'completed' && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 250));
      job = await boss.getJobById<ProbeResult>(QUEUES.workerProbe, id!);
    }
    expect(job?.state).toBe('completed');
    expect((job?.output as ProbeResult).worker).toMatch(/:\d+$/);
  });
});
