import { randomUUID } from 'node:crypto';
import { Pool } from 'pg';
import type { DataSource } from 'typeorm';
import { loadConfig, type Config } from '../config';
import { createDataSource } from '../db/data-source';
import { Membership, User, Workspace, type Role } from '../db/entities';

/** The database `npm test` prepared for api tests (its own cluster, its own port). */
export function testDatabaseUrl(): string {
  const url = process.env['SEAMLINE_TEST_DATABASE_URL'];
  if (!url) {
    throw new Error('SEAMLINE_TEST_DATABASE_URL is not set: run the tests through `npm test`, which starts PostgreSQL for them.');
  }
  return url;
}

/** A connected DataSource on the test database with every migration applied. */
export async function openTestDataSource(): Promise<DataSource> {
  const dataSource = await createDataSource(testDatabaseUrl()).initialize();
  await dataSource.runMigrations({ transaction: 'each' });
  return dataSource;
}

/** A pool for the session table on the test database. */
export function openTestSessionPool(): Pool {
  return new Pool({ connectionString: testDatabaseUrl(), max: 4 });
}

/** A configuration for in-process tests; loopback ports that nothing listens on unless a test starts it. */
export function testConfig(env: Record<string, string> = {}): Config {
  return loadConfig({
    SEAMLINE_ENV: 'test',
    SEAMLINE_DATABASE_URL: testDatabaseUrl(),
    SEAMLINE_SESSION_SECRET: 'test-secret-test-secret-test-secret-0123',
    SEAMLINE_LOG_LEVEL: 'silent',
    SEAMLINE_DATA_DIR: process.env['SEAMLINE_TEST_DATA_DIR'] ?? '.data/test/api',
    ...env,
  });
}

/** A fresh workspace with one member per given role, so tests never see each other's rows. */
export async function createTestWorkspace(dataSource: DataSource, roles: Role[] = ['owner', 'architect', 'reviewer', 'viewer']) {
  const tag = randomUUID().slice(0, 8);
  const workspace = await dataSource.getRepository(Workspace).save({ slug: `test-${tag}`, name: `Test workspace ${tag}` });
  const members: { user: User; role: Role }[] = [];
  for (const role of roles) {
    const user = await dataSource.getRepository(User).save({ email: `${role}-${tag}@test.example`, displayName: `Test ${role} ${tag}` });
    await dataSource.getRepository(Membership).save({ workspaceId: workspace.id, userId: user.id, role });
    members.push({ user, role });
  }
  return { workspace, members };
}
