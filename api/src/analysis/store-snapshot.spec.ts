import type { DataSource } from 'typeorm';
import type { Snapshot as AnalyzedSnapshot } from '../analyzer-lib';
import { Codebase, Snapshot } from '../db/entities';
import { createTestWorkspace, openTestDataSource } from '../testing/test-database';
import { analyseSmallCodebase, createQueuedSnapshot } from '../testing/test-snapshot';
import { loadSnapshot } from './load-snapshot';
import { storeSnapshot } from './store-snapshot';

describe('storeSnapshot and loadSnapshot', () => {
  let dataSource: DataSource;
  let analysed: AnalyzedSnapshot;
  let workspaceId: string;

  beforeAll(async () => {
    dataSource = await openTestDataSource();
    workspaceId = (await createTestWorkspace(dataSource, ['owner'])).workspace.id;
    analysed = await analyseSmallCodebase();
  });

  afterAll(() => dataSource.destroy());

  it('should give back exactly what the analyzer produced', async () => {
    const { snapshot } = await createQueuedSnapshot(dataSource, workspaceId);
    expect(await storeSnapshot(dataSource, snapshot.id, analysed)).toBe(true);
    const loaded = await loadSnapshot(dataSource, snapshot.id, { graphs: true });
    expect({ ...loaded, createdAt: analysed.createdAt }).toEqual(analysed);
    expect(analysed.modules!.length).toBeGreaterThan(3);
    expect(analysed.calls!.length).toBeGreaterThan(0);
  });

  it('should keep text with backslashes, tabs, line breaks and a literal \\N intact', async () => {
    const { snapshot } = await createQueuedSnapshot(dataSource, workspaceId);
    const tricky = 'const a = "x\\y";\tif (a) {\r\n  return "\\N";\n}';
    const withSource = { ...analysed, functions: analysed.functions.map((f, i) => (i === 0 ? { ...f, source: tricky, qualifiedName: 'odd\\name\t1' } : f)) };
    await storeSnapshot(dataSource, snapshot.id, withSource);
    const loaded = await loadSnapshot(dataSource, snapshot.id, { graphs: true });
    expect(loaded.functions[0].source).toBe(tricky);
    expect(loaded.functions[0].qualifiedName).toBe('odd\\name\t1');
  });

  it('should mark the snapshot ready with its totals, and place functions in folders and clusters', async () => {
    const { snapshot } = await createQueuedSnapshot(dataSource, workspaceId);
    await storeSnapshot(dataSource, snapshot.id, analysed);
    const row = await dataSource.getRepository(Snapshot).findOneByOrFail({ id: snapshot.id });
    expect(row).toMatchObject({ status: 'ready', progress: 100, totals: analysed.totals, filesScanned: analysed.files.scanned });
    const [grade] = await dataSource.query(`SELECT folder, band, over_limit, cluster FROM function_metric WHERE snapshot_id = $1 AND name = 'grade'`, [snapshot.id]);
    expect(grade).toMatchObject({ folder: 'folder:src/orders', band: 'busy', over_limit: true });
    expect(grade.cluster).toMatch(/^c\d+$/);
  });

  it('should store nothing twice when a retried job stores the same snapshot again', async () => {
    const { snapshot } = await createQueuedSnapshot(dataSource, workspaceId);
    await storeSnapshot(dataSource, snapshot.id, analysed);
    expect(await storeSnapshot(dataSource, snapshot.id, analysed)).toBe(false);
    const [{ n }] = await dataSource.query(`SELECT count(*)::int AS n FROM function_metric WHERE snapshot_id = $1`, [snapshot.id]);
    expect(n).toBe(analysed.functions.length);
  });

  it('should leave no rows and the snapshot not ready when the write fails part-way', async () => {
    const { snapshot } = await createQueuedSnapshot(dataSource, workspaceId);
    // A module record the table refuses (null path) after the functions were written.
    const broken = { ...analysed, modules: [...analysed.modules!, { ...analysed.modules![0], id: 'file:zz', path: null as unknown as string }] };
    await expect(storeSnapshot(dataSource, snapshot.id, broken)).rejects.toThrow(/null value/);
    const [{ n }] = await dataSource.query(`SELECT count(*)::int AS n FROM function_metric WHERE snapshot_id = $1`, [snapshot.id]);
    expect(n).toBe(0);
    expect((await dataSource.getRepository(Snapshot).findOneByOrFail({ id: snapshot.id })).status).toBe('queued');
  });

  const BULK_TABLES = ['function_metric', 'function_detail', 'module_metric', 'module_edge', 'call_edge', 'import_edge', 'cluster'];
  const rowsOf = async (snapshotId: string) => {
    const counts: Record<string, number> = {};
    for (const table of BULK_TABLES) {
      counts[table] = (await dataSource.query(`SELECT count(*)::int AS n FROM ${table} WHERE snapshot_id = $1`, [snapshotId]))[0].n;
    }
    return counts;
  };

  it('should remove every row of a snapshot with it, deleted alone or with its codebase, and leave other snapshots whole', async () => {
    const alone = await createQueuedSnapshot(dataSource, workspaceId);
    const withCodebase = await createQueuedSnapshot(dataSource, workspaceId);
    const kept = await createQueuedSnapshot(dataSource, workspaceId);
    for (const { snapshot } of [alone, withCodebase, kept]) await storeSnapshot(dataSource, snapshot.id, analysed);
    const stored = await rowsOf(kept.snapshot.id);
    expect(Object.values(stored).every((n) => n > 0)).toBe(true);

    await dataSource.getRepository(Snapshot).delete(alone.snapshot.id);
    await dataSource.getRepository(Codebase).delete(withCodebase.codebase.id);

    const none = Object.fromEntries(BULK_TABLES.map((table) => [table, 0]));
    expect(await rowsOf(alone.snapshot.id)).toEqual(none);
    expect(await rowsOf(withCodebase.snapshot.id)).toEqual(none);
    expect(await rowsOf(kept.snapshot.id)).toEqual(stored);
  });
});
