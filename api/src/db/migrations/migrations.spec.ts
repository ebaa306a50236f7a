import type { DataSource } from 'typeorm';
import { openTestDataSource } from '../../testing/test-database';

describe('migrations', () => {
  let dataSource: DataSource;

  beforeAll(async () => {
    dataSource = await openTestDataSource();
  });

  afterAll(() => dataSource.destroy());

  it('should leave nothing for the entities to change (the schema matches the code)', async () => {
    const pending = await dataSource.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]);
  });

  it('should have applied every migration exactly once', async () => {
    const rows: { name: string }[] = await dataSource.query('SELECT name FROM typeorm_migrations ORDER BY id');
    expect(rows.map((r) => r.name)).toEqual(dataSource.migrations.map((m) => m.name));
  });
});
