import { randomUUID } from 'node:crypto';
import { Client } from 'pg';
import { testDatabaseUrl } from '../testing/test-database';
import { isConcurrentSetupConflict, QUEUES, startJobQueue } from './job-queue';

describe('startJobQueue', () => {
  const schema = `pgboss_race_${randomUUID().slice(0, 8)}`;

  afterAll(async () => {
    const client = new Client({ connectionString: testDatabaseUrl() });
    await client.connect();
    await client.query(`DROP SCHEMA IF EXISTS "${schema}" CASCADE`);
    await client.end();
  });

  it('should let several processes set up the same fresh queue schema at once', async () => {
    const bosses = await Promise.all([1, 2, 3, 4].map(() => startJobQueue(testDatabaseUrl(), () => undefined, schema)));
    for (const name of Object.values(QUEUES)) expect(await bosses[0].getQueue(name)).toBeTruthy();
    await Promise.all(bosses.map((b) => b.stop({ graceful: false, wait: true })));
  }, 60_000);

  it('should retry deadlocks and duplicate keys, and nothing else', () => {
    expect(isConcurrentSetupConflict(Object.assign(new Error('deadlock detected'), { code: '40P01' }))).toBe(true);
    expect(isConcurrentSetupConflict(Object.assign(new Error('duplicate key value'), { code: '23505' }))).toBe(true);
    expect(isConcurrentSetupConflict(new Error('password authentication failed'))).toBe(false);
  });
});
