import type { DataSource } from 'typeorm';
import { createTestWorkspace, openTestDataSource } from '../testing/test-database';
import { createQueuedSnapshot } from '../testing/test-snapshot';
import { Snapshot, User, Workspace } from './entities';
import { entityRows } from './entity-rows';

describe('entities from plain SQL', () => {
  let dataSource: DataSource;
  beforeAll(async () => {
    dataSource = await openTestDataSource();
  });
  afterAll(() => dataSource.destroy());

  it('should give the same snapshot as a TypeORM find, every column converted alike (dates, JSON, nulls, numbers)', async () => {
    const { workspace } = await createTestWorkspace(dataSource, ['owner']);
    const { snapshot } = await createQueuedSnapshot(dataSource, workspace.id);
    await dataSource.getRepository(Snapshot).update(snapshot.id, {
      status: 'ready', progress: 100, heartbeatAt: new Date('2026-11-30T10:00:00Z'), settings: { limit: 12 },
      totals: { functions: 3, cyclomatic: 9, decisions: 6 }, skipped: [{ file: 'a.min.js', reason: 'minified' }], filesScanned: 4,
    });
    const found = await dataSource.getRepository(Snapshot).findOneByOrFail({ id: snapshot.id });

    const rows = entityRows(dataSource, Snapshot);
    const [row] = await dataSource.query(`SELECT ${rows.select('s')} FROM snapshot s WHERE s.id = $1`, [snapshot.id]);
    const plain = rows.from(row);

    expect(plain).toBeInstanceOf(Snapshot);
    expect(plain).toEqual(found);
    expect(plain.heartbeatAt).toEqual(new Date('2026-11-30T10:00:00Z'));
  });

  it('should read two joined tables apart by their column prefixes', async () => {
    const { workspace, members } = await createTestWorkspace(dataSource, ['architect']);
    const users = entityRows(dataSource, User);
    const workspaces = entityRows(dataSource, Workspace);
    const [row] = await dataSource.query(
      `SELECT ${users.select('u', 'u_')}, ${workspaces.select('w', 'w_')} FROM membership m
         JOIN app_user u ON u.id = m.user_id JOIN workspace w ON w.id = m.workspace_id WHERE m.workspace_id = $1`,
      [workspace.id],
    );

    expect(users.from(row, 'u_')).toEqual(await dataSource.getRepository(User).findOneByOrFail({ id: members[0]!.user.id }));
    expect(workspaces.from(row, 'w_')).toEqual(await dataSource.getRepository(Workspace).findOneByOrFail({ id: workspace.id }));
  });
});
